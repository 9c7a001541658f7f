import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { RequirementSetInput } from "@shared/standing/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { requirementSetKeys } from "./requirement-set-keys.ts";
import { requirementSetSchema } from "./requirement-set-shapes.ts";

type SaveRequirementSet = { requirementSetId?: number | undefined; input: RequirementSetInput };

/** Defines a new set, or revises one when `requirementSetId` is given. */
export const saveRequirementSet = ({ requirementSetId, input }: SaveRequirementSet) =>
  requirementSetId
    ? api.put(`/requirement-sets/${requirementSetId}`, input, requirementSetSchema)
    : api.post("/requirement-sets", input, requirementSetSchema);

export function useSaveRequirementSet() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveRequirementSet,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: requirementSetKeys.all }),
  });
}
