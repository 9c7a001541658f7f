import { useMemo } from "react";
import { Link } from "react-router-dom";
import { DataTable, dataTableColumns } from "@/components/ui/data-table.tsx";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { StatusBadge } from "@/components/ui/status-badge.tsx";
import { formatInstantDate } from "@/lib/format-date.ts";
import { OFFICE_LOOK_AHEAD_DAYS, daysUntil } from "@shared/standing/warning-windows.ts";
import type { CredentialDto as Credential } from "@shared/credentials/credential-shapes.ts";

type LapsingTableProps = {
  credentials: Credential[];
  now: Date;
  /** Where a renewal is uploaded for this credential. Keep it stable. */
  renewHref: (credential: Credential) => string;
};

/** What lapses next, soonest first, with the days left in words as well as the date. */
export function LapsingTable({ credentials, now, renewHref }: LapsingTableProps) {
  const columns = useMemo(() => {
    const column = dataTableColumns<Credential>();
    return column.columns([
      column.accessor((c) => c.lapsesAt ?? "", {
        id: "lapsesAt",
        header: "Lapses",
        sortFn: "text",
        cell: (info) => formatInstantDate(info.row.original.lapsesAt),
      }),
      column.accessor((c) => daysUntil(new Date(c.lapsesAt ?? ""), now), {
        id: "standing",
        header: "Status",
        sortFn: "basic",
        cell: (info) => <StatusBadge status="lapsing" daysLeft={info.getValue()} />,
      }),
      column.accessor("typeName", { header: "Type", sortFn: "text" }),
      column.accessor((c) => c.technicianName ?? `${c.companyName} (company)`, {
        id: "holder",
        header: "Holder",
        sortFn: "text",
      }),
      column.display({
        id: "renew",
        header: "Renewal",
        cell: (info) => (
          <Link
            to={renewHref(info.row.original)}
            className="font-medium text-ink-700 underline underline-offset-2"
          >
            Upload the renewal<span className="sr-only"> of {info.row.original.typeName}</span>
          </Link>
        ),
      }),
    ]);
  }, [now, renewHref]);
  return (
    <DataTable
      caption={`What lapses in the next ${OFFICE_LOOK_AHEAD_DAYS} days`}
      hideCaption
      columns={columns}
      data={credentials}
      getRowId={(c) => String(c.id)}
      initialSorting={[{ id: "lapsesAt", desc: false }]}
      empty={<EmptyState title={`Nothing lapses in the next ${OFFICE_LOOK_AHEAD_DAYS} days`} />}
    />
  );
}
