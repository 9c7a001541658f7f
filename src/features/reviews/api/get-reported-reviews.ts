import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";

export const reportedReviewKeys = {
  all: ["reported-reviews"] as const,
  list: () => [...reportedReviewKeys.all, "list"] as const,
};

// Run-time check of shared/reviews/schemas.ts ReportedReviewDto.
export const reportedReviewSchema = z.object({
  id: z.number(),
  workOrderId: z.number(),
  technicianId: z.number(),
  technicianName: z.string(),
  shopName: z.string(),
  authorName: z.string(),
  stars: z.number(),
  body: z.string(),
  reply: z.string().nullable(),
  repliedAt: z.string().nullable(),
  createdAt: z.string(),
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
