import { useMutation, useQueryClient } from "@tanstack/react-query";
import {
  type AcceptWorkOrder,
  type CompleteWorkOrder,
  type DeclineWorkOrder,
  workOrderDtoSchema,
} from "@shared/work-orders/schemas.ts";
import { api } from "@/lib/api-client.ts";
import { workOrderKeys } from "./work-order-keys.ts";

/** One step of the work order's life; the server decides whether the caller's side may take it. */
export type WorkOrderMove =
  | { action: "accept"; input: AcceptWorkOrder }
  | { action: "decline"; input: DeclineWorkOrder }
  | { action: "complete"; input: CompleteWorkOrder }
  | { action: "confirm" }
  | { action: "dispute"; reason: string }
  | { action: "cancel"; reason: string };

const bodyOf = (move: WorkOrderMove) =>
  "input" in move ? move.input : "reason" in move ? { reason: move.reason } : {};

export const moveWorkOrder = (id: number, move: WorkOrderMove) =>
  api.post(`/work-orders/${id}/${move.action}`, bodyOf(move), workOrderDtoSchema);

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
