import { Link } from "react-router-dom";
import { dataTableColumns } from "@/components/ui/data-table.tsx";
import { formatDateTime } from "@/lib/format-date-time.ts";
import { formatWaiting } from "@/lib/format-date.ts";
import type { QueueRowDto as QueueRow } from "@shared/credentials/credential-shapes.ts";

const column = dataTableColumns<QueueRow>();

/**
 * The queue's columns. Column ids that the server can sort by are its sort keys (typeCode, companyName,
 * submittedAt); the others do not sort, since sorting one page of many would mislead.
 */
export const queueColumns = (reviewHref: (id: number) => string) =>
  column.columns([
    column.accessor("typeName", {
      id: "typeCode",
      header: "Type",
      cell: (info) => (
        <Link
          to={reviewHref(info.row.original.id)}
          className="font-medium text-ink-900 underline underline-offset-2 focus-visible:outline-2 focus-visible:outline-ink-700"
        >
          {info.getValue()}
        </Link>
      ),
    }),
    column.accessor("companyName", { id: "companyName", header: "Company" }),
    column.accessor("holderName", { header: "Holder", enableSorting: false }),
    column.accessor("submittedAt", {
      id: "submittedAt",
      header: "Submitted",
      cell: (info) => formatDateTime(info.getValue()),
    }),
    column.accessor("waitingHours", {
      header: "Waiting",
      enableSorting: false,
      cell: (info) => formatWaiting(info.getValue()),
    }),
  ]);
