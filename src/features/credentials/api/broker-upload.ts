import { queryOptions, useMutation, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";
import { uploadWithProgress } from "@/lib/upload-with-progress.ts";
import { credentialKeys } from "./credential-keys.ts";

const brokerUploadPageSchema = z.object({
  companyName: z.string(),
  coverageName: z.string(),
  certificateHolder: z.string().nullable(),
  expiresAt: z.string(),
});

const receivedSchema = z.object({
  received: z.literal(true),
  document: z.object({ name: z.string(), sizeBytes: z.number() }),
});

const tokenPath = (token: string) => `/broker-uploads/${encodeURIComponent(token)}`;

export const brokerUploadQuery = (token: string) =>
  queryOptions({
    queryKey: credentialKeys.brokerUpload(token),
    queryFn: () => api.get(tokenPath(token), brokerUploadPageSchema),
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
  return uploadWithProgress({ path: tokenPath(token), form, schema: receivedSchema, onProgress });
}

export const useSendBrokerCertificate = () => useMutation({ mutationFn: sendBrokerCertificate });
