import { z } from "zod";
import type {
  ComparisonDto,
  FollowUpRowDto,
  RequestMessageDto,
  RoutingPreviewDto,
  ServiceRequestDto,
  ServiceRequestSummaryDto,
} from "@shared/service-requests/schemas.ts";

// The server's DTO types are shared; the client checks the identifying fields and trusts the rest of the shape.
const withId = <T extends object>(key: string) =>
  z.custom<T>(
    (v) => typeof v === "object" && v !== null && typeof (v as Record<string, unknown>)[key] === "number",
  );

export const serviceRequestSchema = withId<ServiceRequestDto>("id");
export const serviceRequestListSchema = z.array(withId<ServiceRequestSummaryDto>("id"));
export const comparisonSchema = withId<ComparisonDto>("requestId");
export const previewSchema = withId<RoutingPreviewDto>("count");
export const followUpListSchema = z.array(withId<FollowUpRowDto>("requestId"));
export const requestMessageSchema = withId<RequestMessageDto>("id");
export const requestThreadSchema = z.array(requestMessageSchema);
export const attachmentAddedSchema = z.object({ id: z.number(), url: z.string() });
