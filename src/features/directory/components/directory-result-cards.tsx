import type {
  DirectoryRowDto as DirectoryRow,
  JudgedAgainstDto as JudgedAgainst,
} from "@shared/directory/directory-shapes.ts";
import { CallOutEstimate } from "./call-out-estimate.tsx";
import { DirectoryStandingBadge } from "./directory-standing-badge.tsx";
import { DistanceText, RatesText, TechnicianLink } from "./directory-row-parts.tsx";
import { RatingSummary } from "./rating-summary.tsx";
import { RequirementsMetLine } from "./requirements-met-line.tsx";

/** Phone widths: one card per technician, with targets large enough for a thumb. */
export function DirectoryResultCards({
  rows,
  onSiteHours,
  siteName = null,
  judgedAgainst,
}: {
  rows: DirectoryRow[];
  onSiteHours: number;
  siteName?: string | null;
  judgedAgainst?: JudgedAgainst | undefined;
}) {
  return (
    <ul className="space-y-3" aria-label="Cleared technicians">
      {rows.map((row) => (
        <li key={row.technicianId} className="space-y-2 rounded-lg border border-ink-100 bg-white p-4">
          <div className="flex flex-wrap items-start justify-between gap-2">
            <div>
              <TechnicianLink row={row} />
              <span className="block text-sm text-ink-700">{row.companyName}</span>
            </div>
            <DirectoryStandingBadge
              standing={row.standing}
              earliestLapse={row.earliestLapse}
              judgedAgainst={judgedAgainst}
            />
          </div>
          <div className="grid grid-cols-2 gap-3">
            <DistanceText row={row} />
            <RatingSummary rating={row.rating} />
            {row.callOut && (
              <CallOutEstimate
                callOut={row.callOut}
                onSiteHours={onSiteHours}
                forWhom={row.name}
                siteName={siteName}
              />
            )}
            <RatesText row={row} />
          </div>
          <RequirementsMetLine row={row} />
        </li>
      ))}
    </ul>
  );
}
