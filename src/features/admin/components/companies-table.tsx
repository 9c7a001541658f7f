import { DataTable, dataTableColumns } from "@/components/ui/data-table.tsx";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { formatDateTime } from "@/lib/format-date-time.ts";
import type { AdminCompany } from "../api/get-companies.ts";

const KIND_WORDS: Record<AdminCompany["kind"], string> = {
  shop: "Shop",
  service: "Service company",
  platform: "Platform",
};

const Count = ({ value }: { value: number }) => (
  <span className="block text-right tabular-nums">{value}</span>
);

const column = dataTableColumns<AdminCompany>();
const columns = column.columns([
  column.accessor("name", { header: "Company", sortFn: "text" }),
  column.accessor((c) => KIND_WORDS[c.kind], { id: "kind", header: "Kind", sortFn: "text" }),
  column.accessor("users", { header: "Users", sortFn: "basic", cell: (i) => <Count value={i.getValue()} /> }),
  column.accessor("technicians", {
    header: "Technicians",
    sortFn: "basic",
    cell: (i) => <Count value={i.getValue()} />,
  }),
  column.accessor("sites", { header: "Sites", sortFn: "basic", cell: (i) => <Count value={i.getValue()} /> }),
  column.accessor("createdAt", {
    header: "Joined",
    sortFn: "text",
    cell: (i) => <time dateTime={i.getValue()}>{formatDateTime(i.getValue())}</time>,
  }),
]);

export function CompaniesTable({ companies }: { companies: AdminCompany[] }) {
  return (
    <DataTable
      caption="Companies"
      hideCaption
      columns={columns}
      data={companies}
      getRowId={(c) => String(c.id)}
      initialSorting={[{ id: "name", desc: false }]}
      empty={<EmptyState title="No companies yet">Companies appear here when they sign up.</EmptyState>}
    />
  );
}
