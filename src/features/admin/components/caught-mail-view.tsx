import { Fragment } from "react";
import type { CaughtMail } from "@shared/accounts/schemas.ts";
import { formatDateTime } from "@/lib/format-date-time.ts";

const urlPattern = /(https?:\/\/[^\s<>"]+)/g;

/** Plain text with its links clickable, so a set-password link can be followed from here. */
function TextWithLinks({ text }: { text: string }) {
  return (
    <>
      {text.split(urlPattern).map((part, index) =>
        index % 2 === 1 ? (
          <a key={index} href={part} className="break-all text-ink-700 underline underline-offset-2">
            {part}
          </a>
        ) : (
          <Fragment key={index}>{part}</Fragment>
        ),
      )}
    </>
  );
}

export function CaughtMailView({ mail }: { mail: CaughtMail }) {
  return (
    <article
      aria-labelledby={`mail-${mail.id}-subject`}
      className="rounded-lg border border-ink-100 bg-white"
    >
      <header className="border-b border-ink-100 px-4 py-3">
        <h2 id={`mail-${mail.id}-subject`} className="text-lg font-semibold text-ink-900">
          {mail.subject}
        </h2>
        <dl className="mt-2 grid grid-cols-[5rem_1fr] gap-x-3 gap-y-0.5 text-sm">
          <dt className="text-ink-700">From</dt>
          <dd className="break-all">{mail.from}</dd>
          <dt className="text-ink-700">To</dt>
          <dd className="break-all">{mail.to}</dd>
          <dt className="text-ink-700">Received</dt>
          <dd>
            <time dateTime={mail.receivedAt}>{formatDateTime(mail.receivedAt)}</time>
          </dd>
        </dl>
      </header>
      <pre className="overflow-x-auto px-4 py-3 font-sans text-sm whitespace-pre-wrap text-ink-900">
        <TextWithLinks text={mail.text} />
      </pre>
    </article>
  );
}
