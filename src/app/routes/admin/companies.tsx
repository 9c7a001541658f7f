import { useSuspenseQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { buttonStyles } from "@/components/ui/button-styles.ts";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { paths } from "@/config/paths.ts";
import { companiesQuery } from "@/features/admin/api/get-companies.ts";
import { CompaniesTable } from "@/features/admin/components/companies-table.tsx";
import { queryClient } from "@/lib/query-client.ts";

export async function loader() {
  await queryClient.ensureQueryData(companiesQuery());
  return null;
}

export function Component() {
  const { data: companies } = useSuspenseQuery(companiesQuery());
  const shops = companies.filter((c) => c.kind === "shop").length;
  const services = companies.filter((c) => c.kind === "service").length;
  return (
    <>
      <PageHeader
        title="Companies"
        description={`${shops} shops and ${services} service companies, with how many users, technicians and active sites each has.`}
        actions={
          <Link to={paths.admin.users} className={buttonStyles("secondary")}>
            Users
          </Link>
        }
      />
      <CompaniesTable companies={companies} />
    </>
  );
}
