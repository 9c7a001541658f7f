import type { SelfRatingSignal } from "./self-rating.ts";
import { z } from "zod";
import { multiLineText } from "../api/text.ts";
import { idParam } from "../credentials/schemas.ts";
import type { ProfileReviewDto } from "../directory/schemas.ts";
import type { PUBLIC_REVIEW_FIELDS } from "../visibility/technician-visibility.ts";

export const reviewParamsSchema = z.object({ reviewId: idParam });
export const technicianReviewsParamsSchema = z.object({ technicianId: idParam });

export const MIN_STARS = 1;
export const MAX_STARS = 5;

/** Only the stars and the words come from the client; the work order decides who is rated and by whom. */
export const writeReviewSchema = z.object({
  stars: z.number().int().min(MIN_STARS).max(MAX_STARS),
  body: multiLineText().trim().min(10, "Say something about the job (at least 10 characters)").max(5000),
});
export type WriteReview = z.infer<typeof writeReviewSchema>;

export const replyToReviewSchema = z.object({
  body: multiLineText().trim().min(2, "Write a reply").max(5000),
});

export const reportReviewSchema = z.object({
  reason: multiLineText().trim().min(5, "Say what is wrong with it (at least 5 characters)").max(1000),
});

export const excludeReviewSchema = z.object({
  reason: multiLineText()
    .trim()
    .min(5, "Say why it is left out of the score (at least 5 characters)")
    .max(1000),
});

export const technicianReviewsQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(100).default(20),
  /** Keyset paging: reviews older than this id. */
  before: idParam.optional(),
});

export interface ReviewDto {
  id: number;
  workOrderId: number;
  technicianId: number;
  shopName: string;
  authorName: string;
  stars: number;
  body: string;
  reply: string | null;
  repliedAt: string | null;
  reported: boolean;
  createdAt: string;
}

/** What anyone outside the job reads of a review: the fields PUBLIC_REVIEW_FIELDS names in the shared visibility rule. */
export type PublicReviewDto = Pick<ProfileReviewDto, (typeof PUBLIC_REVIEW_FIELDS)[number]>;

export interface TechnicianReviewsDto {
  /** Mean stars, null when there are none; always shown with its count. */
  average: number | null;
  count: number;
  items: PublicReviewDto[];
}

/** A review the admin should look at: reported by a party, or flagged as possible self-rating, or both. */
export interface ReportedReviewDto extends ReviewDto {
  reportedAt: string | null;
  selfRatingSignals: SelfRatingSignal[];
  excluded: { at: string; reason: string; by: string } | null;
  /** An admin read the report and kept the review counted as it is. */
  kept: { at: string; by: string } | null;
  reportReason: string;
  reportedBy: { id: number; name: string };
  technicianName: string;
}
