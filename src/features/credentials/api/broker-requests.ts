import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import {
  brokerContactDtoSchema,
  brokerCoverageDtoSchema,
  brokerRequestDtoSchema,
  type BrokerCoverageDto,
  type BrokerRequestDto,
  type RequestBrokerCertificate,
  type SaveBrokerContact,
} from "@shared/credentials/broker-schemas.ts";
import { api } from "@/lib/api-client.ts";
import { credentialKeys } from "./credential-keys.ts";

export type BrokerRequest = BrokerRequestDto;
export type BrokerCoverage = BrokerCoverageDto;

const brokerKeys = {
  all: [...credentialKeys.all, "broker"] as const,
  contacts: () => [...brokerKeys.all, "contacts"] as const,
  requests: () => [...brokerKeys.all, "requests"] as const,
  coverages: () => [...brokerKeys.all, "coverages"] as const,
};

export const brokerCoveragesQuery = () =>
  queryOptions({
    queryKey: brokerKeys.coverages(),
    queryFn: () => api.get("/broker-coverages", z.array(brokerCoverageDtoSchema)),
  });

export const useBrokerCoverages = () => useQuery(brokerCoveragesQuery());

export function useRemoveCoverageBroker() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (typeCode: string) => api.send("DELETE", `/broker-contacts/${encodeURIComponent(typeCode)}`),
    onSuccess: () => client.invalidateQueries({ queryKey: brokerKeys.all }),
  });
}

export const brokerContactsQuery = () =>
  queryOptions({
    queryKey: brokerKeys.contacts(),
    queryFn: () => api.get("/broker-contacts", z.array(brokerContactDtoSchema)),
  });

export const brokerRequestsQuery = () =>
  queryOptions({
    queryKey: brokerKeys.requests(),
    queryFn: () => api.get("/broker-requests", z.array(brokerRequestDtoSchema)),
  });

export const useBrokerContacts = () => useQuery(brokerContactsQuery());
export const useBrokerRequests = () => useQuery(brokerRequestsQuery());

export function useSaveBrokerContact() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: SaveBrokerContact) => api.put("/broker-contacts", input, brokerContactDtoSchema),
    onSuccess: () => client.invalidateQueries({ queryKey: brokerKeys.all }),
  });
}

export function useRequestBrokerCertificate() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: RequestBrokerCertificate) =>
      api.post("/broker-requests", input, brokerRequestDtoSchema),
    onSuccess: () => client.invalidateQueries({ queryKey: brokerKeys.all }),
  });
}
