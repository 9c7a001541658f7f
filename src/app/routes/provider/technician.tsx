import { useSuspenseQuery } from "@tanstack/react-query";
import { Link, useParams, type LoaderFunctionArgs } from "react-router-dom";
import { wholeMilesFromKm } from "@shared/geo/units.ts";
import { hrefs } from "@/config/paths.ts";
import { Button } from "@/components/ui/button.tsx";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { StatusKey, technicianPageStatuses } from "@/components/ui/status-key.tsx";
import type { CredentialDto as Credential } from "@shared/credentials/credential-shapes.ts";
import { credentialsQuery } from "@/features/credentials/api/get-credentials.ts";
import { CredentialsTable } from "@/features/credentials/components/credentials-table.tsx";
import { StandingSection } from "@/features/standing/components/standing-section.tsx";
import { useDeactivateTechnician } from "@/features/technicians/api/deactivate-technician.ts";
import { technicianQuery } from "@/features/technicians/api/get-technician.ts";
import { useReactivateTechnician } from "@/features/technicians/api/reactivate-technician.ts";
import { GiveSignInForm } from "@/features/technicians/components/give-sign-in-form.tsx";
import { technologyWords } from "@/features/technicians/components/technicians-table.tsx";
import { formatCents } from "@/lib/format-money.ts";
import { queryClient } from "@/lib/query-client.ts";
import { technicianIdOf } from "./technician-id.ts";

export async function loader({ params }: LoaderFunctionArgs) {
  const id = technicianIdOf(params);
  await Promise.all([
    queryClient.ensureQueryData(technicianQuery(id)),
    queryClient.ensureQueryData(credentialsQuery({ technicianId: id })),
  ]);
  return null;
}

const correctionHref = (c: Credential) =>
  hrefs.documentNew({ typeCode: c.typeCode, technicianId: c.technicianId });

export function Component() {
  const id = technicianIdOf(useParams());
  const { data: technician } = useSuspenseQuery(technicianQuery(id));
  const { data: credentials } = useSuspenseQuery(credentialsQuery({ technicianId: id }));
  const deactivate = useDeactivateTechnician();
  const reactivate = useReactivateTechnician();
  const upload = (
    <Link to={hrefs.documentNew({ technicianId: id })} className={buttonStyles("primary")}>
      Upload a card
    </Link>
  );
  const details: Array<[string, string]> = [
    ["E-mail", technician.email ?? "—"],
    ["Phone", technician.phone ?? "—"],
    ["Technologies", technologyWords(technician.technologies)],
    ["Control families", technician.controlFamilies.join(", ") || "—"],
    [
      "Home base",
      `ZIP ${technician.postalCode}, serves ${wholeMilesFromKm(technician.serviceRadiusKm)} miles around`,
    ],
    [
      "Rates",
      `${formatCents(technician.hourlyRateCents)}/h on site, ${formatCents(technician.travelRateCents)}/h travel, ${formatCents(technician.mileageRateCents)}/mi`,
    ],
    ["Sign-in", technician.hasAccount ? "Has a sign-in" : "No sign-in yet"],
    ["Status", technician.active ? "Active" : "Deactivated: hidden from buyers, sign-in stopped"],
  ];

  return (
    <>
      <PageHeader
        title={technician.name}
        description={technician.active ? undefined : "This technician is deactivated."}
        actions={
          <>
            {upload}
            <Link to={hrefs.technicianEdit(id)} className={buttonStyles("secondary")}>
              Edit
            </Link>
            {technician.active ? (
              <Button
                variant="danger"
                pending={deactivate.isPending}
                pendingLabel="Deactivating…"
                onClick={() => deactivate.mutate(id)}
              >
                Deactivate
              </Button>
            ) : (
              <Button
                variant="secondary"
                pending={reactivate.isPending}
                pendingLabel="Reactivating…"
                onClick={() => reactivate.mutate(id)}
              >
                Reactivate
              </Button>
            )}
          </>
        }
      />
      {(deactivate.error ?? reactivate.error) && (
        <p role="alert" className="mb-4 rounded-md border-l-4 border-red-700 bg-red-50 px-4 py-3 text-sm">
          {(deactivate.error ?? reactivate.error)?.message}
        </p>
      )}
      <div className="grid items-start gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="space-y-8">
          <StandingSection technicianId={id} loadingLabel="Loading standing" />
          <section aria-labelledby="cards-heading">
            <h2 id="cards-heading" className="mb-3 text-lg font-semibold text-ink-900">
              Credentials
            </h2>
            <CredentialsTable
              caption={`Credentials of ${technician.name}`}
              credentials={credentials}
              correctionHref={correctionHref}
              showHolder={false}
              empty={
                <EmptyState title="No cards on file" action={upload}>
                  Upload their training cards to get them cleared.
                </EmptyState>
              }
            />
          </section>
          <StatusKey statuses={technicianPageStatuses} />
        </div>
        <aside className="space-y-6">
          <section aria-labelledby="details-heading" className="rounded-lg border border-ink-100 bg-white">
            <h2 id="details-heading" className="border-b border-ink-100 px-4 py-2 font-semibold text-ink-900">
              Details
            </h2>
            <dl className="divide-y divide-ink-100 text-sm">
              {details.map(([term, value]) => (
                <div key={term} className="px-4 py-2">
                  <dt className="text-ink-700">{term}</dt>
                  <dd className="break-words text-ink-900">{value}</dd>
                </div>
              ))}
            </dl>
          </section>
          <section className="rounded-lg border border-ink-100 bg-white p-4">
            <GiveSignInForm technician={technician} />
          </section>
        </aside>
      </div>
    </>
  );
}
