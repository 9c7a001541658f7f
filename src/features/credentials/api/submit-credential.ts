import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { SubmitCredential } from "@shared/credentials/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { credentialKeys } from "./credential-keys.ts";
import { credentialDtoSchema } from "@shared/credentials/credential-shapes.ts";

/** Step 2 of the upload: the checked fields become a credential awaiting verification. */
export const submitCredential = (input: SubmitCredential) =>
  api.post("/credentials", input, credentialDtoSchema);

export function useSubmitCredential() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: submitCredential,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: credentialKeys.all }),
  });
}
