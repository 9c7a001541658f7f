import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { requirementSetKeys } from "./requirement-set-keys.ts";

export const archiveRequirementSet = (requirementSetId: number) =>
  api.send("DELETE", `/requirement-sets/${requirementSetId}`);

export function useArchiveRequirementSet() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: archiveRequirementSet,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: requirementSetKeys.all }),
  });
}
