import { useSuspenseQuery } from "@tanstack/react-query";
import { useNavigate, useSearchParams } from "react-router-dom";
import { idParam } from "@shared/credentials/schemas.ts";
import { paths } from "@/config/paths.ts";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { credentialTypesQuery } from "@/features/credentials/api/get-credential-types.ts";
import { UploadFlow } from "@/features/credentials/components/upload-flow.tsx";
import { techniciansQuery } from "@/features/technicians/api/get-technicians.ts";
import { queryClient } from "@/lib/query-client.ts";

export async function loader() {
  await Promise.all([
    queryClient.ensureQueryData(credentialTypesQuery()),
    queryClient.ensureQueryData(techniciansQuery()),
  ]);
  return null;
}

export function Component() {
  const [search] = useSearchParams();
  const { data: types } = useSuspenseQuery(credentialTypesQuery());
  const { data: technicians } = useSuspenseQuery(techniciansQuery());
  const navigate = useNavigate();
  const presetTechnician = idParam.safeParse(search.get("technicianId") ?? undefined);
  return (
    <>
      <PageHeader
        title="Upload a document"
        description="Choose what it is and whose it is, then drop the file. We read what we can from it; you check the fields and send it for verification."
      />
      <UploadFlow
        types={types.filter((t) => t.active)}
        technicians={technicians.filter((t) => t.active)}
        initialTypeCode={search.get("type") ?? undefined}
        initialTechnicianId={presetTechnician.success ? presetTechnician.data : undefined}
        onSubmitted={(credential) =>
          navigate(paths.provider.documents, { state: { submitted: credential.typeName } })
        }
        onCoveragesSubmitted={(credentials) =>
          navigate(paths.provider.documents, {
            state: { submitted: credentials.map((c) => c.typeName).join(", "), count: credentials.length },
          })
        }
      />
    </>
  );
}
