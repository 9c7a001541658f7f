import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { SubmitCoverages } from "@shared/credentials/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { credentialKeys } from "./credential-keys.ts";
import { submittedCoveragesDtoSchema } from "@shared/credentials/credential-shapes.ts";

/** Step 2 for a certificate of insurance: every confirmed coverage in one request, saved together or not at all. */
export const submitCoverages = (input: SubmitCoverages) =>
  api.post("/credentials/coverages", input, submittedCoveragesDtoSchema);

export function useSubmitCoverages() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: submitCoverages,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: credentialKeys.all }),
  });
}
