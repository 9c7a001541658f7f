import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { serviceRequestKeys } from "./service-request-keys.ts";
import { serviceRequestListSchema } from "./service-request-shapes.ts";

/** The shop's requests, or a company's inbox. */
export const getServiceRequests = () => api.get("/service-requests", serviceRequestListSchema);

export const serviceRequestsQuery = () =>
  queryOptions({ queryKey: serviceRequestKeys.list(), queryFn: getServiceRequests });

export const useServiceRequests = () => useQuery(serviceRequestsQuery());
