import { useSuspenseQuery } from "@tanstack/react-query";
import { Link, useLocation, useSearchParams } from "react-router-dom";
import { credentialStates } from "@shared/credentials/schemas.ts";
import { hrefs } from "@/config/paths.ts";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { StatusKey } from "@/components/ui/status-key.tsx";
import { SelectField } from "@/components/ui/select-field.tsx";
import { statusWord } from "@/components/ui/status-badge.tsx";
import type { CredentialDto as Credential } from "@shared/credentials/credential-shapes.ts";
import { credentialsQuery } from "@/features/credentials/api/get-credentials.ts";
import { CredentialsTable } from "@/features/credentials/components/credentials-table.tsx";
import { BrokerPanel } from "@/features/credentials/components/broker-panel.tsx";
import { queryClient } from "@/lib/query-client.ts";

const stateOf = (search: URLSearchParams) => {
  const state = search.get("state") ?? "";
  return (credentialStates as readonly string[]).includes(state) ? state : undefined;
};

export async function loader({ request }: { request: Request }) {
  await queryClient.ensureQueryData(credentialsQuery({ state: stateOf(new URL(request.url).searchParams) }));
  return null;
}

const correctionHref = (c: Credential) =>
  hrefs.documentNew({ typeCode: c.typeCode, technicianId: c.technicianId });
const stateOptions = credentialStates.map((state) => ({
  value: state,
  label: statusWord({ status: state }),
}));

/** Navigation state the upload flow leaves behind, to say what was just sent. */
type Arrival = { submitted?: string; count?: number } | null;

export function Component() {
  const [search, setSearch] = useSearchParams();
  const state = stateOf(search);
  const { data: credentials } = useSuspenseQuery(credentialsQuery({ state }));
  const arrival = useLocation().state as Arrival;
  const upload = (
    <Link to={hrefs.documentNew()} className={buttonStyles("primary")}>
      Upload a document
    </Link>
  );
  return (
    <>
      <PageHeader
        title="Credentials"
        description="Your company's insurance and your technicians' cards, each with its verification state and when it lapses."
        actions={upload}
      />
      {arrival?.submitted && (
        <p
          role="status"
          className="mb-4 rounded-md border-l-4 border-emerald-700 bg-emerald-50 px-4 py-3 text-sm text-ink-900"
        >
          {arrival.submitted} {(arrival.count ?? 1) > 1 ? "were" : "was"} sent for verification. A reviewer
          will check {(arrival.count ?? 1) > 1 ? "each" : "it"} against the document.
        </p>
      )}
      <div className="mb-4 flex flex-wrap items-end gap-4">
        <SelectField
          label="Show"
          name="state"
          value={state ?? ""}
          placeholder="All states"
          options={stateOptions}
          onChange={(event) => {
            const value = event.currentTarget.value;
            setSearch(value ? { state: value } : {}, { replace: true });
          }}
          className="w-60"
        />
      </div>
      <CredentialsTable
        caption="Credentials"
        credentials={credentials}
        correctionHref={correctionHref}
        empty={
          <EmptyState title={state ? "No documents in this state" : "No documents yet"} action={upload}>
            Upload a certificate of insurance or a technician's card; the fields are read from it for you to
            check.
          </EmptyState>
        }
      />
      <StatusKey statuses={["submitted", "returned", "verified", "superseded", "lapsed", "lapsing"]} />
      <BrokerPanel
        coverages={credentials.filter((c) => c.holder === "company" && c.category === "insurance")}
      />
    </>
  );
}
