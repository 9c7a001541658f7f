import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import type { RequestBrokerCertificate, SaveBrokerContact } from "@shared/credentials/broker-schemas.ts";
import { api } from "@/lib/api-client.ts";
import { credentialKeys } from "./credential-keys.ts";

const brokerContactSchema = z.object({
  id: z.number(),
  typeCode: z.string().nullable(),
  agency: z.string(),
  contactName: z.string(),
  email: z.string(),
});

const brokerRequestSchema = z.object({
  id: z.number(),
  typeCode: z.string(),
  credentialId: z.number().nullable(),
  shopCompanyId: z.number().nullable(),
  agency: z.string(),
  contactName: z.string(),
  brokerEmail: z.string(),
  expiresAt: z.string(),
  usedAt: z.string().nullable(),
  documentId: z.number().nullable(),
  createdAt: z.string(),
});
export type BrokerRequest = z.infer<typeof brokerRequestSchema>;

const brokerKeys = {
  contacts: () => [...credentialKeys.all, "broker-contacts"] as const,
  requests: () => [...credentialKeys.all, "broker-requests"] as const,
};

export const brokerContactsQuery = () =>
  queryOptions({
    queryKey: brokerKeys.contacts(),
    queryFn: () => api.get("/broker-contacts", z.array(brokerContactSchema)),
  });

export const brokerRequestsQuery = () =>
  queryOptions({
    queryKey: brokerKeys.requests(),
    queryFn: () => api.get("/broker-requests", z.array(brokerRequestSchema)),
  });

export const useBrokerContacts = () => useQuery(brokerContactsQuery());
export const useBrokerRequests = () => useQuery(brokerRequestsQuery());

export function useSaveBrokerContact() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: SaveBrokerContact) => api.put("/broker-contacts", input, brokerContactSchema),
    onSuccess: () => client.invalidateQueries({ queryKey: brokerKeys.contacts() }),
  });
}

export function useRequestBrokerCertificate() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: RequestBrokerCertificate) => api.post("/broker-requests", input, brokerRequestSchema),
    onSuccess: () => client.invalidateQueries({ queryKey: brokerKeys.requests() }),
  });
}
