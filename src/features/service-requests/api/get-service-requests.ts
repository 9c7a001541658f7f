import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { serviceRequestSummaryDtoSchema } from "@shared/service-requests/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { serviceRequestKeys } from "./service-request-keys.ts";

/** The shop's requests, or a company's inbox. */
export const getServiceRequests = () => api.get("/service-requests", z.array(serviceRequestSummaryDtoSchema));

export const serviceRequestsQuery = () =>
  queryOptions({ queryKey: serviceRequestKeys.list(), queryFn: getServiceRequests });

export const useServiceRequests = () => useQuery(serviceRequestsQuery());
