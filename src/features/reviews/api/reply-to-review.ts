import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { reviewKeys } from "./review-keys.ts";
import { reviewDtoSchema } from "@shared/reviews/schemas.ts";

export const replyToReview = (reviewId: number, body: string) =>
  api.post(`/reviews/${reviewId}/reply`, { body }, reviewDtoSchema);

export function useReplyToReview() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ reviewId, body }: { reviewId: number; body: string }) => replyToReview(reviewId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: reviewKeys.all }),
  });
}
