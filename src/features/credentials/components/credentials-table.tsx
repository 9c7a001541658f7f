import { useMemo, type ReactNode } from "react";
import { Link } from "react-router-dom";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { DataTable, dataTableColumns } from "@/components/ui/data-table.tsx";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { StatusBadge } from "@/components/ui/status-badge.tsx";
import { credentialTypeByCode } from "@shared/credentials/catalogue.ts";
import { lapseWords, readerTimeZone } from "@shared/standing/lapse-words.ts";
import type { CredentialDto as Credential } from "@shared/credentials/credential-shapes.ts";
import { documentUrls } from "./document-urls.ts";

type CredentialsTableProps = {
  credentials: Credential[];
  caption: string;
  /** Where "Submit a corrected one" leads for a returned credential (the upload flow, type and holder preset). Keep it stable. */
  correctionHref: (credential: Credential) => string;
  empty?: ReactNode;
  /** Hide the holder column where every row has the same holder. */
  showHolder?: boolean;
};

const holderOf = (c: Credential) => c.technicianName ?? `${c.companyName} (company)`;

/** Credentials with their state, the date each lapses, and for returned ones the reason and the way to answer it. */
export function CredentialsTable({
  credentials,
  caption,
  correctionHref,
  empty,
  showHolder = true,
}: CredentialsTableProps) {
  const columns = useMemo(() => credentialColumns(correctionHref, showHolder), [correctionHref, showHolder]);
  return (
    <DataTable
      caption={caption}
      hideCaption
      columns={columns}
      data={credentials}
      getRowId={(c) => String(c.id)}
      initialSorting={[{ id: "lapsesAt", desc: false }]}
      empty={empty ?? <EmptyState title="No documents yet" />}
    />
  );
}

function credentialColumns(correctionHref: (credential: Credential) => string, showHolder: boolean) {
  const column = dataTableColumns<Credential>();
  return column.columns([
    column.accessor("typeName", { header: "Type", sortFn: "text" }),
    ...(showHolder ? [column.accessor(holderOf, { id: "holder", header: "Holder", sortFn: "text" })] : []),
    column.accessor("state", {
      header: "Status",
      sortFn: "text",
      cell: (info) => <StatusBadge status={info.getValue()} />,
    }),
    column.accessor((c) => c.lapsesAt ?? "", {
      id: "lapsesAt",
      header: "Lapses",
      sortFn: "text",
      cell: (info) =>
        info.row.original.lapsesAt
          ? lapseWords(
              info.row.original.lapsesAt,
              credentialTypeByCode.get(info.row.original.typeCode)?.fieldSet,
              readerTimeZone(),
            )
          : "No expiry",
    }),
    column.display({
      id: "note",
      header: "Note",
      cell: (info) => {
        const c = info.row.original;
        if (c.state !== "returned") return c.state === "submitted" ? "Waiting for a reviewer" : null;
        return (
          <div className="max-w-md space-y-2">
            <p>
              <span className="font-semibold">Returned:</span> {c.returnReason ?? "No reason given."}
            </p>
            <Link to={correctionHref(c)} className={buttonStyles("secondary", "min-h-9 py-1")}>
              Submit a corrected one<span className="sr-only"> for {c.typeName}</span>
            </Link>
          </div>
        );
      },
    }),
    column.display({
      id: "file",
      header: "File",
      cell: (info) => (
        <a
          href={documentUrls.download(info.row.original.documentId)}
          className="text-ink-700 underline underline-offset-2 focus-visible:outline-2 focus-visible:outline-ink-700"
        >
          Download<span className="sr-only"> {info.row.original.documentName}</span>
        </a>
      ),
    }),
  ]);
}
