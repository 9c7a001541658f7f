import { z } from "zod";

// Run-time check of shared/reviews/schemas.ts ReviewDto.
export const reviewSchema = z.object({
  id: z.number(),
  workOrderId: z.number(),
  technicianId: z.number(),
  shopName: z.string(),
  authorName: z.string(),
  stars: z.number(),
  body: z.string(),
  reply: z.string().nullable(),
  repliedAt: z.string().nullable(),
  reported: z.boolean(),
  createdAt: z.string(),
});
export type Review = z.infer<typeof reviewSchema>;
