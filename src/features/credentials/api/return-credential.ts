import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ReturnCredential } from "@shared/credentials/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { credentialKeys } from "./credential-keys.ts";
import { credentialDtoSchema } from "@shared/credentials/credential-shapes.ts";

export type ReturnCredentialInput = ReturnCredential & { id: number };

export const returnCredential = ({ id, reason }: ReturnCredentialInput) =>
  api.post(`/credentials/${id}/return`, { reason }, credentialDtoSchema);

export function useReturnCredential() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: returnCredential,
    onSettled: () => queryClient.invalidateQueries({ queryKey: credentialKeys.all }),
  });
}
