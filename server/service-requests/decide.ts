import type { Transaction } from "sequelize";
import { calendarDateIn } from "../../shared/dates/local-time.ts";
import { requestKindLabels } from "../../shared/service-requests/schemas.ts";
import type { Urgency } from "../../shared/work-orders/schemas.ts";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { raiseWorkOrderWithin, WorkOrder } from "../work-orders/index.ts";
import { tellCompany } from "./notify.ts";
import { findRequest, listInvitations, requestLink, type RequestRow } from "./records.ts";
import { run, selectOne } from "./sql.ts";

const URGENCY: Record<RequestRow["machine_state"], Urgency> = {
  down: "down",
  running_fault: "high",
  planned: "normal",
};

/** The shop's request, locked for the decision: of two buyers deciding at once, the second waits and then gets a 409. */
async function lockOpenForShop(buyer: Express.User, requestId: number, transaction: Transaction) {
  const request = await findRequest(requestId, transaction, true);
  if (!request || request.shop_company_id !== buyer.companyId)
    throw new AppError("not_found", "That service request was not found");
  if (request.status !== "open")
    throw new AppError("conflict", `This request is already ${request.status}; nothing more can be decided`);
  return request;
}

/**
 * Accepts one estimate: its technician is checked again at this instant (409 naming the unmet requirement), the work
 * order is raised by the same code as a direct one and accepted on the company's behalf with the same snapshot, the
 * chosen company is told and the others are thanked.
 */
export async function acceptEstimate(
  buyer: Express.User,
  requestId: number,
  estimateId: number,
  warningDays: number,
  linkBase: string,
) {
  return db().transaction(async (transaction) => {
    const request = await lockOpenForShop(buyer, requestId, transaction);
    const estimate = await selectOne<{
      id: number;
      company_id: number;
      status: string;
      revision: number;
      company_name: string;
    }>(
      `SELECT e.id, e.company_id, e.status, e.revision, c.name AS company_name
         FROM service_request_estimates e JOIN companies c ON c.id = e.company_id
        WHERE e.id = $1 AND e.request_id = $2`,
      [estimateId, requestId],
      transaction,
    );
    if (!estimate) throw new AppError("not_found", "That estimate was not found");
    if (estimate.status !== "active") throw new AppError("conflict", `That estimate is ${estimate.status}`);
    const revision = await selectOne<{ technician_id: number; valid_until: string; total_cents: number }>(
      "SELECT technician_id, valid_until, total_cents FROM service_request_estimate_revisions WHERE estimate_id = $1 AND revision = $2",
      [estimateId, estimate.revision],
      transaction,
    );
    const site = await selectOne<{ time_zone: string }>(
      "SELECT time_zone FROM sites WHERE id = $1",
      [request.site_id],
      transaction,
    );
    const today = calendarDateIn(new Date(), site!.time_zone);
    if (revision!.valid_until < today) {
      throw new AppError(
        "conflict",
        `That estimate was valid until ${revision!.valid_until}; ask the company to revise it`,
      );
    }
    const { row: workOrder, snapshot } = await raiseWorkOrderWithin(
      buyer,
      {
        technicianId: revision!.technician_id,
        siteId: request.site_id,
        ...(request.equipment_id ? { equipmentId: request.equipment_id } : {}),
        requirementSetId: request.requirement_set_id,
        technology: request.technology,
        problem: `${requestKindLabels[request.kind]} (service request #${request.id}): ${request.problem}`,
        urgency: URGENCY[request.machine_state],
        // The window's first day, unless it has passed (the work order accepts only dates from today on).
        preferredDates: [request.window_start, request.window_end]
          .flatMap((d) => (d && d >= new Date().toISOString().slice(0, 10) ? [d] : []))
          .slice(0, 1),
        kind: request.kind,
      },
      warningDays,
      (id) => `${linkBase}/work-orders/${id}`,
      transaction,
      { mailServiceSide: false },
    );
    // The company offered the work in its estimate: the work order starts accepted, with the snapshot just taken.
    const now = new Date();
    await WorkOrder.update(
      { status: "accepted", acceptedAt: now, snapshotAccepted: snapshot },
      { where: { id: workOrder.id }, transaction },
    );
    await run(
      "UPDATE service_request_estimates SET status = 'accepted', updated_at = now() WHERE id = $1",
      [estimateId],
      transaction,
    );
    await run(
      "UPDATE service_request_estimates SET status = 'not_chosen', updated_at = now() WHERE request_id = $1 AND id <> $2 AND status = 'active'",
      [requestId, estimateId],
      transaction,
    );
    await run(
      `UPDATE service_requests SET status = 'decided', accepted_estimate_id = $2, work_order_id = $3, decided_at = $4, updated_at = now()
        WHERE id = $1`,
      [requestId, estimateId, workOrder.id, now],
      transaction,
    );
    await run(
      "INSERT INTO service_request_events (request_id, actor_user_id, kind, note) VALUES ($1, $2, 'accepted', $3)",
      [requestId, buyer.id, `Accepted the estimate of ${estimate.company_name}; work order #${workOrder.id}`],
      transaction,
    );
    await recordAudit(
      {
        actorUserId: buyer.id,
        action: "service_request.accepted",
        subjectType: "service_request",
        subjectId: requestId,
        after: {
          estimateId,
          revision: estimate.revision,
          workOrderId: workOrder.id,
          standing: snapshot.standing,
        },
      },
      transaction,
    );
    await tellCompany(
      estimate.company_id,
      {
        kind: "service_request.accepted",
        title: `Service request #${requestId}: your estimate was accepted`,
        lines: [
          `${buyer.name} accepted your estimate. Work order #${workOrder.id} is open with the site's full address.`,
        ],
        link: `${linkBase}/work-orders/${workOrder.id}`,
      },
      transaction,
    );
    for (const other of await listInvitations(requestId, transaction)) {
      if (other.company_id === estimate.company_id) continue;
      await tellCompany(
        other.company_id,
        {
          kind: "service_request.not_chosen",
          title: `Service request #${requestId}: another estimate was chosen`,
          lines: ["Thank you for looking at this request. The shop chose another estimate this time."],
          link: requestLink(linkBase, requestId, "service"),
        },
        transaction,
      );
    }
    return { requestId, status: "decided" as const, workOrderId: workOrder.id };
  });
}

