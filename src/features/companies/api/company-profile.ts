import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import {
  companyProfileDtoSchema,
  type CompanyAddress,
  type CompanyProfileDto,
} from "@shared/accounts/schemas.ts";
import { api } from "@/lib/api-client.ts";

export type CompanyProfile = CompanyProfileDto;

const companyKeys = { profile: () => ["company", "profile"] as const };

export const companyProfileQuery = () =>
  queryOptions({
    queryKey: companyKeys.profile(),
    queryFn: () => api.get("/company", companyProfileDtoSchema),
  });

/** Moves the mailing address; the answer carries the zone the server derived from the ZIP code. */
export function useChangeCompanyAddress() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CompanyAddress) => api.put("/company/address", input, companyProfileDtoSchema),
    onSuccess: (profile) => {
      queryClient.setQueryData(companyKeys.profile(), profile);
      // Every policy period of the company is read in the zone, so standings and lapse dates change with it.
      void queryClient.invalidateQueries({ predicate: (q) => q.queryKey[0] !== "company" });
    },
  });
}
