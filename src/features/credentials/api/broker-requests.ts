import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import {
  brokerLinkStates,
  brokerRequestOrigins,
  holderRoles,
  type RequestBrokerCertificate,
  type SaveBrokerContact,
} from "@shared/credentials/broker-schemas.ts";
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
  coverageName: z.string(),
  holderRole: z.enum(holderRoles),
  origin: z.enum(brokerRequestOrigins),
  shopName: z.string().nullable(),
  linkState: z.enum(brokerLinkStates),
  reminders: z.array(z.object({ daysBefore: z.number(), sentAt: z.string() })),
});
export type BrokerRequest = z.infer<typeof brokerRequestSchema>;

const brokerCoverageSchema = z.object({
  typeCode: z.string(),
  coverageName: z.string(),
  broker: z
    .object({
      source: z.enum(["coverage", "company"]),
      agency: z.string(),
      contactName: z.string(),
      email: z.string(),
    })
    .nullable(),
  coverage: z
    .object({ credentialId: z.number(), state: z.string(), lapsesAt: z.string().nullable() })
    .nullable(),
  requests: z.array(brokerRequestSchema),
});
export type BrokerCoverage = z.infer<typeof brokerCoverageSchema>;

const brokerKeys = {
  all: [...credentialKeys.all, "broker"] as const,
  contacts: () => [...brokerKeys.all, "contacts"] as const,
  requests: () => [...brokerKeys.all, "requests"] as const,
  coverages: () => [...brokerKeys.all, "coverages"] as const,
};

export const brokerCoveragesQuery = () =>
  queryOptions({
    queryKey: brokerKeys.coverages(),
    queryFn: () => api.get("/broker-coverages", z.array(brokerCoverageSchema)),
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
    onSuccess: () => client.invalidateQueries({ queryKey: brokerKeys.all }),
  });
}

export function useRequestBrokerCertificate() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: RequestBrokerCertificate) => api.post("/broker-requests", input, brokerRequestSchema),
    onSuccess: () => client.invalidateQueries({ queryKey: brokerKeys.all }),
  });
}
