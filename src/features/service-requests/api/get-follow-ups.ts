import { queryOptions } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { serviceRequestKeys } from "./service-request-keys.ts";
import { followUpListSchema } from "./service-request-shapes.ts";

export const getFollowUps = () => api.get("/service-requests/follow-up", followUpListSchema);

export const followUpsQuery = () =>
  queryOptions({ queryKey: serviceRequestKeys.followUp(), queryFn: getFollowUps });
