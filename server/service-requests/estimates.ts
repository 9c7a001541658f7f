import type { Transaction } from "sequelize";
import { calendarDateIn } from "../../shared/dates/local-time.ts";
import { greatCircleDistanceKm } from "../../shared/geo/great-circle-distance.ts";
import { siteLocalToInstant } from "../../shared/service-requests/business-hours.ts";
import { estimateTotal } from "../../shared/service-requests/estimate-total.ts";
import { companyMay, type CompanyAction } from "../../shared/service-requests/request-transitions.ts";
import type { EstimateInput } from "../../shared/service-requests/schemas.ts";
import { isClearedNow, unmetRequirements } from "../../shared/work-orders/standing-snapshot.ts";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { standingSnapshotNow } from "../work-orders/standing-now.ts";
import { tellShop } from "./notify.ts";
import { findEstimateOf, findInvitation, findRequest, requestLink, type RequestRow } from "./records.ts";
import { insertReturningId, run, selectOne } from "./sql.ts";

const notFound = () => new AppError("not_found", "That service request was not found");

/**
 * Locks the request (so an answer and the shop's decision never interleave) and checks that the caller's company was
 * invited (404 otherwise, like a missing request) and that the action is allowed now (409).
 */
async function lockForCompany(
  user: Express.User,
  requestId: number,
  action: CompanyAction,
  transaction: Transaction,
) {
  const request = await findRequest(requestId, transaction, true);
  const invitation = request ? await findInvitation(requestId, user.companyId, transaction) : undefined;
  if (!request || !invitation) throw notFound();
  const estimate = (await findEstimateOf(requestId, user.companyId, transaction)) ?? null;
  if (!companyMay(action, request.status, invitation.answer, estimate?.status ?? null)) {
    const why =
      request.status !== "open"
        ? `This request is ${request.status}; estimates can no longer change`
        : `You cannot ${action} now`;
    throw new AppError("conflict", why);
  }
  return { request, invitation, estimate };
}

async function event(
  requestId: number,
  actor: number | null,
  kind: string,
  note: string | null,
  t: Transaction,
) {
  await run(
    "INSERT INTO service_request_events (request_id, actor_user_id, kind, note) VALUES ($1, $2, $3, $4)",
    [requestId, actor, kind, note],
    t,
  );
}

/** The technician must belong to the company, be active, and be cleared for the request's set at this instant. */
export async function checkTechnicianCleared(
  technicianId: number,
  companyId: number,
  request: RequestRow,
  warningDays: number,
  transaction: Transaction,
  path = "body.technicianId",
) {
  const technician = await selectOne<{
    id: number;
    company_id: number;
    active: boolean;
    latitude: number | null;
    longitude: number | null;
  }>(
    "SELECT id, company_id, active, latitude, longitude FROM technicians WHERE id = $1",
    [technicianId],
    transaction,
  );
  if (!technician || technician.company_id !== companyId || !technician.active) {
    throw new AppError("invalid_input", "Choose one of your active technicians", [
      { path, message: "unknown or not yours" },
    ]);
  }
  const snapshot = await standingSnapshotNow(
    technicianId,
    request.requirement_set_id,
    new Date(),
    warningDays,
    transaction,
  );
  if (!isClearedNow(snapshot.standing)) {
    throw new AppError(
      "conflict",
      `${snapshot.technicianName} is not cleared for this request's requirements right now`,
      unmetRequirements(snapshot),
    );
  }
  return { technician, snapshot };
}

async function writeRevision(
  user: Express.User,
  request: RequestRow,
  estimateId: number,
  revision: number,
  input: EstimateInput,
  warningDays: number,
  transaction: Transaction,
) {
  const site = await selectOne<{ latitude: number; longitude: number; time_zone: string }>(
    "SELECT latitude, longitude, time_zone FROM sites WHERE id = $1",
    [request.site_id],
    transaction,
  );
  const { technician } = await checkTechnicianCleared(
    input.technicianId,
    user.companyId,
    request,
    warningDays,
    transaction,
  );
  const arrival = siteLocalToInstant(input.earliestArrival, site!.time_zone);
  if (!arrival) {
    throw new AppError("invalid_input", "That arrival time does not exist at the site", [
      { path: "body.earliestArrival", message: `not a time on the clock in ${site!.time_zone}` },
    ]);
  }
  const today = calendarDateIn(new Date(), site!.time_zone);
  if (input.validUntil < today) {
    throw new AppError("invalid_input", "The estimate must be valid at least until today", [
      { path: "body.validUntil", message: `must be ${today} or later` },
    ]);
  }
  if (technician.latitude === null || technician.longitude === null) {
    throw new AppError("invalid_input", "That technician has no base location to measure travel from", [
      { path: "body.technicianId", message: "add the technician's ZIP code first" },
    ]);
  }
  const distanceKm = greatCircleDistanceKm(
    { lat: technician.latitude, lon: technician.longitude },
    { lat: site!.latitude, lon: site!.longitude },
  );
  const total = estimateTotal({ distanceKm, ...input });
  await run(
    `INSERT INTO service_request_estimate_revisions (estimate_id, revision, technician_id, hourly_rate_cents, travel_rate_cents,
       mileage_rate_cents, on_site_hours, earliest_arrival, parts, note, valid_until, distance_km, travel_cents, labour_cents,
       mileage_cents, parts_cents, total_cents, created_by)
     VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9::jsonb, $10, $11, $12, $13, $14, $15, $16, $17, $18)`,
    [
      estimateId,
      revision,
      input.technicianId,
      input.hourlyRateCents,
      input.travelRateCents,
      input.mileageRateCents,
      input.onSiteHours,
      arrival,
      JSON.stringify(input.parts),
      input.note ?? null,
      input.validUntil,
      distanceKm,
      total.travelCents,
      total.labourCents,
      total.mileageCents,
      total.partsCents,
      total.totalCents,
      user.id,
    ],
    transaction,
  );
  return total;
}

