import type { ReactNode } from "react";
import { useSuspenseQuery } from "@tanstack/react-query";
import { Link, useParams, useSearchParams, type LoaderFunctionArgs } from "react-router-dom";
import { wholeMilesFromKm } from "@shared/geo/units.ts";
import { technologyLabels, type MachineTechnology } from "@shared/technicians/schemas.ts";
import { hrefs, paths } from "@/config/paths.ts";
import { Button } from "@/components/ui/button.tsx";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { CautionNote } from "@/components/ui/caution-note.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { StatusKey } from "@/components/ui/status-key.tsx";
import {
  directoryTechnicianQuery,
  estimateInputsOf,
} from "@/features/directory/api/get-directory-technician.ts";
import type {
  DirectoryTechnicianDto as DirectoryTechnician,
  ProfileStandingDto as ProfileStanding,
} from "@shared/directory/directory-shapes.ts";
import { DirectoryStandingBadge } from "@/features/directory/components/directory-standing-badge.tsx";
import { ProfileCredentials } from "@/features/directory/components/profile-credentials.tsx";
import { ProfileReviews } from "@/features/directory/components/profile-reviews.tsx";
import { ProfileStandings } from "@/features/directory/components/profile-standings.tsx";
import { SiteEstimates } from "@/features/directory/components/site-estimates.tsx";
import { useAddToRoster } from "@/features/roster/api/add-to-roster.ts";
import { isApiError } from "@/lib/api-client.ts";
import { formatCents } from "@/lib/format-money.ts";
import { queryClient } from "@/lib/query-client.ts";
import { technicianIdOf } from "./technician-id.ts";

export async function loader({ params, request }: LoaderFunctionArgs) {
  const inputs = estimateInputsOf(new URL(request.url).searchParams);
  await queryClient.ensureQueryData(directoryTechnicianQuery(technicianIdOf(params.technicianId), inputs));
  return null;
}

function AddToRoster({ technician }: { technician: DirectoryTechnician }) {
  const add = useAddToRoster();
  const already = isApiError(add.error) && add.error.status === 409;
  const { technicianEntryId, companyEntryId } = technician.roster;
  if (!add.isSuccess && (technicianEntryId !== null || companyEntryId !== null))
    return (
      <p role="status" className="text-sm font-medium text-ink-900" data-testid="roster-state">
        {technicianEntryId !== null ? "On your roster" : `On your roster through ${technician.companyName}`} ·{" "}
        <Link to={paths.buyer.roster} className="underline underline-offset-2">
          Open the roster
        </Link>
      </p>
    );
  const technicianId = technician.technicianId;
  return (
    <div className="flex flex-col items-start gap-1">
      <Button
        variant="secondary"
        pending={add.isPending}
        disabled={add.isSuccess || already}
        onClick={() => add.mutate({ technicianId })}
      >
        {add.isSuccess ? "On your roster" : "Add to roster"}
      </Button>
      <p role="status" className="text-sm text-ink-700">
        {add.isSuccess
          ? "Added to your roster."
          : already
            ? "Already on your roster."
            : add.error
              ? add.error.message
              : ""}
      </p>
    </div>
  );
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  const id = `section-${title.toLowerCase().replace(/[^a-z]+/g, "-")}`;
  return (
    <section aria-labelledby={id} className="space-y-3">
      <h2 id={id} className="text-lg font-semibold text-ink-900">
        {title}
      </h2>
      {children}
    </section>
  );
}

/** The set the buyer decides by: the chosen site's, else the first set tied to a site; none means baseline only. */
function pickDecidingSet(
  sets: readonly ProfileStanding[],
  siteId: number | null,
): ProfileStanding | undefined {
  return (
    (siteId !== null ? sets.find((s) => s.siteId === siteId) : undefined) ??
    sets.find((s) => s.siteId !== null)
  );
}

export function Component() {
  const id = technicianIdOf(useParams().technicianId);
  const [search] = useSearchParams();
  const { data: t } = useSuspenseQuery(directoryTechnicianQuery(id, estimateInputsOf(search)));
  const decidingSet = pickDecidingSet(t.requirementSets, t.chosenSiteId);
  return (
    <>
      <PageHeader
        title={t.name}
        description={t.companyName}
        actions={
          <>
            <AddToRoster technician={t} />
            <Link to={hrefs.workOrderNew(t.technicianId, t.chosenSiteId)} className={buttonStyles("primary")}>
              Raise a work order
            </Link>
          </>
        }
      />
      <div className="space-y-8">
        <div className="flex flex-wrap items-center gap-3">
          {decidingSet ? (
            <DirectoryStandingBadge
              standing={decidingSet.standing}
              earliestLapse={decidingSet.earliestLapse}
              judgedAgainst={{
                kind: "requirement_set",
                requirementSetId: decidingSet.requirementSetId,
                name: decidingSet.name,
                fromSite: decidingSet.siteId !== null,
              }}
            />
          ) : (
            <DirectoryStandingBadge
              standing={t.baseline.standing}
              earliestLapse={t.baseline.earliestLapse}
              judgedAgainst={{ kind: "baseline" }}
            />
          )}
          <span className="text-sm text-ink-800">
            {t.technologies.map((x) => technologyLabels[x as MachineTechnology] ?? x).join(", ") ||
              "No technologies listed"}
            {t.controlFamilies.length > 0 && ` · controls: ${t.controlFamilies.join(", ")}`}
          </span>
          <span className="text-sm text-ink-800">
            {formatCents(t.hourlyRateCents)}/h on site · {formatCents(t.travelRateCents)}/h travel ·{" "}
            {formatCents(t.mileageRateCents)}/mile · serves {wholeMilesFromKm(t.serviceRadiusKm)} miles around
            base
          </span>
        </div>
        <CautionNote />
        <StatusKey statuses={["cleared", "lapsing", "not_cleared", "met", "unmet"]} />
        <Section title="Standing against your requirement sets">
          <ProfileStandings standings={t.requirementSets} />
        </Section>
        <Section title="Estimate for each of your sites">
          <SiteEstimates
            estimates={t.estimates}
            onSiteHours={t.assumptions.onSiteHours}
            chosenSiteId={t.chosenSiteId}
          />
        </Section>
        <Section title="Verified credentials">
          <ProfileCredentials credentials={t.credentials} />
        </Section>
        <Section title="Ratings">
          <ProfileReviews technician={t} />
        </Section>
      </div>
    </>
  );
}
