import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { credentialKeys } from "./credential-keys.ts";
import { credentialDtoSchema } from "@shared/credentials/credential-shapes.ts";

export type EditCredentialFieldsInput = { id: number; fields: Record<string, unknown> };

/** A reviewer's correction before deciding; the server keeps the before and after in the audit trail. */
export const editCredentialFields = ({ id, fields }: EditCredentialFieldsInput) =>
  api.patch(`/credentials/${id}/fields`, { fields }, credentialDtoSchema);

export function useEditCredentialFields() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: editCredentialFields,
    onSuccess: (_data, { id }) => queryClient.invalidateQueries({ queryKey: credentialKeys.detail(id) }),
  });
}
