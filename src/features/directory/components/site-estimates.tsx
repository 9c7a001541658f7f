import type { SiteEstimateDto as SiteEstimate } from "@shared/directory/directory-shapes.ts";
import { CallOutEstimate } from "./call-out-estimate.tsx";
import { formatMiles } from "@shared/geo/units.ts";
import { formatDriveTime } from "./directory-format.ts";

/** Distance, drive and call-out estimate from the technician's base to each of the buyer's sites. */
export function SiteEstimates({
  estimates,
  onSiteHours,
  chosenSiteId,
}: {
  estimates: readonly SiteEstimate[];
  onSiteHours: number;
  /** The site carried from the directory, listed first and marked. */
  chosenSiteId: number | null;
}) {
  if (estimates.length === 0)
    return <p className="text-sm text-ink-700">Add a site to see distances and estimates.</p>;
  return (
    <ul className="grid gap-3 md:grid-cols-2">
      {[...estimates]
        .sort((a, b) => Number(b.siteId === chosenSiteId) - Number(a.siteId === chosenSiteId))
        .map((e) => (
          <li
            key={e.siteId}
            className={`rounded-lg border bg-white p-4 ${e.siteId === chosenSiteId ? "border-ink-700" : "border-ink-100"}`}
          >
            <p className="font-semibold text-ink-900">
              {e.siteName}
              {e.siteId === chosenSiteId && (
                <span className="ml-2 text-xs font-medium text-ink-700">the site you searched from</span>
              )}
            </p>
            <p className="text-sm text-ink-800">
              {formatMiles(e.distanceKm)} straight line · about {formatDriveTime(e.driveHours)} drive
            </p>
            {!e.withinServiceRadius && (
              <p className="text-sm font-medium text-red-800">Outside this technician's service radius.</p>
            )}
            <CallOutEstimate
              callOut={e.callOut}
              onSiteHours={onSiteHours}
              forWhom={e.siteName}
              siteName={e.siteName}
            />
          </li>
        ))}
    </ul>
  );
}
