import { useState } from "react";
import { useSuspenseQuery } from "@tanstack/react-query";
import { Link, useNavigate, useSearchParams, type LoaderFunctionArgs } from "react-router-dom";
import { technologyLabels, type MachineTechnology } from "@shared/technicians/schemas.ts";
import { hrefs } from "@/config/paths.ts";
import { CautionNote } from "@/components/ui/caution-note.tsx";
import { SafetyCaution } from "@/components/ui/safety-caution.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { directoryTechnicianQuery } from "@/features/directory/api/get-directory-technician.ts";
import { requirementSetsQuery } from "@/features/standing/api/get-requirement-sets.ts";
import { useSiteEquipment } from "@/features/sites/api/get-site-equipment.ts";
import { sitesQuery } from "@/features/sites/api/get-sites.ts";
import { useRaiseWorkOrder } from "@/features/work-orders/api/raise-work-order.ts";
import { RaiseWorkOrderForm } from "@/features/work-orders/components/raise-work-order-form.tsx";
import { queryClient } from "@/lib/query-client.ts";
import { technicianIdOf } from "./technician-id.ts";

const technicianOf = (search: URLSearchParams) => technicianIdOf(search.get("technicianId"));

export async function loader({ request }: LoaderFunctionArgs) {
  const technicianId = technicianOf(new URL(request.url).searchParams);
  await Promise.all([
    queryClient.ensureQueryData(directoryTechnicianQuery(technicianId)),
    queryClient.ensureQueryData(sitesQuery()),
    queryClient.ensureQueryData(requirementSetsQuery()),
  ]);
  return null;
}

export function Component() {
  const [search] = useSearchParams();
  const technicianId = technicianOf(search);
  const navigate = useNavigate();
  const { data: technician } = useSuspenseQuery(directoryTechnicianQuery(technicianId));
  const { data: sites } = useSuspenseQuery(sitesQuery());
  const { data: sets } = useSuspenseQuery(requirementSetsQuery());
  const siteSet = (id: string) => sets.find((s) => String(s.siteId) === id && id !== "");
  const fromSearch = sites.find((s) => String(s.id) === search.get("siteId"));
  const [siteId, setSiteId] = useState(
    fromSearch ? String(fromSearch.id) : sites.length === 1 ? String(sites[0]!.id) : "",
  );
  const [requirementSetId, setRequirementSetId] = useState(() => {
    const own = siteSet(siteId);
    return own ? String(own.id) : "";
  });
  const chooseSite = (id: string) => {
    setSiteId(id);
    const own = siteSet(id);
    setRequirementSetId(own ? String(own.id) : "");
  };
  const equipment = useSiteEquipment(siteId ? Number(siteId) : null);
  const raise = useRaiseWorkOrder();
  return (
    <>
      <PageHeader
        title="Raise a work order"
        description={
          <>
            For{" "}
            <Link
              to={hrefs.directoryTechnician(technician.technicianId)}
              className="underline underline-offset-2"
            >
              {technician.name}
            </Link>{" "}
            of {technician.companyName}. It is sent only if the technician is cleared at this moment.
          </>
        }
      />
      <RaiseWorkOrderForm
        technicianId={technician.technicianId}
        technicianName={technician.name}
        sites={sites.map((s) => ({ value: String(s.id), label: s.name }))}
        siteId={siteId}
        siteDefaults={sites.find((s) => String(s.id) === siteId) ?? null}
        onSiteChange={chooseSite}
        machines={(equipment.data ?? []).map((m) => ({
          id: m.id,
          label: `${m.builder} ${m.model} (${technologyLabels[m.technology as MachineTechnology] ?? m.technology}, ${m.controlFamily})`,
          technology: m.technology,
        }))}
        requirementSets={sets.map((s) => ({ value: String(s.id), label: s.name }))}
        requirementSetId={requirementSetId}
        onRequirementSetChange={setRequirementSetId}
        pending={raise.isPending}
        serverError={raise.error}
        onSubmit={(input) => raise.mutate(input, { onSuccess: (wo) => navigate(hrefs.workOrder(wo.id)) })}
      />
      <SafetyCaution className="mt-6" />
      <CautionNote className="mt-6" />
    </>
  );
}
