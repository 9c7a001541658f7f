import { useMutation, useQueryClient } from "@tanstack/react-query";
import { type SendAgain, workOrderDtoSchema } from "@shared/work-orders/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { workOrderKeys } from "./work-order-keys.ts";

/** A declined job copied into a new work order; the answer is the new one. */
export const sendWorkOrderAgain = (id: number, input: SendAgain) =>
  api.post(`/work-orders/${id}/send-again`, input, workOrderDtoSchema);

export function useSendWorkOrderAgain(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SendAgain) => sendWorkOrderAgain(id, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: workOrderKeys.all }),
  });
}
