import { useRef, useState, type FormEvent } from "react";
import {
  postMessageSchema,
  type WorkOrderMessageDto as WorkOrderMessage,
} from "@shared/work-orders/schemas.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { fieldErrorsOf } from "@/lib/field-errors.ts";
import { formatDateTime } from "@/lib/format-date-time.ts";
import { formatFileSize } from "@/lib/format-file-size.ts";
import { usePostWorkOrderMessage } from "../api/post-work-order-message.ts";
import { DOCUMENT_ACCEPT } from "@shared/credentials/upload-limits.ts";

type MessageThreadProps = {
  workOrderId: number;
  messages: readonly WorkOrderMessage[];
  /** Names each side as the reader knows it. */
  sideNames: { shop: string; service: string };
};

type Attachment = NonNullable<WorkOrderMessage["attachment"]>;

const kindWords = (mime: string) =>
  mime === "application/pdf" ? "PDF" : mime.startsWith("image/") ? "Image" : "File";

/** The file of a message: its picture when the server made one (sized up front), its name, kind and size. */
function AttachmentLink({ attachment }: { attachment: Attachment }) {
  const size = formatFileSize(attachment.sizeBytes);
  return (
    <a
      href={attachment.url}
      className="mt-2 flex max-w-full min-h-11 items-center gap-3 text-sm text-ink-900 underline underline-offset-2"
    >
      {attachment.thumbnail && (
        <img
          src={attachment.thumbnail.url}
          width={attachment.thumbnail.width}
          height={attachment.thumbnail.height}
          alt=""
          loading="lazy"
          className="h-auto max-h-32 w-auto max-w-32 shrink-0 rounded border border-ink-100 bg-white object-contain"
        />
      )}
      <span className="min-w-0 break-words">
        {attachment.name}{" "}
        <span className="text-ink-700 no-underline">
          ({kindWords(attachment.mime)}, {size})
        </span>
      </span>
    </a>
  );
}

/** Append-only: messages are never edited or removed, each stamped with who and when. */
export function MessageThread({ workOrderId, messages, sideNames }: MessageThreadProps) {
  const post = usePostWorkOrderMessage(workOrderId);
  const [invalid, setInvalid] = useState<unknown>(null);
  const [progress, setProgress] = useState<number | null>(null);
  const formRef = useRef<HTMLFormElement>(null);
  const problem = invalid ?? post.error;
  const errors = fieldErrorsOf(problem);

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const parsed = postMessageSchema.safeParse({ body: String(data.get("body") ?? "") });
    if (!parsed.success) return setInvalid(parsed.error);
    setInvalid(null);
    const file = data.get("file");
    post.mutate(
      {
        body: parsed.data.body,
        file: file instanceof File && file.size > 0 ? file : undefined,
        onProgress: setProgress,
      },
      {
        onSuccess: () => formRef.current?.reset(),
        onSettled: () => setProgress(null),
      },
    );
  };

  return (
    <section aria-labelledby="thread" className="space-y-4">
      <h2 id="thread" className="text-lg font-semibold text-ink-900">
        Messages
      </h2>
      {messages.length === 0 ? (
        <p className="text-sm text-ink-700">No messages yet. Everything written here is kept as a record.</p>
      ) : (
        <ol className="space-y-3">
          {messages.map((m) => (
            <li
              key={m.id}
              className={`rounded-lg border border-ink-100 p-3 ${m.side === "shop" ? "bg-white" : "bg-ink-50"}`}
            >
              <p className="text-sm text-ink-700">
                <span className="font-semibold text-ink-900">{m.author.name}</span> ({sideNames[m.side]}) ·{" "}
                <time dateTime={m.createdAt}>{formatDateTime(m.createdAt)}</time>
              </p>
              <p className="mt-1 whitespace-pre-line text-ink-900">{m.body}</p>
              {m.attachment && <AttachmentLink attachment={m.attachment} />}
            </li>
          ))}
        </ol>
      )}
      <form
        ref={formRef}
        noValidate
        onSubmit={submit}
        className="space-y-3 rounded-lg border border-ink-100 bg-white p-4"
        aria-label="Write a message"
      >
        <FormError error={problem} labels={{ body: "Message", file: "Attach a file" }} />
        <div className="space-y-1">
          <label htmlFor="message-body" className="block text-sm font-medium text-ink-900">
            Message
          </label>
          <textarea
            id="message-body"
            name="body"
            rows={3}
            data-field="body"
            aria-invalid={errors.body ? true : undefined}
            className="block w-full rounded-md border border-ink-300 bg-white px-3 py-2 text-base text-ink-900"
          />
        </div>
        <div className="space-y-1">
          <label htmlFor="message-file" className="block text-sm font-medium text-ink-900">
            Attach a file
          </label>
          <input
            id="message-file"
            name="file"
            type="file"
            data-field="file"
            accept={DOCUMENT_ACCEPT}
            aria-describedby="message-file-hint"
            className="block min-h-11 w-full text-sm text-ink-900 file:mr-3 file:min-h-10 file:rounded-md file:border file:border-ink-300 file:bg-white file:px-3 file:text-sm file:font-semibold"
          />
          <p id="message-file-hint" className="text-sm text-ink-700">
            Optional. PDF, PNG or JPEG.
          </p>
        </div>
        {progress !== null && (
          <progress value={progress} max={1} className="w-full" aria-label="Sending the file">
            {Math.round(progress * 100)}%
          </progress>
        )}
        <Button type="submit" pending={post.isPending} pendingLabel="Sending">
          Send message
        </Button>
      </form>
    </section>
  );
}
