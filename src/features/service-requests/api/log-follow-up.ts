import { useMutation, useQueryClient } from "@tanstack/react-query";
import { followUpLoggedDtoSchema } from "@shared/service-requests/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { serviceRequestKeys } from "./service-request-keys.ts";

export const logFollowUp = ({ requestId, note }: { requestId: number; note: string }) =>
  api.post(`/service-requests/${requestId}/follow-up`, { note }, followUpLoggedDtoSchema);

export function useLogFollowUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: logFollowUp,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: serviceRequestKeys.followUp() }),
  });
}
