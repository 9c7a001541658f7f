import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { reviewKeys } from "./review-keys.ts";
import { reviewSchema } from "./review-shapes.ts";

/** Flags a review for the platform's admin; nothing is hidden or deleted by it. */
export const reportReview = (reviewId: number, reason: string) =>
  api.post(`/reviews/${reviewId}/report`, { reason }, reviewSchema);

export function useReportReview() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ reviewId, reason }: { reviewId: number; reason: string }) =>
      reportReview(reviewId, reason),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: reviewKeys.all }),
  });
}
