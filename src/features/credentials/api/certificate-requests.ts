import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import {
  shopCertificateRequestDtoSchema,
  shopCertificateRequestsDtoSchema,
  type AskForCertificate,
  type ShopCertificateRequestDto,
} from "@shared/credentials/broker-schemas.ts";
import { api } from "@/lib/api-client.ts";
import { credentialKeys } from "./credential-keys.ts";

export type ShopCertificateRequest = ShopCertificateRequestDto;

const certificateRequestKeys = {
  list: () => [...credentialKeys.all, "certificate-requests"] as const,
};

export const certificateRequestsQuery = () =>
  queryOptions({
    queryKey: certificateRequestKeys.list(),
    queryFn: () => api.get("/certificate-requests", shopCertificateRequestsDtoSchema),
  });

export const useCertificateRequests = () => useQuery(certificateRequestsQuery());

export function useAskForCertificate() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: AskForCertificate) =>
      api.post("/certificate-requests", input, shopCertificateRequestDtoSchema),
    onSuccess: () => client.invalidateQueries({ queryKey: certificateRequestKeys.list() }),
  });
}
