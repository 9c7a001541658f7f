import { useQuery } from "@tanstack/react-query";
import { data, Link, useParams, type LoaderFunctionArgs } from "react-router-dom";
import { LOCKOUT_CAUTION } from "@shared/safety/cautions.ts";
import { idParam } from "@shared/credentials/schemas.ts";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { hrefs } from "@/config/paths.ts";
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
      {/* A reminder lands here; the way back leads to the machine's record and history, not the browser's history. */}
      <Link
        to={hrefs.machine(machineId)}
        className="mb-2 inline-flex min-h-11 items-center text-sm text-ink-700 underline underline-offset-2"
      >
        Back to the machine
      </Link>
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
