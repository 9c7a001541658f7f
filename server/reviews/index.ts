export { reviewRoutes } from "./routes.ts";
export { JobReview, initReviewModel } from "./model.ts";
