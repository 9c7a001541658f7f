import { useMemo } from "react";
import { Link } from "react-router-dom";
import { hrefs } from "@/config/paths.ts";
import { Button } from "@/components/ui/button.tsx";
import { DataTable, dataTableColumns } from "@/components/ui/data-table.tsx";
import { StatusBadge } from "@/components/ui/status-badge.tsx";
import { formatInstantDate } from "@/lib/format-date.ts";
import { daysUntil } from "@shared/standing/warning-windows.ts";
import type { RosterEntryDto as RosterEntry } from "@shared/roster/schemas.ts";

/** One line per technician; a company entry contributes all of its technicians. */
export type RosterRow = RosterEntry["technicians"][number] & {
  entryId: number;
  entryKind: RosterEntry["kind"];
  entryName: string;
};

export const rosterRowsOf = (entries: readonly RosterEntry[]): RosterRow[] =>
  entries.flatMap((entry) =>
    entry.technicians.map((t) => ({ ...t, entryId: entry.id, entryKind: entry.kind, entryName: entry.name })),
  );

function RosterStanding({ row }: { row: RosterRow }) {
  if (!row.active) return <span className="text-sm text-ink-700">Deactivated</span>;
  // A standing never worked out is not "awaiting verification": nothing may be waiting for a reviewer.
  if (row.standing === null) return <StatusBadge status="not_checked" />;
  if (row.standing === "lapsing" && row.nextLapse)
    return <StatusBadge status="lapsing" daysLeft={daysUntil(new Date(row.nextLapse), new Date())} />;
  return <StatusBadge status={row.standing === "lapsing" ? "cleared" : row.standing} />;
}

const column = dataTableColumns<RosterRow>();

type RosterTableProps = {
  rows: RosterRow[];
  removingEntryId: number | null;
  onRemove: (entryId: number) => void;
};

export function RosterTable({ rows, removingEntryId, onRemove }: RosterTableProps) {
  const columns = useMemo(
    () =>
      column.columns([
        column.accessor("name", {
          header: "Technician",
          sortFn: "text",
          cell: (info) => (
            <Link
              to={hrefs.directoryTechnician(info.row.original.technicianId)}
              className="font-medium text-ink-900 underline underline-offset-2"
            >
              {info.getValue()}
            </Link>
          ),
        }),
        column.accessor("companyName", {
          header: "Company",
          sortFn: "text",
          cell: (info) => (
            <>
              {info.getValue()}
              {info.row.original.entryKind === "company" && (
                <span className="block text-xs text-ink-700">Whole company on the roster</span>
              )}
            </>
          ),
        }),
        column.accessor((r) => r.standing ?? "", {
          id: "standing",
          header: "Standing",
          sortFn: "text",
          cell: (info) => <RosterStanding row={info.row.original} />,
        }),
        column.accessor((r) => r.nextLapse ?? "", {
          id: "nextLapse",
          header: "Next lapse",
          sortFn: "text",
          cell: (info) => formatInstantDate(info.row.original.nextLapse),
        }),
        column.display({
          id: "remove",
          header: () => <span className="sr-only">Remove</span>,
          cell: (info) => {
            const row = info.row.original;
            const what = row.entryKind === "company" ? row.entryName : row.name;
            return (
              <Button
                variant="danger"
                pending={removingEntryId === row.entryId}
                onClick={() => onRemove(row.entryId)}
                aria-label={`Remove ${what} from the roster`}
              >
                Remove
              </Button>
            );
          },
        }),
      ]),
    [removingEntryId, onRemove],
  );
  return (
    <DataTable
      caption="Roster"
      hideCaption
      columns={columns}
      data={rows}
      getRowId={(r) => `${r.entryId}-${r.technicianId}`}
      initialSorting={[{ id: "name", desc: false }]}
    />
  );
}
