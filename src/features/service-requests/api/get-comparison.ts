import { queryOptions } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { serviceRequestKeys } from "./service-request-keys.ts";
import { comparisonSchema } from "./service-request-shapes.ts";

export const getComparison = (id: number) => api.get(`/service-requests/${id}/comparison`, comparisonSchema);

export const comparisonQuery = (id: number) =>
  queryOptions({ queryKey: serviceRequestKeys.comparison(id), queryFn: () => getComparison(id) });
