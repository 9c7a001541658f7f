import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { BaselineInput } from "@shared/standing/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { baselineDtoSchema } from "@shared/standing/schemas.ts";

export const saveBaseline = (input: BaselineInput) => api.put("/admin/baseline", input, baselineDtoSchema);

export function useSaveBaseline() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveBaseline,
    // The server recomputes every technician's standing in the same transaction, so any cached standing,
    // directory page or preview may now be out of date: refetch everything.
    onSuccess: () => queryClient.invalidateQueries(),
  });
}
