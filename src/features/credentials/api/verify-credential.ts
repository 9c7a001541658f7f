import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { credentialKeys } from "./credential-keys.ts";
import { credentialDtoSchema } from "@shared/credentials/credential-shapes.ts";

export type VerifyCredentialInput = { id: number; fields?: Record<string, unknown> | undefined };

export const verifyCredential = ({ id, fields }: VerifyCredentialInput) =>
  api.post(`/credentials/${id}/verify`, fields ? { fields } : {}, credentialDtoSchema);

export function useVerifyCredential() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: verifyCredential,
    // A decision changes the queue, the credential and (through standing) every page that shows it.
    onSettled: () => queryClient.invalidateQueries({ queryKey: credentialKeys.all }),
  });
}
