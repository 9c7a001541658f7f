import { useSuspenseQuery } from "@tanstack/react-query";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { companyProfileQuery } from "@/features/companies/api/company-profile.ts";
import { CompanyAddressForm } from "@/features/companies/components/company-address-form.tsx";
import { queryClient } from "@/lib/query-client.ts";

export async function loader() {
  await queryClient.ensureQueryData(companyProfileQuery());
  return null;
}

export function Component() {
  const { data: profile } = useSuspenseQuery(companyProfileQuery());
  return (
    <>
      <PageHeader title={profile.name} />
      <CompanyAddressForm profile={profile} />
    </>
  );
}
