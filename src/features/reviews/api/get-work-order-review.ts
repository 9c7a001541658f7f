import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { reviewKeys } from "./review-keys.ts";
import { workOrderReviewDtoSchema } from "@shared/reviews/schemas.ts";

/** The review of one work order, or null while it has none. */
export const getWorkOrderReview = async (workOrderId: number) =>
  (await api.get(`/work-orders/${workOrderId}/review`, workOrderReviewDtoSchema)).review;

export const workOrderReviewQuery = (workOrderId: number) =>
  queryOptions({
    queryKey: reviewKeys.workOrder(workOrderId),
    queryFn: () => getWorkOrderReview(workOrderId),
  });

export const useWorkOrderReview = (workOrderId: number, enabled = true) =>
  useQuery({ ...workOrderReviewQuery(workOrderId), enabled });
