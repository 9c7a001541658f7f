import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { api } from "@/lib/api-client.ts";
import { serviceRequestKeys } from "./service-request-keys.ts";

export const logFollowUp = ({ requestId, note }: { requestId: number; note: string }) =>
  api.post(`/service-requests/${requestId}/follow-up`, { note }, z.object({ requestId: z.number() }));

export function useLogFollowUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: logFollowUp,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: serviceRequestKeys.followUp() }),
  });
}
