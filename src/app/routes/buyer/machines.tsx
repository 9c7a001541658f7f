import { useSuspenseQuery } from "@tanstack/react-query";
import { Link, useSearchParams, type LoaderFunctionArgs } from "react-router-dom";
import { machineStates } from "@shared/sites/schemas.ts";
import { machineTechnologies } from "@shared/technicians/schemas.ts";
import { paths } from "@/config/paths.ts";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { sitesQuery } from "@/features/sites/api/get-sites.ts";
import type { MachineFilters as Filters } from "@/features/machines/api/machine-keys.ts";
import { machinesQuery } from "@/features/machines/api/get-machines.ts";
import { MachineFilters } from "@/features/machines/components/machine-filters.tsx";
import { MachinesTable } from "@/features/machines/components/machines-table.tsx";
import { queryClient } from "@/lib/query-client.ts";

const oneOf = <T extends string>(list: readonly T[], value: string | null) => list.find((v) => v === value);

/** The filters as the URL holds them, so a filtered list can be bookmarked and reloaded. */
function filtersOf(params: URLSearchParams): Filters {
  const site = Number(params.get("siteId"));
  return {
    siteId: Number.isInteger(site) && site > 0 ? site : undefined,
    builder: params.get("builder")?.trim() || undefined,
    technology: oneOf(machineTechnologies, params.get("technology")),
    state: oneOf(machineStates, params.get("state")),
  };
}

export async function loader({ request }: LoaderFunctionArgs) {
  await Promise.all([
    queryClient.ensureQueryData(machinesQuery(filtersOf(new URL(request.url).searchParams))),
    queryClient.ensureQueryData(sitesQuery()),
  ]);
  return null;
}

export function Component() {
  const [params, setParams] = useSearchParams();
  const filters = filtersOf(params);
  const { data: machines } = useSuspenseQuery(machinesQuery(filters));
  const { data: sites } = useSuspenseQuery(sitesQuery());
  const filtered = Object.values(filters).some((v) => v !== undefined);
  const change = (next: Filters) => {
    const search = new URLSearchParams();
    for (const [key, value] of Object.entries(next)) if (value !== undefined) search.set(key, String(value));
    setParams(search);
  };
  return (
    <>
      <PageHeader
        title="Machines"
        description="Every machine of your shop across its sites: open one for its record and service history."
        actions={
          <div className="flex flex-wrap gap-2">
            <Link to={paths.buyer.sites} className={buttonStyles("secondary")}>
              Add machines at a site
            </Link>
            <Link to={paths.buyer.machineTransfers} className={buttonStyles("secondary")}>
              Machine transfers
            </Link>
          </div>
        }
      />
      <MachineFilters key={params.toString()} sites={sites} filters={filters} onChange={change} />
      {machines.length === 0 ? (
        <EmptyState
          title={filtered ? "No machine matches these filters" : "No machines yet"}
          action={
            filtered ? (
              <button type="button" className={buttonStyles("secondary")} onClick={() => setParams({})}>
                Clear the filters
              </button>
            ) : (
              <Link to={paths.buyer.sites} className={buttonStyles("primary")}>
                Go to your sites
              </Link>
            )
          }
        >
          {filtered
            ? "Try another site, builder, technology or state."
            : "Machines are added on each site's page."}
        </EmptyState>
      ) : (
        <MachinesTable machines={machines} />
      )}
    </>
  );
}
