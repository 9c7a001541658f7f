import { queryOptions, useMutation, useQuery } from "@tanstack/react-query";
import {
  brokerUploadPageDtoSchema,
  brokerUploadReceivedDtoSchema,
} from "@shared/credentials/broker-schemas.ts";
import { api } from "@/lib/api-client.ts";
import { uploadWithProgress } from "@/lib/upload-with-progress.ts";
import { credentialKeys } from "./credential-keys.ts";

const tokenPath = (token: string) => `/broker-uploads/${encodeURIComponent(token)}`;

export const brokerUploadQuery = (token: string) =>
  queryOptions({
    queryKey: credentialKeys.brokerUpload(token),
    queryFn: () => api.get(tokenPath(token), brokerUploadPageDtoSchema),
    // A spent or unknown link stays so; asking again only spends the address's allowance.
    retry: false,
  });

export const useBrokerUpload = (token: string) => useQuery(brokerUploadQuery(token));

export function sendBrokerCertificate({
  token,
  file,
  onProgress,
}: {
  token: string;
  file: File;
  onProgress?: (fraction: number) => void;
}) {
  const form = new FormData();
  form.set("file", file);
  return uploadWithProgress({
    path: tokenPath(token),
    form,
    schema: brokerUploadReceivedDtoSchema,
    onProgress,
  });
}

export const useSendBrokerCertificate = () => useMutation({ mutationFn: sendBrokerCertificate });
