import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { WriteReview } from "@shared/reviews/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { reviewKeys } from "./review-keys.ts";
import { reviewDtoSchema } from "@shared/reviews/schemas.ts";

export const writeReview = (workOrderId: number, input: WriteReview) =>
  api.post(`/work-orders/${workOrderId}/review`, input, reviewDtoSchema);

export function useWriteReview(workOrderId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: WriteReview) => writeReview(workOrderId, input),
    // Ratings feed the directory's ranking, so every cached search is stale too.
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: reviewKeys.all }),
        queryClient.invalidateQueries({ queryKey: ["directory"] }),
      ]),
  });
}
