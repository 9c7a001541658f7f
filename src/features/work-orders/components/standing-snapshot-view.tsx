import { StatusBadge } from "@/components/ui/status-badge.tsx";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { formatDateTime } from "@/lib/format-date-time.ts";
import { formatInstantDate } from "@/lib/format-date.ts";
import { standingProofUrl } from "../api/work-order-keys.ts";
import type { StandingSnapshot } from "@shared/work-orders/standing-snapshot.ts";

type StandingSnapshotViewProps = {
  workOrderId: number;
  at: "accepted" | "completed";
  snapshot: StandingSnapshot;
};

const requirementBadge = (status: "met" | "lapsing" | "unmet") => <StatusBadge status={status} />;

/** The technician's standing as it was when the work order was accepted or completed, kept whatever changed since. */
export function StandingSnapshotView({ workOrderId, at, snapshot }: StandingSnapshotViewProps) {
  const title = at === "accepted" ? "Standing when accepted" : "Standing when completed";
  return (
    <section aria-label={title} className="space-y-3 rounded-lg border border-ink-100 bg-white p-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <div>
          <h3 className="font-semibold text-ink-900">{title}</h3>
          <p className="text-sm text-ink-700">Taken {formatDateTime(snapshot.takenAt)}</p>
        </div>
        <a
          href={standingProofUrl(workOrderId, at)}
          target="_blank"
          rel="noopener"
          className={buttonStyles("secondary")}
          aria-label={`Print proof of standing (${at === "accepted" ? "when accepted" : "when completed"})`}
        >
          Print proof of standing
        </a>
      </div>
      {snapshot.targets.map((target) => (
        <div key={target.requirementSetId ?? "baseline"} className="space-y-1">
          <p className="flex flex-wrap items-center gap-2 text-sm font-semibold text-ink-900">
            {target.name}
            <StatusBadge status={target.standing} />
          </p>
          <ul className="divide-y divide-ink-100 text-sm">
            {target.requirements.map((r, i) => (
              <li key={i} className="grid gap-1 py-2 sm:grid-cols-[minmax(0,14rem)_auto_1fr] sm:gap-3">
                <span className="font-medium text-ink-900">{r.label}</span>
                <span>{requirementBadge(r.status)}</span>
                <span className="text-ink-800">
                  {r.metBy && r.status !== "unmet"
                    ? `Met by ${r.metBy}, ${r.credential?.lapsesAt ? `lapses ${formatInstantDate(r.credential.lapsesAt)}` : "does not lapse"}`
                    : r.credential
                      ? `${r.credential.typeName}${r.credential.reference ? ` ${r.credential.reference}` : ""}, ${r.credential.lapsesAt ? `lapses ${formatInstantDate(r.credential.lapsesAt)}` : "does not lapse"}`
                      : r.detail}
                </span>
              </li>
            ))}
          </ul>
        </div>
      ))}
    </section>
  );
}
