import { formatDateTime } from "@/lib/format-date-time.ts";
import type { AuditEventDto as AuditEvent } from "@shared/credentials/credential-shapes.ts";

const actionWords: Record<string, string> = {
  "credential.submitted": "Submitted",
  "credential.verified": "Verified",
  "credential.returned": "Returned",
  "credential.fields_edited": "Fields edited",
  "credential.superseded": "Superseded",
  "credential.lapsed": "Lapsed",
  "document.downloaded": "File downloaded",
  "broker_request.sent": "Renewed certificate asked of the broker",
  "broker_request.reminded": "Broker reminded",
};

const wordsFor = (action: string) =>
  actionWords[action] ?? action.replace(/^[a-z_]+\./, "").replace(/_/g, " ");

const changesOf = (before: unknown, after: unknown): string[] => {
  if (!before || !after || typeof before !== "object" || typeof after !== "object") return [];
  const b = before as Record<string, unknown>;
  const a = after as Record<string, unknown>;
  return Object.keys(a)
    .filter((key) => JSON.stringify(a[key]) !== JSON.stringify(b[key]))
    .map((key) => `${key}: ${JSON.stringify(b[key] ?? null)} → ${JSON.stringify(a[key])}`);
};

/** Every change and download, oldest first; append-only on the server. */
export function AuditTrail({ events }: { events: readonly AuditEvent[] }) {
  return (
    <section aria-labelledby="audit-heading" className="rounded-lg border border-ink-100 bg-white p-4">
      <h2 id="audit-heading" className="text-lg font-semibold text-ink-900">
        Audit trail
      </h2>
      {events.length === 0 ? (
        <p className="mt-2 text-sm text-ink-700">No events yet.</p>
      ) : (
        <ol className="mt-2 divide-y divide-ink-100 text-sm">
          {events.map((event) => {
            const changes = changesOf(event.before, event.after);
            return (
              <li key={event.id} className="py-2">
                <p>
                  <span className="font-semibold text-ink-900">{wordsFor(event.action)}</span>
                  <span className="text-ink-700">
                    {" "}
                    by {event.actorName ?? "the system"} ·{" "}
                    <time dateTime={event.at}>{formatDateTime(event.at)}</time>
                  </span>
                </p>
                {changes.length > 0 && (
                  <ul className="mt-1 space-y-0.5 font-mono text-xs break-all text-ink-700">
                    {changes.slice(0, 12).map((change) => (
                      <li key={change}>{change}</li>
                    ))}
                  </ul>
                )}
              </li>
            );
          })}
        </ol>
      )}
    </section>
  );
}
