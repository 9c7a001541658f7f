import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client.ts";
import { serviceRequestKeys } from "./service-request-keys.ts";
import { serviceRequestDtoSchema } from "@shared/service-requests/schemas.ts";

export type Decision = { kind: "accept"; estimateId: number } | { kind: "cancel"; reason: string };

/** The shop's decision; of two at once, one wins and the other gets a 409. */
export function decideServiceRequest(id: number, decision: Decision) {
  return decision.kind === "accept"
    ? api.post(`/service-requests/${id}/estimates/${decision.estimateId}/accept`, {}, serviceRequestDtoSchema)
    : api.post(`/service-requests/${id}/cancel`, { reason: decision.reason }, serviceRequestDtoSchema);
}

export function useDecideServiceRequest(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (decision: Decision) => decideServiceRequest(id, decision),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: serviceRequestKeys.all }),
  });
}
