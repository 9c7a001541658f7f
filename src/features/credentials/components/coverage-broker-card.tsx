import { useState, type FormEvent } from "react";
import { formatLocalDate } from "@shared/dates/local-time.ts";
import { holderRoleLabels } from "@shared/credentials/broker-schemas.ts";
import { readerTimeZone } from "@shared/standing/lapse-words.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import {
  useRemoveCoverageBroker,
  useRequestBrokerCertificate,
  useSaveBrokerContact,
  type BrokerCoverage,
  type BrokerRequest,
} from "../api/broker-requests.ts";

const zone = readerTimeZone();
const day = (iso: string) => formatLocalDate(iso, zone);

const linkWords: Record<BrokerRequest["linkState"], string> = {
  sent: "Sent, link open",
  used: "Used: certificate received",
  expired: "Expired unused",
};

interface TimelineEntry {
  at: string;
  words: string;
}

/** What happened on a coverage's requests, newest first: each request, its reminders, its arrival or its expiry. */
function timelineOf(requests: readonly BrokerRequest[]): TimelineEntry[] {
  const entries = requests.flatMap((r) => {
    const asker = r.origin === "shop" ? `${r.shopName ?? "A shop"} asked` : "Your office asked";
    const naming = r.shopName
      ? `, naming ${r.shopName} as ${holderRoleLabels[r.holderRole].toLowerCase()}`
      : "";
    return [
      { at: r.createdAt, words: `${asker} ${r.contactName} (${r.agency}) for a certificate${naming}` },
      ...r.reminders.map((m) => ({
        at: m.sentAt,
        words: `Reminder sent to ${r.contactName}, ${m.daysBefore} days before the lapse`,
      })),
      ...(r.usedAt ? [{ at: r.usedAt, words: "The broker uploaded the certificate" }] : []),
      ...(r.linkState === "expired" ? [{ at: r.expiresAt, words: "The link expired unused" }] : []),
    ];
  });
  return entries.sort((a, b) => b.at.localeCompare(a.at));
}

/** One coverage: its broker (own or the company's), the policy on file, sending a link, and its requests' timeline. */
export function CoverageBrokerCard({ row }: { row: BrokerCoverage }) {
  const save = useSaveBrokerContact();
  const remove = useRemoveCoverageBroker();
  const ask = useRequestBrokerCertificate();
  const [editing, setEditing] = useState(false);
  const errors = fieldErrorsOf(save.error);
  const headingId = `coverage-${row.typeCode}`;
  const own = row.broker?.source === "coverage" ? row.broker : null;

  const onSave = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    save.mutate(
      {
        typeCode: row.typeCode,
        agency: String(form.get("agency") ?? ""),
        contactName: String(form.get("contactName") ?? ""),
        email: String(form.get("email") ?? ""),
      },
      { onSuccess: () => setEditing(false) },
    );
  };
  const onAsk = () =>
    ask.mutate(row.coverage ? { credentialId: row.coverage.credentialId } : { typeCode: row.typeCode });

  return (
    <section aria-labelledby={headingId} className="rounded-md border border-ink-100 bg-white p-4">
      <h2 id={headingId} className="text-lg font-semibold text-ink-900">
        {row.coverageName}
      </h2>
      <dl className="mt-2 grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[10rem_1fr]">
        <dt className="font-medium text-ink-700">Broker</dt>
        <dd className="break-words text-ink-900">
          {row.broker
            ? `${row.broker.contactName}, ${row.broker.agency} (${row.broker.email})${own ? "" : " — the company's broker"}`
            : "None recorded"}
        </dd>
        <dt className="font-medium text-ink-700">Policy on file</dt>
        <dd className="text-ink-900">
          {row.coverage
            ? `${row.coverage.state.replace(/_/g, " ")}${row.coverage.lapsesAt ? `, lapses ${day(row.coverage.lapsesAt)}` : ""}`
            : "None yet"}
        </dd>
      </dl>

      <div className="mt-3 flex flex-wrap gap-2">
        <Button variant="secondary" onClick={() => setEditing((v) => !v)} aria-expanded={editing}>
          {own ? "Edit this coverage's broker" : "Record a broker for this coverage"}
        </Button>
        {own && (
          <Button variant="secondary" onClick={() => remove.mutate(row.typeCode)} pending={remove.isPending}>
            Use the company's broker
          </Button>
        )}
        <Button onClick={onAsk} disabled={!row.broker} pending={ask.isPending} pendingLabel="Sending">
          Send the broker a link
        </Button>
      </div>
      <FormError error={ask.error ?? remove.error} />
      {ask.isSuccess && (
        <p role="status" className="mt-2 text-sm text-ink-700">
          Sent to {ask.data.contactName}; the link works once, until {day(ask.data.expiresAt)}.
        </p>
      )}

      {editing && (
        <form onSubmit={onSave} noValidate className="mt-4 grid gap-3 sm:grid-cols-3">
          <div className="sm:col-span-3">
            <FormError
              error={save.error}
              labels={{ agency: "Agency", contactName: "Contact", email: "E-mail" }}
            />
          </div>
          <TextField label="Agency" name="agency" defaultValue={own?.agency} error={errors.agency} />
          <TextField
            label="Contact"
            name="contactName"
            defaultValue={own?.contactName}
            error={errors.contactName}
          />
          <TextField
            label="E-mail"
            name="email"
            type="email"
            defaultValue={own?.email}
            error={errors.email}
          />
          <div className="sm:col-span-3">
            <Button type="submit" pending={save.isPending} pendingLabel="Saving">
              Save this coverage's broker
            </Button>
          </div>
        </form>
      )}

      <h3 className="mt-4 text-sm font-semibold text-ink-900">Requests</h3>
      {row.requests.length === 0 ? (
        <p className="text-sm text-ink-700">No requests sent for this coverage.</p>
      ) : (
        <ul className="mt-1 space-y-1 text-sm text-ink-900">
          {row.requests.map((r) => (
            <li key={r.id}>
              <span className="font-medium">{linkWords[r.linkState]}</span>: sent {day(r.createdAt)} to{" "}
              {r.contactName}
              {r.origin === "shop" ? ` for ${r.shopName ?? "a shop"}` : ""}
              {r.linkState === "sent" ? `, open until ${day(r.expiresAt)}` : ""}
            </li>
          ))}
        </ul>
      )}
      {row.requests.length > 0 && (
        <>
          <h3 className="mt-4 text-sm font-semibold text-ink-900">Timeline</h3>
          <ol className="mt-1 space-y-1 border-l border-ink-100 pl-3 text-sm text-ink-900">
            {timelineOf(row.requests).map((e, i) => (
              <li key={`${e.at}-${i}`}>
                <time dateTime={e.at} className="text-ink-700">
                  {day(e.at)}
                </time>{" "}
                {e.words}
              </li>
            ))}
          </ol>
        </>
      )}
    </section>
  );
}
