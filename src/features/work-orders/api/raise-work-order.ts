import { useMutation, useQueryClient } from "@tanstack/react-query";
import { type RaiseWorkOrder, workOrderDtoSchema } from "@shared/work-orders/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { workOrderKeys } from "./work-order-keys.ts";

/** A 409 answer names each requirement the technician does not meet right now. */
export const raiseWorkOrder = (input: RaiseWorkOrder) => api.post("/work-orders", input, workOrderDtoSchema);

export function useRaiseWorkOrder() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: raiseWorkOrder,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: workOrderKeys.all }),
  });
}
