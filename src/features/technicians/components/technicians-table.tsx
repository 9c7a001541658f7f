import { Link } from "react-router-dom";
import { wholeMilesFromKm } from "@shared/geo/units.ts";
import {
  technologyLabels,
  type MachineTechnology,
  type TechnicianDto as Technician,
} from "@shared/technicians/schemas.ts";
import { hrefs } from "@/config/paths.ts";
import { DataTable, dataTableColumns } from "@/components/ui/data-table.tsx";
import { formatCents } from "@/lib/format-money.ts";

export const technologyWords = (technologies: readonly string[]): string =>
  technologies.map((t) => technologyLabels[t as MachineTechnology] ?? t).join(", ") || "—";

const column = dataTableColumns<Technician>();
const columns = column.columns([
  column.accessor("name", {
    header: "Name",
    sortFn: "text",
    cell: (info) => (
      <Link
        to={hrefs.technician(info.row.original.id)}
        className="font-medium text-ink-900 underline underline-offset-2 focus-visible:outline-2 focus-visible:outline-ink-700"
      >
        {info.getValue()}
      </Link>
    ),
  }),
  column.accessor((t) => technologyWords(t.technologies), {
    id: "technologies",
    header: "Technologies",
    sortFn: "text",
  }),
  column.accessor("postalCode", { header: "ZIP", sortFn: "text" }),
  column.accessor("serviceRadiusKm", {
    header: "Radius",
    sortFn: "basic",
    cell: (info) => `${wholeMilesFromKm(info.getValue())} miles`,
  }),
  column.accessor("hourlyRateCents", {
    header: "Rates",
    sortFn: "basic",
    cell: (info) => (
      <span className="whitespace-nowrap">
        {formatCents(info.row.original.hourlyRateCents)}/h on site ·{" "}
        {formatCents(info.row.original.travelRateCents)}/h travel
      </span>
    ),
  }),
  column.accessor((t) => (t.hasAccount ? "Has a sign-in" : "No sign-in"), {
    id: "account",
    header: "Account",
    sortFn: "text",
  }),
  column.accessor((t) => (t.active ? "Active" : "Deactivated"), {
    id: "active",
    header: "Active",
    sortFn: "text",
    cell: (info) => (
      <span className="inline-flex items-center gap-1.5">
        <span aria-hidden="true">{info.row.original.active ? "●" : "○"}</span>
        {info.getValue()}
      </span>
    ),
  }),
]);

export function TechniciansTable({ technicians }: { technicians: Technician[] }) {
  return (
    <DataTable
      caption="Technicians"
      hideCaption
      columns={columns}
      data={technicians}
      getRowId={(t) => String(t.id)}
      initialSorting={[{ id: "name", desc: false }]}
    />
  );
}
