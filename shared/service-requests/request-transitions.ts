import type { EstimateStatus, RequestStatus } from "./schemas.ts";

export const requestActions = ["accept", "cancel", "expire"] as const;
export type RequestAction = (typeof requestActions)[number];
export const companyActionNames = ["estimate", "pass", "revise", "withdraw", "message"] as const;
export type CompanyAction = (typeof companyActionNames)[number];

/** A request's own moves: who may take each, the status it needs and the one it leaves. */
export const REQUEST_TRANSITIONS: Record<
  RequestAction,
  { by: "shop" | "job"; from: RequestStatus; to: RequestStatus }
> = {
  accept: { by: "shop", from: "open", to: "decided" },
  cancel: { by: "shop", from: "open", to: "cancelled" },
  expire: { by: "job", from: "open", to: "expired" },
};

/** What the shop may do with a request in a given status. */
export function shopActions(status: RequestStatus): RequestAction[] {
  return (Object.keys(REQUEST_TRANSITIONS) as RequestAction[]).filter(
    (a) => REQUEST_TRANSITIONS[a].by === "shop" && REQUEST_TRANSITIONS[a].from === status,
  );
}

/**
 * What an invited company may do: answer once (estimate or pass) while the request is open; revise or withdraw an
 * active estimate until the shop decides; send an estimate after a pass or a withdrawal (a change of mind). Messages
 * stay possible while the request is open; afterwards the thread is read-only.
 */
export function companyActions(
  status: RequestStatus,
  answer: "estimate" | "pass" | null,
  estimate: EstimateStatus | null,
): CompanyAction[] {
  if (status !== "open") return [];
  const actions: CompanyAction[] = ["message"];
  if (estimate === "active") actions.push("revise", "withdraw");
  else actions.push("estimate");
  if (answer === null) actions.push("pass");
  return actions;
}

export function companyMay(
  action: CompanyAction,
  status: RequestStatus,
  answer: "estimate" | "pass" | null,
  estimate: EstimateStatus | null,
): boolean {
  return companyActions(status, answer, estimate).includes(action);
}
