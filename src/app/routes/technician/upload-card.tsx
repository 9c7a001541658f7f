import { useSuspenseQuery } from "@tanstack/react-query";
import { useLoaderData, useNavigate, useSearchParams } from "react-router-dom";
import { paths } from "@/config/paths.ts";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { credentialTypesQuery } from "@/features/credentials/api/get-credential-types.ts";
import { UploadFlow } from "@/features/credentials/components/upload-flow.tsx";
import { currentUserQuery } from "@/features/accounts/api/get-current-user.ts";
import { queryClient } from "@/lib/query-client.ts";
import { currentTechnicianId } from "./current-technician.ts";

export async function loader() {
  const technicianId = await currentTechnicianId();
  await queryClient.ensureQueryData(credentialTypesQuery());
  // The sign-in carries the technician's own name, which the card's holder name starts from.
  const user = await queryClient.ensureQueryData(currentUserQuery());
  return { technicianId, name: user?.name ?? "" };
}

// A technician sends their own cards; insurance and exemptions are the company's and go through the office.
const ownCardSets = new Set(["training", "oem", "license"]);

export function Component() {
  const { technicianId, name } = useLoaderData<typeof loader>();
  const { data: types } = useSuspenseQuery(credentialTypesQuery());
  const [search] = useSearchParams();
  const navigate = useNavigate();
  return (
    <>
      <PageHeader
        title="Upload a card"
        description="Take a photo of the card or choose a PDF. Check what we read from it, then send it."
      />
      <UploadFlow
        types={types.filter((t) => t.active && t.holder === "technician" && ownCardSets.has(t.fieldSet))}
        technicians={name ? [{ id: technicianId, name }] : []}
        fixedTechnicianId={technicianId}
        initialTypeCode={search.get("type") ?? undefined}
        onSubmitted={(credential) =>
          navigate(paths.technician.standing, { state: { submitted: credential.typeName } })
        }
      />
    </>
  );
}