const dollars = (cents: number) => `$${(cents / 100).toFixed(2)}`;

/** A first estimate, or a fresh one after a pass or a withdrawal. */
export async function sendEstimate(
  user: Express.User,
  requestId: number,
  input: EstimateInput,
  warningDays: number,
  linkBase: string,
) {
  return db().transaction(async (transaction) => {
    const { request, estimate } = await lockForCompany(user, requestId, "estimate", transaction);
    let estimateId: number;
    let revision = 1;
    if (estimate) {
      revision = estimate.revision + 1;
      estimateId = estimate.id;
      await run(
        "UPDATE service_request_estimates SET status = 'active', revision = $2, updated_at = now() WHERE id = $1",
        [estimate.id, revision],
        transaction,
      );
    } else {
      estimateId = await insertReturningId(
        "INSERT INTO service_request_estimates (request_id, company_id) VALUES ($1, $2)",
        [requestId, user.companyId],
        transaction,
      );
    }
    const total = await writeRevision(user, request, estimateId, revision, input, warningDays, transaction);
    await run(
      `UPDATE service_request_invitations SET answer = 'estimate', first_answer_at = coalesce(first_answer_at, now())
        WHERE request_id = $1 AND company_id = $2`,
      [requestId, user.companyId],
      transaction,
    );
    await event(
      requestId,
      user.id,
      "estimate_sent",
      `Estimate ${dollars(total.totalCents)} before tax`,
      transaction,
    );
    await audit(
      user,
      requestId,
      "service_request.estimate_sent",
      { estimateId, revision, input },
      transaction,
    );
    await tellShop(
      request,
      {
        kind: "service_request.estimate",
        title: `Service request #${requestId}: a new estimate`,
        lines: [`An estimate of ${dollars(total.totalCents)} (before tax) arrived on your service request.`],
        link: requestLink(linkBase, requestId, "shop"),
      },
      transaction,
    );
    return { estimateId, revision };
  });
}

export async function reviseEstimate(
  user: Express.User,
  requestId: number,
  estimateId: number,
  input: EstimateInput,
  warningDays: number,
  linkBase: string,
) {
  return db().transaction(async (transaction) => {
    const { request, estimate } = await lockForCompany(user, requestId, "revise", transaction);
    if (!estimate || estimate.id !== estimateId)
      throw new AppError("not_found", "That estimate was not found");
    const revision = estimate.revision + 1;
    const total = await writeRevision(user, request, estimateId, revision, input, warningDays, transaction);
    await run(
      "UPDATE service_request_estimates SET revision = $2, updated_at = now() WHERE id = $1",
      [estimateId, revision],
      transaction,
    );
    await event(
      requestId,
      user.id,
      "estimate_revised",
      `Revision ${revision}: ${dollars(total.totalCents)} before tax`,
      transaction,
    );
    await audit(
      user,
      requestId,
      "service_request.estimate_revised",
      { estimateId, revision, input },
      transaction,
    );
    await tellShop(
      request,
      {
        kind: "service_request.estimate",
        title: `Service request #${requestId}: an estimate was revised`,
        lines: [`A company revised its estimate to ${dollars(total.totalCents)} (before tax).`],
        link: requestLink(linkBase, requestId, "shop"),
      },
      transaction,
    );
    return { estimateId, revision };
  });
}

export async function withdrawEstimate(
  user: Express.User,
  requestId: number,
  estimateId: number,
  linkBase: string,
) {
  return db().transaction(async (transaction) => {
    const { request, estimate } = await lockForCompany(user, requestId, "withdraw", transaction);
    if (!estimate || estimate.id !== estimateId)
      throw new AppError("not_found", "That estimate was not found");
    await run(
      "UPDATE service_request_estimates SET status = 'withdrawn', updated_at = now() WHERE id = $1",
      [estimateId],
      transaction,
    );
    await event(requestId, user.id, "estimate_withdrawn", null, transaction);
    await audit(user, requestId, "service_request.estimate_withdrawn", { estimateId }, transaction);
    await tellShop(
      request,
      {
        kind: "service_request.estimate",
        title: `Service request #${requestId}: an estimate was withdrawn`,
        lines: ["A company withdrew its estimate on your service request."],
        link: requestLink(linkBase, requestId, "shop"),
      },
      transaction,
    );
    return { estimateId, status: "withdrawn" as const };
  });
}

export async function passRequest(user: Express.User, requestId: number, reason: string) {
  return db().transaction(async (transaction) => {
    await lockForCompany(user, requestId, "pass", transaction);
    await run(
      `UPDATE service_request_invitations SET answer = 'pass', pass_reason = $3, first_answer_at = coalesce(first_answer_at, now())
        WHERE request_id = $1 AND company_id = $2`,
      [requestId, user.companyId, reason],
      transaction,
    );
    await event(requestId, user.id, "passed", reason, transaction);
    await audit(user, requestId, "service_request.passed", { reason }, transaction);
    return { answer: "pass" as const };
  });
}

function audit(
  user: Express.User,
  requestId: number,
  action: string,
  after: object,
  transaction: Transaction,
) {
  return recordAudit(
    { actorUserId: user.id, action, subjectType: "service_request", subjectId: requestId, after },
    transaction,
  );
}
