import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { companyKinds, type CompanyAddress } from "@shared/accounts/schemas.ts";
import { api } from "@/lib/api-client.ts";

// shared/accounts/schemas.ts CompanyProfileDto.
const companyProfileSchema = z.object({
  id: z.number(),
  name: z.string(),
  kind: z.enum(companyKinds),
  addressLine: z.string().nullable(),
  postalCode: z.string().nullable(),
  city: z.string().nullable(),
  state: z.string().nullable(),
  timeZone: z.string(),
});
export type CompanyProfile = z.infer<typeof companyProfileSchema>;

const companyKeys = { profile: () => ["company", "profile"] as const };

export const companyProfileQuery = () =>
  queryOptions({ queryKey: companyKeys.profile(), queryFn: () => api.get("/company", companyProfileSchema) });

/** Moves the mailing address; the answer carries the zone the server derived from the ZIP code. */
export function useChangeCompanyAddress() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CompanyAddress) => api.put("/company/address", input, companyProfileSchema),
    onSuccess: (profile) => {
      queryClient.setQueryData(companyKeys.profile(), profile);
      // Every policy period of the company is read in the zone, so standings and lapse dates change with it.
      void queryClient.invalidateQueries({ predicate: (q) => q.queryKey[0] !== "company" });
    },
  });
}
