import { queryOptions } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { serviceRequestKeys } from "./service-request-keys.ts";
import { serviceRequestDtoSchema } from "@shared/service-requests/schemas.ts";

export const getServiceRequest = (id: number) => api.get(`/service-requests/${id}`, serviceRequestDtoSchema);

export const serviceRequestQuery = (id: number) =>
  queryOptions({ queryKey: serviceRequestKeys.detail(id), queryFn: () => getServiceRequest(id) });
