import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { brokerLinkStates, holderRoles, type AskForCertificate } from "@shared/credentials/broker-schemas.ts";
import { api } from "@/lib/api-client.ts";
import { credentialKeys } from "./credential-keys.ts";

const shopRequestSchema = z.object({
  id: z.number(),
  companyName: z.string(),
  coverageName: z.string(),
  holderRole: z.enum(holderRoles),
  linkState: z.enum(brokerLinkStates),
  createdAt: z.string(),
  expiresAt: z.string(),
  receivedAt: z.string().nullable(),
  verifiedAt: z.string().nullable(),
});
export type ShopCertificateRequest = z.infer<typeof shopRequestSchema>;

const shopRequestsSchema = z.object({
  requests: z.array(shopRequestSchema),
  companies: z.array(z.object({ id: z.number(), name: z.string() })),
  coverages: z.array(z.object({ code: z.string(), name: z.string() })),
});

const certificateRequestKeys = {
  list: () => [...credentialKeys.all, "certificate-requests"] as const,
};

export const certificateRequestsQuery = () =>
  queryOptions({
    queryKey: certificateRequestKeys.list(),
    queryFn: () => api.get("/certificate-requests", shopRequestsSchema),
  });

export const useCertificateRequests = () => useQuery(certificateRequestsQuery());

export function useAskForCertificate() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: AskForCertificate) => api.post("/certificate-requests", input, shopRequestSchema),
    onSuccess: () => client.invalidateQueries({ queryKey: certificateRequestKeys.list() }),
  });
}
