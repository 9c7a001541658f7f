import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";
import { reviewSchema } from "./review-shapes.ts";

export const reportedReviewKeys = {
  all: ["reported-reviews"] as const,
  list: () => [...reportedReviewKeys.all, "list"] as const,
};

// Run-time check of shared/reviews/schemas.ts ReportedReviewDto: a review as the public list shows it (without its
// own reported flag, every one here being reported), with the report and its settlement.
export const reportedReviewSchema = reviewSchema.omit({ reported: true }).extend({
  technicianName: z.string(),
  reportedAt: z.string().nullable(),
  reportReason: z.string(),
  reportedBy: z.object({ id: z.number(), name: z.string() }),
  selfRatingSignals: z.array(z.enum(["email_domain", "phone", "address"])),
  excluded: z.object({ at: z.string(), reason: z.string(), by: z.string() }).nullable(),
  kept: z.object({ at: z.string(), by: z.string() }).nullable(),
});
export type ReportedReview = z.infer<typeof reportedReviewSchema>;

export const getReportedReviews = () => api.get("/admin/reviews/reported", z.array(reportedReviewSchema));

export const reportedReviewsQuery = () =>
  queryOptions({ queryKey: reportedReviewKeys.list(), queryFn: getReportedReviews, staleTime: 0 });

export const useReportedReviews = () => useQuery(reportedReviewsQuery());
