import { useMutation } from "@tanstack/react-query";
import type { z } from "zod";
import { routingPreviewDtoSchema, type raiseServiceRequestSchema } from "@shared/service-requests/schemas.ts";
import { api } from "@/lib/api-client.ts";

export type ServiceRequestInput = z.input<typeof raiseServiceRequestSchema>;

/** How many companies the request would reach, before it is sent. */
export const previewServiceRequest = (input: ServiceRequestInput) =>
  api.post("/service-requests/preview", input, routingPreviewDtoSchema);

export const usePreviewServiceRequest = () => useMutation({ mutationFn: previewServiceRequest });
