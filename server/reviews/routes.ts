import { z } from "zod";
import {
  excludeReviewSchema,
  replyToReviewSchema,
  reportedReviewDtoSchema,
  reportReviewSchema,
  reviewDtoSchema,
  reviewParamsSchema,
  technicianReviewsDtoSchema,
  technicianReviewsParamsSchema,
  technicianReviewsQuerySchema,
  workOrderReviewDtoSchema,
  writeReviewSchema,
} from "../../shared/reviews/schemas.ts";
import { workOrderParamsSchema } from "../../shared/work-orders/schemas.ts";
import { createRoutes } from "../http/route.ts";
import {
  canModerateReviews,
  canReadTechnicianReviews,
  canReadWorkOrderReview,
  canReplyToReview,
  canReportReview,
  canWriteReview,
} from "./policy.ts";
import { writeReview } from "./write-review.ts";
import { excludeReviewFromScore, keepReportedReview } from "./exclude-review.ts";
import { replyToReview, reportReview } from "./answer-review.ts";
import { findWorkOrderReview, listReportedReviews, listTechnicianReviews } from "./find-reviews.ts";

export const reviewRoutes = createRoutes("/api");

reviewRoutes.post(
  "/work-orders/:workOrderId/review",
  {
    allow: canWriteReview,
    params: workOrderParamsSchema,
    body: writeReviewSchema,
    response: reviewDtoSchema,
    status: 201,
  },
  (req, _res, { params, body }) => writeReview(req.user!, params.workOrderId, body),
);

reviewRoutes.get(
  "/work-orders/:workOrderId/review",
  { allow: canReadWorkOrderReview, params: workOrderParamsSchema, response: workOrderReviewDtoSchema },
  (_req, _res, { params }) => findWorkOrderReview(params.workOrderId),
);

reviewRoutes.post(
  "/reviews/:reviewId/reply",
  {
    allow: canReplyToReview,
    params: reviewParamsSchema,
    body: replyToReviewSchema,
    response: reviewDtoSchema,
  },
  (req, _res, { params, body }) => replyToReview(req.user!, params.reviewId, body.body),
);

reviewRoutes.post(
  "/reviews/:reviewId/report",
  { allow: canReportReview, params: reviewParamsSchema, body: reportReviewSchema, response: reviewDtoSchema },
  (req, _res, { params, body }) => reportReview(req.user!, params.reviewId, body.reason),
);

reviewRoutes.get(
  "/admin/reviews/reported",
  { allow: canModerateReviews, response: z.array(reportedReviewDtoSchema) },
  () => listReportedReviews(),
);

reviewRoutes.post(
  "/admin/reviews/:reviewId/exclude",
  {
    allow: canModerateReviews,
    params: reviewParamsSchema,
    body: excludeReviewSchema,
    response: reportedReviewDtoSchema,
  },
  (req, _res, { params, body }) => excludeReviewFromScore(req.user!, params.reviewId, body.reason),
);

reviewRoutes.post(
  "/admin/reviews/:reviewId/keep",
  { allow: canModerateReviews, params: reviewParamsSchema, response: reportedReviewDtoSchema },
  (req, _res, { params }) => keepReportedReview(req.user!, params.reviewId),
);

reviewRoutes.get(
  "/technicians/:technicianId/reviews",
  {
    allow: canReadTechnicianReviews,
    params: technicianReviewsParamsSchema,
    query: technicianReviewsQuerySchema,
    response: technicianReviewsDtoSchema,
  },
  (_req, _res, { params, query }) => listTechnicianReviews(params.technicianId, query),
);
