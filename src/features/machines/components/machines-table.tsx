import { Link } from "react-router-dom";
import { technologyLabels } from "@shared/technicians/schemas.ts";
import { machineStateLabels } from "@shared/machines/machine-states.ts";
import { hrefs } from "@/config/paths.ts";
import { DataTable, dataTableColumns } from "@/components/ui/data-table.tsx";
import type { MachineDto as Machine } from "@shared/sites/schemas.ts";

const column = dataTableColumns<Machine>();
const columns = column.columns([
  column.accessor((m) => `${m.builder} ${m.model}`, {
    id: "machine",
    header: "Machine",
    sortFn: "text",
    cell: (info) => (
      <Link
        to={hrefs.machine(info.row.original.id)}
        className="inline-flex min-h-11 items-center font-semibold text-ink-900 underline underline-offset-2 md:min-h-0"
      >
        {info.getValue()}
      </Link>
    ),
  }),
  column.accessor((m) => m.serialNumber ?? "", { id: "serial", header: "Serial", sortFn: "text" }),
  column.accessor("siteName", { header: "Site", sortFn: "text" }),
  column.accessor((m) => [m.building, m.bay].filter(Boolean).join(", "), {
    id: "location",
    header: "Building, bay",
    sortFn: "text",
  }),
  column.accessor((m) => technologyLabels[m.technology], {
    id: "technology",
    header: "Technology",
    sortFn: "text",
  }),
  column.accessor((m) => machineStateLabels[m.state ?? "running"], {
    id: "state",
    header: "State",
    sortFn: "text",
  }),
]);

/** The shop's machines across its sites; each opens its own page with the service history. */
export function MachinesTable({ machines }: { machines: Machine[] }) {
  return (
    <DataTable
      caption="Machines"
      hideCaption
      columns={columns}
      data={machines}
      getRowId={(m) => String(m.id)}
      initialSorting={[{ id: "machine", desc: false }]}
    />
  );
}
