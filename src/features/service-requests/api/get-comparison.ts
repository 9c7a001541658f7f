import { queryOptions } from "@tanstack/react-query";
import { comparisonDtoSchema } from "@shared/service-requests/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { serviceRequestKeys } from "./service-request-keys.ts";

export const getComparison = (id: number) =>
  api.get(`/service-requests/${id}/comparison`, comparisonDtoSchema);

export const comparisonQuery = (id: number) =>
  queryOptions({ queryKey: serviceRequestKeys.comparison(id), queryFn: () => getComparison(id) });
