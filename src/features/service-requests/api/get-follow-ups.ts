import { queryOptions } from "@tanstack/react-query";
import { z } from "zod";
import { followUpRowDtoSchema } from "@shared/service-requests/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { serviceRequestKeys } from "./service-request-keys.ts";

export const getFollowUps = () => api.get("/service-requests/follow-up", z.array(followUpRowDtoSchema));

export const followUpsQuery = () =>
  queryOptions({ queryKey: serviceRequestKeys.followUp(), queryFn: getFollowUps });
