import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { reviewKeys } from "./review-keys.ts";
import { reviewDtoSchema } from "@shared/reviews/schemas.ts";

/** Flags a review for the platform's admin; nothing is hidden or deleted by it. */
export const reportReview = (reviewId: number, reason: string) =>
  api.post(`/reviews/${reviewId}/report`, { reason }, reviewDtoSchema);

export function useReportReview() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ reviewId, reason }: { reviewId: number; reason: string }) =>
      reportReview(reviewId, reason),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: reviewKeys.all }),
  });
}
