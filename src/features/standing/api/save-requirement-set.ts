import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { RequirementSetInput } from "@shared/standing/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { requirementSetKeys } from "./requirement-set-keys.ts";
import { requirementSetDtoSchema } from "@shared/standing/schemas.ts";

type SaveRequirementSet = { requirementSetId?: number | undefined; input: RequirementSetInput };

/** Defines a new set, or revises one when `requirementSetId` is given. */
export const saveRequirementSet = ({ requirementSetId, input }: SaveRequirementSet) =>
  requirementSetId
    ? api.put(`/requirement-sets/${requirementSetId}`, input, requirementSetDtoSchema)
    : api.post("/requirement-sets", input, requirementSetDtoSchema);

export function useSaveRequirementSet() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveRequirementSet,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: requirementSetKeys.all }),
  });
}
