import { useMemo } from "react";
import { Button } from "@/components/ui/button.tsx";
import { DataTable, dataTableColumns } from "@/components/ui/data-table.tsx";
import type { CredentialTypeDto as CredentialType } from "@shared/credentials/credential-shapes.ts";
import { categoryLabels } from "./credential-type-select.tsx";

export const validityWords = (validity: CredentialType["validity"]): string =>
  validity.kind === "months_from_issue"
    ? `${validity.months} months from issue`
    : validity.kind === "no_expiry"
      ? "No expiry"
      : "Dates on the document";

type CatalogueTableProps = {
  types: CredentialType[];
  editingCode: string | null;
  onEdit: (code: string) => void;
};

export function CatalogueTable({ types, editingCode, onEdit }: CatalogueTableProps) {
  const columns = useMemo(() => {
    const column = dataTableColumns<CredentialType>();
    return column.columns([
      column.accessor("name", { header: "Name", sortFn: "text" }),
      column.accessor((t) => categoryLabels[t.category], {
        id: "category",
        header: "Category",
        sortFn: "text",
      }),
      column.accessor((t) => (t.holder === "company" ? "Company" : "Technician"), {
        id: "holder",
        header: "Held by",
        sortFn: "text",
      }),
      column.accessor((t) => validityWords(t.validity), {
        id: "validity",
        header: "Valid for",
        sortFn: "text",
      }),
      column.accessor((t) => (t.active ? "Active" : "Retired"), {
        id: "active",
        header: "In use",
        sortFn: "text",
        cell: (info) => (
          <span className="inline-flex items-center gap-1.5">
            <span aria-hidden="true">{info.row.original.active ? "●" : "○"}</span>
            {info.getValue()}
          </span>
        ),
      }),
      column.display({
        id: "edit",
        header: "Edit",
        cell: (info) => (
          <Button
            variant="quiet"
            className="min-h-8 px-2 py-1"
            onClick={() => onEdit(info.row.original.code)}
          >
            Edit<span className="sr-only"> {info.row.original.name}</span>
          </Button>
        ),
      }),
    ]);
  }, [onEdit]);
  return (
    <DataTable
      caption="Credential types"
      hideCaption
      columns={columns}
      data={types}
      getRowId={(t) => t.code}
      isRowSelected={(t) => t.code === editingCode}
      initialSorting={[{ id: "category", desc: false }]}
    />
  );
}
