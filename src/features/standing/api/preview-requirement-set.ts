import { keepPreviousData, useQuery } from "@tanstack/react-query";
import type { RequirementSetInput } from "@shared/standing/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { requirementSetKeys } from "./requirement-set-keys.ts";
import { requirementSetPreviewDtoSchema } from "@shared/standing/schemas.ts";

/** How many technicians would meet a set today, computed from the draft (nothing is saved). */
export const previewRequirementSet = (input: RequirementSetInput) =>
  api.post("/requirement-sets/preview", input, requirementSetPreviewDtoSchema);

/** Idle while the draft does not pass the shared schema; keeps the last count on screen while a new one loads. */
export const useRequirementSetPreview = (input: RequirementSetInput | null) =>
  useQuery({
    queryKey: requirementSetKeys.preview(input ?? { name: "", requirements: [] }),
    queryFn: () => previewRequirementSet(input!),
    enabled: input !== null,
    placeholderData: keepPreviousData,
    staleTime: 60_000,
  });
