import type { WorkOrderAction, WorkOrderSide, WorkOrderStatus } from "./schemas.ts";

/**
 * The work order's whole life in one table: each action, the side that may take it, the statuses it may start from and
 * the status it leaves. A dispute is settled either by the service side completing again (with new hours) or by the
 * shop confirming after all; a rating waits until the work order is confirmed.
 */
export const TRANSITIONS: Record<
  WorkOrderAction,
  { side: WorkOrderSide; from: readonly WorkOrderStatus[]; to: WorkOrderStatus }
> = {
  accept: { side: "service", from: ["requested"], to: "accepted" },
  decline: { side: "service", from: ["requested"], to: "declined" },
  complete: { side: "service", from: ["accepted", "disputed"], to: "completed" },
  confirm: { side: "shop", from: ["completed", "disputed"], to: "confirmed" },
  dispute: { side: "shop", from: ["completed"], to: "disputed" },
  cancel: { side: "shop", from: ["requested", "accepted"], to: "cancelled" },
};

/** What a side may do next with a work order in a given status. */
export function availableActions(status: WorkOrderStatus, side: WorkOrderSide): WorkOrderAction[] {
  return (Object.keys(TRANSITIONS) as WorkOrderAction[]).filter(
    (a) => TRANSITIONS[a].side === side && TRANSITIONS[a].from.includes(status),
  );
}

/** Whether an action may start from a status (whoever asks). */
export function canMove(action: WorkOrderAction, status: WorkOrderStatus): boolean {
  return TRANSITIONS[action].from.includes(status);
}

/** After a decline the shop may send the same job on, to another technician or to the same one on the proposed date. */
export function canSendAgain(status: WorkOrderStatus, side: WorkOrderSide): boolean {
  return side === "shop" && status === "declined";
}

/**
 * The street address, on-site contact, PO, not-to-exceed amount and induction note reach the service side only once it
 * has taken the job: a request may go to several technicians in turn, and none of them needs the shop's purchasing
 * details or the contact's phone number to decide.
 */
export function seesOnSiteDetails(side: WorkOrderSide, acceptedAt: Date | string | null): boolean {
  return side === "shop" || acceptedAt !== null;
}
