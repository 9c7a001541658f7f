import { useSuspenseQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { paths } from "@/config/paths.ts";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { EmptyState } from "@/components/ui/empty-state.tsx";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { techniciansQuery } from "@/features/technicians/api/get-technicians.ts";
import { TechniciansTable } from "@/features/technicians/components/technicians-table.tsx";
import { queryClient } from "@/lib/query-client.ts";

export async function loader() {
  await queryClient.ensureQueryData(techniciansQuery());
  return null;
}

export function Component() {
  const { data: technicians } = useSuspenseQuery(techniciansQuery());
  const add = (
    <Link to={paths.provider.technicianNew} className={buttonStyles("primary")}>
      Add technician
    </Link>
  );
  const actions = (
    <div className="flex gap-2">
      <Link to={paths.provider.techniciansImport} className={buttonStyles("secondary")}>
        Import from CSV
      </Link>
      {add}
    </div>
  );
  return (
    <>
      <PageHeader
        title="Technicians"
        description="Your technicians, where they work from and what they charge. Open one to see their cards and standing."
        actions={actions}
      />
      {technicians.length === 0 ? (
        <EmptyState title="No technicians yet" action={add}>
          Add each technician who goes out on service calls; then upload their training cards.
        </EmptyState>
      ) : (
        <TechniciansTable technicians={technicians} />
      )}
    </>
  );
}
