import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { reportedReviewDtoSchema } from "@shared/reviews/schemas.ts";
import { reportedReviewKeys } from "./get-reported-reviews.ts";

/** Leaves a flagged review out of the technician's score; the review itself stays on the record. */
export const excludeReview = (reviewId: number, reason: string) =>
  api.post(`/admin/reviews/${reviewId}/exclude`, { reason }, reportedReviewDtoSchema);

export function useExcludeReview() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ reviewId, reason }: { reviewId: number; reason: string }) =>
      excludeReview(reviewId, reason),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: reportedReviewKeys.all }),
  });
}
