import { z } from "zod";
import { multiLineText } from "../api/text.ts";
import { fieldMask } from "../api/field-mask.ts";
import { idParam } from "../credentials/schemas.ts";
import { profileReviewDtoSchema } from "../directory/directory-shapes.ts";
import { PUBLIC_REVIEW_FIELDS } from "../visibility/technician-visibility.ts";
import { selfRatingSignalKinds } from "./self-rating.ts";

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

// Response shapes: the server's DTO types are inferred from these and the client parses its answers with them.

/** A review as the parties to the job read it. */
export const reviewDtoSchema = z.object({
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
export type ReviewDto = z.infer<typeof reviewDtoSchema>;

/** The job's review, or null before the shop has written one. */
export const workOrderReviewDtoSchema = z.object({ review: reviewDtoSchema.nullable() });

/** What anyone outside the job reads of a review: the fields PUBLIC_REVIEW_FIELDS names in the shared visibility rule. */
export const publicReviewDtoSchema = profileReviewDtoSchema.pick(fieldMask(PUBLIC_REVIEW_FIELDS));
export type PublicReviewDto = z.infer<typeof publicReviewDtoSchema>;

export const technicianReviewsDtoSchema = z.object({
  /** Mean stars, null when there are none; always shown with its count. */
  average: z.number().nullable(),
  count: z.number(),
  items: z.array(publicReviewDtoSchema),
});
export type TechnicianReviewsDto = z.infer<typeof technicianReviewsDtoSchema>;

/** A review the admin should look at: reported by a party, or flagged as possible self-rating, or both. */
export const reportedReviewDtoSchema = reviewDtoSchema.extend({
  reportedAt: z.string().nullable(),
  selfRatingSignals: z.array(z.enum(selfRatingSignalKinds)),
  excluded: z.object({ at: z.string(), reason: z.string(), by: z.string() }).nullable(),
  /** An admin read the report and kept the review counted as it is. */
  kept: z.object({ at: z.string(), by: z.string() }).nullable(),
  reportReason: z.string(),
  reportedBy: z.object({ id: z.number(), name: z.string() }),
  technicianName: z.string(),
});
export type ReportedReviewDto = z.infer<typeof reportedReviewDtoSchema>;
