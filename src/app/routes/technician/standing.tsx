import { useSuspenseQuery } from "@tanstack/react-query";
import { Link, useLoaderData, useLocation } from "react-router-dom";
import { hrefs, paths } from "@/config/paths.ts";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { StatusKey, technicianPageStatuses } from "@/components/ui/status-key.tsx";
import type { CredentialDto as Credential } from "@shared/credentials/credential-shapes.ts";
import { credentialsQuery } from "@/features/credentials/api/get-credentials.ts";
import { CredentialsTable } from "@/features/credentials/components/credentials-table.tsx";
import { StandingSection } from "@/features/standing/components/standing-section.tsx";
import { queryClient } from "@/lib/query-client.ts";
import { currentTechnicianId } from "./current-technician.ts";

export async function loader() {
  const technicianId = await currentTechnicianId();
  await queryClient.ensureQueryData(credentialsQuery());
  return { technicianId };
}

const correctionHref = (c: Credential) => hrefs.uploadCard(c.typeCode);

export function Component() {
  const { technicianId } = useLoaderData<typeof loader>();
  const { data: credentials } = useSuspenseQuery(credentialsQuery());
  const arrival = useLocation().state as { submitted?: string } | null;
  const upload = (
    <Link to={paths.technician.uploadCard} className={buttonStyles("primary", "min-h-12 px-5 text-base")}>
      Upload a card
    </Link>
  );
  return (
    <>
      <PageHeader
        title="My standing"
        description="Whether you are cleared today, and when each of your cards lapses."
        actions={upload}
      />
      {arrival?.submitted && (
        <p
          role="status"
          className="mb-4 rounded-md border-l-4 border-emerald-700 bg-emerald-50 px-4 py-3 text-ink-900"
        >
          {arrival.submitted} was sent for verification.
        </p>
      )}
      <div className="space-y-8">
        <StandingSection
          technicianId={technicianId}
          loadingLabel="Loading your standing"
          viewer="technician"
        />
        <section aria-labelledby="cards-heading">
          <h2 id="cards-heading" className="mb-3 text-lg font-semibold text-ink-900">
            My cards and credentials
          </h2>
          <CredentialsTable
            caption="My credentials"
            credentials={credentials}
            showHolder={false}
            correctionHref={correctionHref}
            empty={
              <EmptyState title="No cards yet" action={upload}>
                Photograph or scan a training card to send it in.
              </EmptyState>
            }
          />
        </section>
        <StatusKey statuses={technicianPageStatuses} />
      </div>
    </>
  );
}
