import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { reviewKeys } from "./review-keys.ts";
import { reviewSchema } from "./review-shapes.ts";

export const replyToReview = (reviewId: number, body: string) =>
  api.post(`/reviews/${reviewId}/reply`, { body }, reviewSchema);

export function useReplyToReview() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ reviewId, body }: { reviewId: number; body: string }) => replyToReview(reviewId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: reviewKeys.all }),
  });
}
