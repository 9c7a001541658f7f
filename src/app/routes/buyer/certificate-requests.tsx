import { formatLocalDate } from "@shared/dates/local-time.ts";
import { holderRoleLabels } from "@shared/credentials/broker-schemas.ts";
import { readerTimeZone } from "@shared/standing/lapse-words.ts";
import { CautionNote } from "@/components/ui/caution-note.tsx";
import { DataTable, dataTableColumns } from "@/components/ui/data-table.tsx";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import {
  useCertificateRequests,
  type ShopCertificateRequest,
} from "@/features/credentials/api/certificate-requests.ts";
import { AskForCertificateForm } from "@/features/credentials/components/ask-for-certificate-form.tsx";

const zone = readerTimeZone();
const day = (iso: string) => formatLocalDate(iso, zone);

function standing(r: ShopCertificateRequest): string {
  if (r.verifiedAt) return `Verified ${day(r.verifiedAt)}`;
  if (r.linkState === "used") return `Received ${day(r.receivedAt!)}, awaiting verification`;
  if (r.linkState === "expired") return "The broker's link ran out unused";
  return `Sent to the broker, link open until ${day(r.expiresAt)}`;
}

const column = dataTableColumns<ShopCertificateRequest>();
const columns = [
  column.accessor("createdAt", { header: "Asked", cell: (c) => day(c.getValue()) }),
  column.accessor("companyName", { header: "Company" }),
  column.accessor("coverageName", { header: "Coverage" }),
  column.accessor("holderRole", { header: "Naming you as", cell: (c) => holderRoleLabels[c.getValue()] }),
  column.accessor((r) => standing(r), { id: "standing", header: "Where it stands" }),
];

export function Component() {
  const data = useCertificateRequests();
  return (
    <>
      <PageHeader
        title="Certificates from brokers"
        description="Ask a service company for a certificate of insurance naming your shop. Its broker gets a one-time upload link; a reviewer verifies what arrives, and you are told by e-mail and here."
      />
      <div className="space-y-6">
        <CautionNote />
        {data.isPending && <p role="status">Loading…</p>}
        {data.data && (
          <>
            <section className="rounded-md border border-ink-100 bg-white p-4">
              <AskForCertificateForm companies={data.data.companies} coverages={data.data.coverages} />
            </section>
            <DataTable
              caption="Certificates you asked for"
              columns={columns}
              data={data.data.requests}
              getRowId={(r) => String(r.id)}
              empty={<EmptyState title="No certificates asked for yet" />}
            />
          </>
        )}
      </div>
    </>
  );
}
