import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";
import { reportedReviewDtoSchema, type ReportedReviewDto } from "@shared/reviews/schemas.ts";

export const reportedReviewKeys = {
  all: ["reported-reviews"] as const,
  list: () => [...reportedReviewKeys.all, "list"] as const,
};

export type ReportedReview = ReportedReviewDto;

export const getReportedReviews = () => api.get("/admin/reviews/reported", z.array(reportedReviewDtoSchema));

export const reportedReviewsQuery = () =>
  queryOptions({ queryKey: reportedReviewKeys.list(), queryFn: getReportedReviews, staleTime: 0 });

export const useReportedReviews = () => useQuery(reportedReviewsQuery());
