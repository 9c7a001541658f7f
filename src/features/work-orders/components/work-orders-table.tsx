import { Link } from "react-router-dom";
import { hrefs } from "@/config/paths.ts";
import { DataTable, dataTableColumns } from "@/components/ui/data-table.tsx";
import { formatDateTime } from "@/lib/format-date-time.ts";
import type { WorkOrderSummaryDto as WorkOrderSummary } from "@shared/work-orders/schemas.ts";
import { WorkOrderStatusBadge } from "./work-order-status-badge.tsx";
import { urgencyWords } from "./work-order-words.ts";

const column = dataTableColumns<WorkOrderSummary>();
const columns = column.columns([
  column.accessor("id", {
    header: "Work order",
    sortFn: "basic",
    cell: (info) => (
      <Link
        to={hrefs.workOrder(info.getValue())}
        className="inline-flex min-h-11 items-center font-semibold text-ink-900 underline underline-offset-2 md:min-h-0"
      >
        No. {info.getValue()}
      </Link>
    ),
  }),
  column.accessor("status", {
    header: "Status",
    sortFn: "text",
    cell: (info) => <WorkOrderStatusBadge status={info.getValue()} />,
  }),
  column.accessor("problem", {
    header: "Problem",
    enableSorting: false,
    cell: (info) => <span className="line-clamp-2 max-w-md">{info.getValue()}</span>,
  }),
  column.accessor((w) => `${w.technicianName} (${w.serviceCompanyName})`, {
    id: "technician",
    header: "Technician",
    sortFn: "text",
  }),
  column.accessor((w) => `${w.shopName}, ${w.siteName}`, {
    id: "site",
    header: "Shop and site",
    sortFn: "text",
  }),
  column.accessor("urgency", {
    header: "Urgency",
    sortFn: "text",
    cell: (info) => urgencyWords[info.getValue()],
  }),
  column.accessor("updatedAt", {
    header: "Last change",
    sortFn: "text",
    cell: (info) => formatDateTime(info.getValue()),
  }),
]);

export function WorkOrdersTable({ workOrders }: { workOrders: WorkOrderSummary[] }) {
  return (
    <DataTable
      caption="Work orders"
      hideCaption
      columns={columns}
      data={workOrders}
      getRowId={(w) => String(w.id)}
      initialSorting={[{ id: "updatedAt", desc: true }]}
    />
  );
}