export async function cancelRequest(
  buyer: Express.User,
  requestId: number,
  reason: string,
  linkBase: string,
) {
  return db().transaction(async (transaction) => {
    await lockOpenForShop(buyer, requestId, transaction);
    await run(
      "UPDATE service_requests SET status = 'cancelled', cancel_reason = $2, decided_at = now(), updated_at = now() WHERE id = $1",
      [requestId, reason],
      transaction,
    );
    await run(
      "UPDATE service_request_estimates SET status = 'not_chosen', updated_at = now() WHERE request_id = $1 AND status = 'active'",
      [requestId],
      transaction,
    );
    await run(
      "INSERT INTO service_request_events (request_id, actor_user_id, kind, note) VALUES ($1, $2, 'cancelled', $3)",
      [requestId, buyer.id, reason],
      transaction,
    );
    await recordAudit(
      {
        actorUserId: buyer.id,
        action: "service_request.cancelled",
        subjectType: "service_request",
        subjectId: requestId,
        after: { reason },
      },
      transaction,
    );
    for (const invitation of await listInvitations(requestId, transaction)) {
      await tellCompany(
        invitation.company_id,
        {
          kind: "service_request.cancelled",
          title: `Service request #${requestId} was cancelled`,
          lines: [`The shop cancelled this request: ${reason}`],
          link: requestLink(linkBase, requestId, "service"),
        },
        transaction,
      );
    }
    return { requestId, status: "cancelled" as const };
  });
}
