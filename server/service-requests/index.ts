export { serviceRequestRoutes } from "./routes.ts";
export { followUpServiceRequests, type FollowUpReport, type FollowUpSettings } from "./follow-up.ts";
export { companyResponseMedians, invitationsInWindowSql, medianOfInvitations } from "./response-times.ts";
export { routeRequest, type RoutingCriteria } from "./routing.ts";
export { raiseServiceRequest } from "./raise-request.ts";
