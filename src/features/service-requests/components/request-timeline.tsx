import type { TimelineEventDto } from "@shared/service-requests/schemas.ts";
import { formatDateTime } from "@/lib/format-date-time.ts";

const words: Record<string, string> = {
  sent: "Sent",
  estimate_sent: "Estimate received",
  estimate_revised: "Estimate revised",
  estimate_withdrawn: "Estimate withdrawn",
  passed: "A company passed",
  reminder_sent: "Companies reminded",
  follow_up: "Coordinator follow-up",
  accepted: "Estimate accepted",
  cancelled: "Cancelled",
  expired: "Expired",
};

export function RequestTimeline({ events }: { events: TimelineEventDto[] }) {
  return (
    <ol className="space-y-1 text-sm" aria-label="Timeline">
      {events.map((e) => (
        <li key={e.id}>
          <span className="text-ink-600">{formatDateTime(e.createdAt)}</span> · {words[e.kind] ?? e.kind}
          {e.actor && ` by ${e.actor}`}
          {e.note && `: ${e.note}`}
        </li>
      ))}
    </ol>
  );
}
