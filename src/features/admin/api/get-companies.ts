import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { adminCompanyDtoSchema, type AdminCompanyDto } from "@shared/accounts/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { adminKeys } from "./admin-keys.ts";

export type AdminCompany = AdminCompanyDto;

export const getCompanies = () => api.get("/admin/companies", z.array(adminCompanyDtoSchema));

export const companiesQuery = () => queryOptions({ queryKey: adminKeys.companies(), queryFn: getCompanies });

export const useCompanies = () => useQuery(companiesQuery());
