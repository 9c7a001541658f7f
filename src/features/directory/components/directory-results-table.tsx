import { useMemo } from "react";
import { DataTable, dataTableColumns } from "@/components/ui/data-table.tsx";
import type {
  DirectoryRowDto as DirectoryRow,
  JudgedAgainstDto as JudgedAgainst,
} from "@shared/directory/directory-shapes.ts";
import { CallOutEstimate } from "./call-out-estimate.tsx";
import { DirectoryStandingBadge } from "./directory-standing-badge.tsx";
import { DistanceText, RatesText, TechnicianLink } from "./directory-row-parts.tsx";
import { RatingSummary } from "./rating-summary.tsx";
import { RequirementsMetLine } from "./requirements-met-line.tsx";

const column = dataTableColumns<DirectoryRow>();

/** Wide screens: one dense row per technician, in the server's order (the sort lives in the URL). */
export function DirectoryResultsTable({
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
  const columns = useMemo(
    () =>
      column.columns([
        column.accessor("name", {
          header: "Technician",
          enableSorting: false,
          cell: (info) => (
            <>
              <TechnicianLink row={info.row.original} />
              <span className="block text-ink-700">{info.row.original.companyName}</span>
            </>
          ),
        }),
        column.accessor("standing", {
          header: "Standing",
          enableSorting: false,
          cell: (info) => (
            <div className="max-w-xs space-y-1">
              <DirectoryStandingBadge
                standing={info.getValue()}
                earliestLapse={info.row.original.earliestLapse}
                judgedAgainst={judgedAgainst}
              />
              <RequirementsMetLine row={info.row.original} />
            </div>
          ),
        }),
        column.accessor("distanceKm", {
          header: "Distance",
          enableSorting: false,
          cell: (info) => <DistanceText row={info.row.original} />,
        }),
        column.accessor((r) => r.callOut?.totalCents ?? null, {
          id: "callOut",
          header: "Service call",
          enableSorting: false,
          cell: (info) =>
            info.row.original.callOut ? (
              <CallOutEstimate
                callOut={info.row.original.callOut}
                onSiteHours={onSiteHours}
                forWhom={info.row.original.name}
                siteName={siteName}
              />
            ) : (
              <span className="text-sm text-ink-700">Choose a site</span>
            ),
        }),
        column.accessor((r) => r.rating.score, {
          id: "rating",
          header: "Rating",
          enableSorting: false,
          cell: (info) => <RatingSummary rating={info.row.original.rating} />,
        }),
        column.accessor("hourlyRateCents", {
          header: "Rates",
          enableSorting: false,
          cell: (info) => <RatesText row={info.row.original} />,
        }),
      ]),
    [onSiteHours, siteName, judgedAgainst],
  );
  return (
    <DataTable
      caption="Cleared technicians"
      hideCaption
      columns={columns}
      data={rows}
      getRowId={(r) => String(r.technicianId)}
    />
  );
}
