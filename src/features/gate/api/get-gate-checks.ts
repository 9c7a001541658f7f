import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import { gateCheckLogSchema, type GateCheckLogQuery } from "@shared/gate/check-log.ts";
import { api } from "@/lib/api-client.ts";
import { gateKeys } from "./gate-keys.ts";

export function getGateChecks(filters: GateCheckLogQuery) {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(filters))
    if (value !== undefined && value !== "") search.set(key, String(value));
  return api.get(`/gate/checks?${search.toString()}`, gateCheckLogSchema);
}

export const gateChecksQuery = (filters: GateCheckLogQuery) =>
  queryOptions({
    queryKey: gateKeys.checks(filters),
    queryFn: () => getGateChecks(filters),
    placeholderData: keepPreviousData,
  });

export const useGateChecks = (filters: GateCheckLogQuery) => useQuery(gateChecksQuery(filters));
