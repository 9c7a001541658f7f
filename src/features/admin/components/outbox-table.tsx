import { useMemo } from "react";
import type { CaughtMail } from "@shared/accounts/schemas.ts";
import { DataTable, dataTableColumns } from "@/components/ui/data-table.tsx";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { formatDateTime } from "@/lib/format-date-time.ts";

type OutboxTableProps = { mail: CaughtMail[]; openId: number | null; onOpen: (id: number) => void };

const column = dataTableColumns<CaughtMail>();

export function OutboxTable({ mail, openId, onOpen }: OutboxTableProps) {
  const columns = useMemo(
    () =>
      column.columns([
        column.accessor("subject", {
          header: "Subject",
          sortFn: "text",
          cell: (info) => (
            <button
              type="button"
              aria-expanded={openId === info.row.original.id}
              onClick={() => onOpen(info.row.original.id)}
              className="text-left font-medium text-ink-700 underline underline-offset-2 hover:text-ink-900 focus-visible:outline-2 focus-visible:outline-ink-700"
            >
              {info.getValue()}
            </button>
          ),
        }),
        column.accessor("to", { header: "To", sortFn: "text" }),
        column.accessor("receivedAt", {
          header: "Received",
          sortFn: "text",
          cell: (info) => <time dateTime={info.getValue()}>{formatDateTime(info.getValue())}</time>,
        }),
      ]),
    [openId, onOpen],
  );

  return (
    <DataTable
      caption="Caught mail"
      hideCaption
      columns={columns}
      data={mail}
      getRowId={(m) => String(m.id)}
      // ISO 8601 instants sort correctly as text; newest first.
      initialSorting={[{ id: "receivedAt", desc: true }]}
      isRowSelected={(m) => m.id === openId}
      empty={
        <EmptyState title="No mail caught yet">Mail the app sends in development lands here.</EmptyState>
      }
    />
  );
}
