import { statusMarks, type StatusMeaning } from "@shared/status/status-marks.ts";
import { StatusMark } from "./status-mark.tsx";

/** Every status a technician's standing page shows: the standing, each requirement line and each card's state. */
export const technicianPageStatuses: readonly StatusMeaning[] = [
  "cleared",
  "lapsing",
  "not_cleared",
  "not_checked",
  "met",
  "unmet",
  "submitted",
  "returned",
  "verified",
  "superseded",
  "lapsed",
];

/** Explains the shapes of the statuses on this page, so nobody has to learn them from colour or guess. */
export function StatusKey({
  statuses,
  title = "What the shapes mean",
}: {
  statuses: readonly StatusMeaning[];
  title?: string;
}) {
  return (
    <details
      className="group rounded-lg border border-ink-100 bg-white px-4 py-2 text-sm"
      data-testid="status-key"
    >
      <summary className="min-h-11 cursor-pointer py-2 font-semibold text-ink-900 md:min-h-0">
        {title}
      </summary>
      <dl className="grid gap-x-4 gap-y-1.5 pb-2 sm:grid-cols-2">
        {statuses.map((s) => (
          <div key={s} className="flex items-start gap-2">
            <dt className="inline-flex shrink-0 items-center gap-1.5 font-medium text-ink-900">
              <StatusMark status={s} className="mt-0.5 size-3.5" />
              {statusMarks[s].word}
            </dt>
            <dd className="text-ink-700">{statusMarks[s].explains}</dd>
          </div>
        ))}
      </dl>
    </details>
  );
}
