import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { reportedReviewDtoSchema } from "@shared/reviews/schemas.ts";
import { reportedReviewKeys } from "./get-reported-reviews.ts";

/** Settles a report by keeping the review counted as it is. */
export const keepReview = (reviewId: number) =>
  api.post(`/admin/reviews/${reviewId}/keep`, {}, reportedReviewDtoSchema);

export function useKeepReview() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: keepReview,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: reportedReviewKeys.all }),
  });
}
