import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import type { editCredentialTypeSchema } from "@shared/credentials/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { credentialKeys } from "./credential-keys.ts";
import { credentialTypeDtoSchema } from "@shared/credentials/credential-shapes.ts";

export type EditCredentialTypeInput = z.infer<typeof editCredentialTypeSchema> & { code: string };

export const editCredentialType = ({ code, ...changes }: EditCredentialTypeInput) =>
  api.patch(`/admin/credential-types/${encodeURIComponent(code)}`, changes, credentialTypeDtoSchema);

export function useEditCredentialType() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: editCredentialType,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: credentialKeys.types() }),
  });
}
