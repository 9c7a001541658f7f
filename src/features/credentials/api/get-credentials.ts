import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";
import { credentialKeys, type CredentialFilters } from "./credential-keys.ts";
import { credentialDtoSchema } from "@shared/credentials/credential-shapes.ts";

export function getCredentials(filters: CredentialFilters = {}) {
  const query = new URLSearchParams();
  if (filters.technicianId) query.set("technicianId", String(filters.technicianId));
  if (filters.state) query.set("state", filters.state);
  if (filters.holder) query.set("holder", filters.holder);
  const search = query.toString();
  return api.get(`/credentials${search ? `?${search}` : ""}`, z.array(credentialDtoSchema));
}

export const credentialsQuery = (filters: CredentialFilters = {}) =>
  queryOptions({ queryKey: credentialKeys.list(filters), queryFn: () => getCredentials(filters) });

export const useCredentials = (filters: CredentialFilters = {}) => useQuery(credentialsQuery(filters));
