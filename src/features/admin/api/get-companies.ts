import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { companyKinds } from "@shared/accounts/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { adminKeys } from "./admin-keys.ts";

// Run-time check of shared/accounts/schemas.ts AdminCompanyDto.
export const adminCompanySchema = z.object({
  id: z.number(),
  name: z.string(),
  kind: z.enum(companyKinds),
  createdAt: z.string(),
  users: z.number(),
  technicians: z.number(),
  sites: z.number(),
});
export type AdminCompany = z.infer<typeof adminCompanySchema>;

export const getCompanies = () => api.get("/admin/companies", z.array(adminCompanySchema));

export const companiesQuery = () => queryOptions({ queryKey: adminKeys.companies(), queryFn: getCompanies });

export const useCompanies = () => useQuery(companiesQuery());
