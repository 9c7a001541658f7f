import { useQuery } from "@tanstack/react-query";
import { data, useParams, type LoaderFunctionArgs } from "react-router-dom";
import { LOCKOUT_CAUTION } from "@shared/safety/cautions.ts";
import { idParam } from "@shared/credentials/schemas.ts";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { maintenancePlansQuery } from "@/features/machines/api/maintenance-keys.ts";
import { MaintenancePlansPanel } from "@/features/machines/components/maintenance-plans-panel.tsx";
import { queryClient } from "@/lib/query-client.ts";

function machineIdOf(params: { machineId?: string | undefined }): number {
  const parsed = idParam.safeParse(params.machineId);
  if (!parsed.success) throw data("There is no machine at this address.", { status: 404 });
  return parsed.data;
}

export async function loader({ params }: LoaderFunctionArgs) {
  await queryClient.prefetchQuery(maintenancePlansQuery(machineIdOf(params)));
  return null;
}

export function Component() {
  const machineId = machineIdOf(useParams());
  const { data: list } = useQuery(maintenancePlansQuery(machineId));
  const machine = list?.machine;
  return (
    <div className="min-w-0">
      <PageHeader
        title="Maintenance plans"
        description={
          machine
            ? `${machine.builder} ${machine.model}${machine.serialNumber ? `, serial ${machine.serialNumber}` : ""} at ${machine.siteName}`
            : undefined
        }
      />
      <MaintenancePlansPanel machineId={machineId} />
      <p className="mt-6 text-sm text-ink-700">{LOCKOUT_CAUTION}</p>
    </div>
  );
}
