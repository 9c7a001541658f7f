import type { WorkOrderAction, WorkOrderSide, WorkOrderStatus } from "./schemas.ts";

/** Each action: the side that may take it, the status it needs, and the status it leaves. */
export const TRANSITIONS: Record<
  WorkOrderAction,
  { side: WorkOrderSide; from: WorkOrderStatus; to: WorkOrderStatus }
> = {
  accept: { side: "service", from: "requested", to: "accepted" },
  decline: { side: "service", from: "requested", to: "declined" },
  complete: { side: "service", from: "accepted", to: "completed" },
  confirm: { side: "shop", from: "completed", to: "confirmed" },
};

/** What a side may do next with a work order in a given status. */
export function availableActions(status: WorkOrderStatus, side: WorkOrderSide): WorkOrderAction[] {
  return (Object.keys(TRANSITIONS) as WorkOrderAction[]).filter(
    (a) => TRANSITIONS[a].side === side && TRANSITIONS[a].from === status,
  );
}
