import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import { type estimateInputSchema, serviceRequestDtoSchema } from "@shared/service-requests/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { serviceRequestKeys } from "./service-request-keys.ts";

export type EstimateFormInput = z.input<typeof estimateInputSchema>;

export type Answer =
  | { kind: "estimate"; input: EstimateFormInput }
  | { kind: "revise"; estimateId: number; input: EstimateFormInput }
  | { kind: "withdraw"; estimateId: number }
  | { kind: "pass"; reason: string };

/** A company's answer: an estimate, a revision, a withdrawal or a pass. A 409 names what blocks it. */
export function answerServiceRequest(id: number, answer: Answer) {
  const base = `/service-requests/${id}`;
  switch (answer.kind) {
    case "estimate":
      return api.post(`${base}/estimates`, answer.input, serviceRequestDtoSchema);
    case "revise":
      return api.put(`${base}/estimates/${answer.estimateId}`, answer.input, serviceRequestDtoSchema);
    case "withdraw":
      return api.post(`${base}/estimates/${answer.estimateId}/withdraw`, {}, serviceRequestDtoSchema);
    case "pass":
      return api.post(`${base}/pass`, { reason: answer.reason }, serviceRequestDtoSchema);
  }
}

export function useAnswerServiceRequest(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (answer: Answer) => answerServiceRequest(id, answer),
    onSuccess: (dto) => {
      queryClient.setQueryData(serviceRequestKeys.detail(id), dto);
      return queryClient.invalidateQueries({ queryKey: serviceRequestKeys.list() });
    },
  });
}
