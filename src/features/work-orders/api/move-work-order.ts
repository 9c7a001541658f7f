import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { CompleteWorkOrder } from "@shared/work-orders/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { workOrderKeys } from "./work-order-keys.ts";
import { workOrderSchema } from "./work-order-shapes.ts";

/** One step of the work order's life; the server decides whether the caller's side may take it. */
export type WorkOrderMove =
  | { action: "accept" }
  | { action: "decline"; reason: string }
  | { action: "complete"; input: CompleteWorkOrder }
  | { action: "confirm" };

const bodyOf = (move: WorkOrderMove) =>
  move.action === "decline" ? { reason: move.reason } : move.action === "complete" ? move.input : {};

export const moveWorkOrder = (id: number, move: WorkOrderMove) =>
  api.post(`/work-orders/${id}/${move.action}`, bodyOf(move), workOrderSchema);

export function useMoveWorkOrder(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (move: WorkOrderMove) => moveWorkOrder(id, move),
    onSuccess: (workOrder) => {
      queryClient.setQueryData(workOrderKeys.detail(id), workOrder);
      return queryClient.invalidateQueries({ queryKey: workOrderKeys.all });
    },
  });
}
