import type { Transaction } from "sequelize";
import type {
  EstimateStatus,
  MachineState,
  RequestKind,
  RequestStatus,
} from "../../shared/service-requests/schemas.ts";
import { AppError } from "../http/app-error.ts";
import type { SignedInUser } from "../http/policy.ts";
import { select, selectOne } from "./sql.ts";

export interface RequestRow {
  id: number;
  shop_company_id: number;
  site_id: number;
  equipment_id: number | null;
  requirement_set_id: number | null;
  kind: RequestKind;
  machine_state: MachineState;
  timing: "soonest" | "window";
  window_start: string | null;
  window_end: string | null;
  technology: string;
  builder: string | null;
  control_family: string | null;
  problem: string;
  status: RequestStatus;
  cancel_reason: string | null;
  accepted_estimate_id: number | null;
  work_order_id: number | null;
  created_by: number;
  sent_at: Date;
  decided_at: Date | null;
}

export interface InvitationRow {
  id: number;
  request_id: number;
  company_id: number;
  company_name: string;
  source: "routing" | "buyer";
  invited_at: Date;
  first_answer_at: Date | null;
  answer: "estimate" | "pass" | null;
  pass_reason: string | null;
}

export interface EstimateRow {
  id: number;
  request_id: number;
  company_id: number;
  status: EstimateStatus;
  revision: number;
}

export type Side = "shop" | "service" | "coordinator";

export const findRequest = (id: number, transaction?: Transaction, lock = false) =>
  selectOne<RequestRow>(
    `SELECT * FROM service_requests WHERE id = $1${lock ? " FOR UPDATE" : ""}`,
    [id],
    transaction,
  );

export const findInvitation = (requestId: number, companyId: number, transaction?: Transaction) =>
  selectOne<InvitationRow>(
    `SELECT i.*, c.name AS company_name FROM service_request_invitations i JOIN companies c ON c.id = i.company_id
      WHERE i.request_id = $1 AND i.company_id = $2`,
    [requestId, companyId],
    transaction,
  );

export const listInvitations = (requestId: number, transaction?: Transaction) =>
  select<InvitationRow>(
    `SELECT i.*, c.name AS company_name FROM service_request_invitations i JOIN companies c ON c.id = i.company_id
      WHERE i.request_id = $1 ORDER BY i.id`,
    [requestId],
    transaction,
  );

export const findEstimateOf = (requestId: number, companyId: number, transaction?: Transaction) =>
  selectOne<EstimateRow>(
    "SELECT * FROM service_request_estimates WHERE request_id = $1 AND company_id = $2",
    [requestId, companyId],
    transaction,
  );

/** Which side the user is on for this request; null = none (answered as a missing request). */
export async function sideFor(user: SignedInUser, requestId: number): Promise<Side | null> {
  const request = await selectOne<{ shop_company_id: number }>(
    "SELECT shop_company_id FROM service_requests WHERE id = $1",
    [requestId],
  );
  if (!request) return null;
  if (user.role === "buyer") return request.shop_company_id === user.companyId ? "shop" : null;
  if (user.role === "admin") return "coordinator";
  if (user.role === "provider_admin") {
    const invitation = await findInvitation(requestId, user.companyId);
    return invitation ? "service" : null;
  }
  return null;
}

export async function loadRequestForSide(user: SignedInUser, requestId: number, transaction?: Transaction) {
  const side = await sideFor(user, requestId);
  const row = side ? await findRequest(requestId, transaction) : undefined;
  if (!side || !row) throw new AppError("not_found", "That service request was not found");
  return { row, side };
}

export const requestLink = (base: string, id: number, side: Side) =>
  side === "shop"
    ? `${base}/buyer/service-requests/${id}`
    : side === "service"
      ? `${base}/provider/service-requests/${id}`
      : `${base}/admin/follow-up`;
