import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";
import { reviewKeys } from "./review-keys.ts";
import { reviewSchema } from "./review-shapes.ts";

/** The review of one work order, or null while it has none. */
export const getWorkOrderReview = async (workOrderId: number) =>
  (await api.get(`/work-orders/${workOrderId}/review`, z.object({ review: reviewSchema.nullable() }))).review;

export const workOrderReviewQuery = (workOrderId: number) =>
  queryOptions({
    queryKey: reviewKeys.workOrder(workOrderId),
    queryFn: () => getWorkOrderReview(workOrderId),
  });

export const useWorkOrderReview = (workOrderId: number, enabled = true) =>
  useQuery({ ...workOrderReviewQuery(workOrderId), enabled });
