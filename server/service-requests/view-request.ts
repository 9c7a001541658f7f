import type {
  AttachmentDto,
  EstimateDto,
  EstimatePart,
  EstimateRevisionDto,
  InvitationDto,
  ServiceRequestDto,
  ServiceRequestSummaryDto,
  TimelineEventDto,
} from "../../shared/service-requests/schemas.ts";
import { companyActions, shopActions } from "../../shared/service-requests/request-transitions.ts";
import { kmToMiles } from "../../shared/geo/great-circle-distance.ts";
import { estimateDriveHours, estimateRoadMiles } from "../../shared/directory/drive-time.ts";
import { AppError } from "../http/app-error.ts";
import { siteArea } from "./raise-request.ts";
import {
  findEstimateOf,
  findInvitation,
  listInvitations,
  loadRequestForSide,
  type InvitationRow,
  type RequestRow,
  type Side,
} from "./records.ts";
import { select, selectOne } from "./sql.ts";

interface RevisionRow {
  estimate_id: number;
  revision: number;
  technician_id: number;
  technician_name: string;
  hourly_rate_cents: number;
  travel_rate_cents: number;
  mileage_rate_cents: number;
  on_site_hours: string;
  earliest_arrival: Date;
  parts: EstimatePart[];
  note: string | null;
  valid_until: string;
  distance_km: number;
  travel_cents: number;
  labour_cents: number;
  mileage_cents: number;
  parts_cents: number;
  total_cents: number;
  created_at: Date;
}

const round = (v: number, d: number) => Number(v.toFixed(d));

function toRevisionDto(r: RevisionRow): EstimateRevisionDto {
  const roadMiles = estimateRoadMiles(kmToMiles(r.distance_km));
  return {
    revision: r.revision,
    technicianId: r.technician_id,
    technicianName: r.technician_name,
    hourlyRateCents: r.hourly_rate_cents,
    travelRateCents: r.travel_rate_cents,
    mileageRateCents: r.mileage_rate_cents,
    onSiteHours: Number(r.on_site_hours),
    earliestArrival: new Date(r.earliest_arrival).toISOString(),
    parts: r.parts,
    note: r.note,
    validUntil: r.valid_until,
    distanceMiles: round(kmToMiles(r.distance_km), 1),
    driveHours: round(estimateDriveHours(roadMiles), 2),
    total: {
      travelCents: r.travel_cents,
      labourCents: r.labour_cents,
      mileageCents: r.mileage_cents,
      partsCents: r.parts_cents,
      totalCents: r.total_cents,
      unpricedParts: r.parts.filter((p) => p.unitPriceCents === null).length,
      basis: "before tax",
    },
    createdAt: new Date(r.created_at).toISOString(),
  };
}

/** Estimates of a request with every revision, newest revision as `current`; one company's only when asked. */
export async function loadEstimates(requestId: number, companyId?: number): Promise<EstimateDto[]> {
  const estimates = await select<{
    id: number;
    company_id: number;
    company_name: string;
    status: EstimateDto["status"];
    revision: number;
  }>(
    `SELECT e.id, e.company_id, c.name AS company_name, e.status, e.revision
       FROM service_request_estimates e JOIN companies c ON c.id = e.company_id
      WHERE e.request_id = $1 AND ($2::int IS NULL OR e.company_id = $2) ORDER BY e.id`,
    [requestId, companyId ?? null],
  );
  if (estimates.length === 0) return [];
  const revisions = await select<RevisionRow>(
    `SELECT r.*, t.name AS technician_name FROM service_request_estimate_revisions r JOIN technicians t ON t.id = r.technician_id
      WHERE r.estimate_id = ANY($1::int[]) ORDER BY r.estimate_id, r.revision`,
    [estimates.map((e) => e.id)],
  );
  return estimates.map((e) => {
    const own = revisions.filter((r) => r.estimate_id === e.id).map(toRevisionDto);
    return {
      id: e.id,
      requestId,
      companyId: e.company_id,
      companyName: e.company_name,
      status: e.status,
      current: own.find((r) => r.revision === e.revision) ?? own[own.length - 1]!,
      revisions: own,
    };
  });
}

const toInvitationDto = (i: InvitationRow): InvitationDto => ({
  companyId: i.company_id,
  companyName: i.company_name,
  source: i.source,
  invitedAt: new Date(i.invited_at).toISOString(),
  firstAnswerAt: i.first_answer_at ? new Date(i.first_answer_at).toISOString() : null,
  answer: i.answer,
  passReason: i.pass_reason,
});

async function loadTimeline(requestId: number): Promise<TimelineEventDto[]> {
  const rows = await select<{
    id: number;
    kind: string;
    actor: string | null;
    threshold_hours: string | null;
    note: string | null;
    created_at: Date;
  }>(
    `SELECT e.id, e.kind, u.name AS actor, e.threshold_hours, e.note, e.created_at
       FROM service_request_events e LEFT JOIN users u ON u.id = e.actor_user_id
      WHERE e.request_id = $1 ORDER BY e.id`,
    [requestId],
  );
  return rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    actor: r.actor,
    thresholdHours: r.threshold_hours === null ? null : Number(r.threshold_hours),
    note: r.note,
    createdAt: new Date(r.created_at).toISOString(),
  }));
}

async function loadAttachments(requestId: number): Promise<AttachmentDto[]> {
  const rows = await select<{ id: number; original_name: string; mime: string; size_bytes: number }>(
    `SELECT a.id, d.original_name, d.mime, d.size_bytes FROM service_request_attachments a JOIN documents d ON d.id = a.document_id
      WHERE a.request_id = $1 ORDER BY a.id`,
    [requestId],
  );
  return rows.map((r) => ({
    id: r.id,
    name: r.original_name,
    mime: r.mime,
    sizeBytes: r.size_bytes,
    url: `/api/service-requests/${requestId}/attachments/${r.id}`,
  }));
}

/** The request as the caller's side may see it: companies see the site area only, and only their own answer. */
export async function viewRequest(user: Express.User, requestId: number): Promise<ServiceRequestDto> {
  const { row, side } = await loadRequestForSide(user, requestId);
  return buildRequestDto(user, row, side);
}

async function buildRequestDto(user: Express.User, row: RequestRow, side: Side): Promise<ServiceRequestDto> {
  const [site, machine, set, attachments, timeline] = await Promise.all([
    selectOne<{ id: number; name: string; address_line: string; postal_code: string; time_zone: string }>(
      "SELECT id, name, address_line, postal_code, time_zone FROM sites WHERE id = $1",
      [row.site_id],
    ),
    row.equipment_id
      ? selectOne<{ id: number; builder: string; control_family: string; model: string }>(
          "SELECT id, builder, control_family, model FROM equipment WHERE id = $1",
          [row.equipment_id],
        )
      : undefined,
    row.requirement_set_id
      ? selectOne<{ id: number; name: string }>("SELECT id, name FROM requirement_sets WHERE id = $1", [
          row.requirement_set_id,
        ])
      : undefined,
    loadAttachments(row.id),
    side === "service" ? Promise.resolve([]) : loadTimeline(row.id),
  ]);
  let invitations: InvitationDto[];
  let estimates: EstimateDto[];
  let actions: ServiceRequestDto["actions"];
  let chosen = false;
  if (side === "service") {
    const invitation = await findInvitation(row.id, user.companyId);
    const estimate = await findEstimateOf(row.id, user.companyId);
    if (!invitation) throw new AppError("not_found", "That service request was not found");
    invitations = [toInvitationDto(invitation)];
    estimates = await loadEstimates(row.id, user.companyId);
    actions = companyActions(row.status, invitation.answer, estimate?.status ?? null);
    chosen = estimate?.status === "accepted";
  } else {
    invitations = (await listInvitations(row.id)).map(toInvitationDto);
    estimates = await loadEstimates(row.id);
    actions = side === "shop" ? shopActions(row.status) : ["log_follow_up"];
  }
  const area = siteArea(site!.postal_code);
  const showStreet = side !== "service" || chosen;
  return {
    id: row.id,
    status: row.status,
    kind: row.kind,
    machineState: row.machine_state,
    timing: row.timing,
    windowStart: row.window_start,
    windowEnd: row.window_end,
    technology: row.technology,
    builder: row.builder,
    controlFamily: row.control_family,
    problem: row.problem,
    requirementSet: { id: set?.id ?? null, name: set?.name ?? "Platform baseline" },
    machine: machine
      ? {
          id: machine.id,
          builder: machine.builder,
          controlFamily: machine.control_family,
          model: machine.model,
        }
      : null,
    site: {
      id: site!.id,
      name: showStreet ? site!.name : null,
      street: showStreet ? site!.address_line : null,
      ...area,
      timeZone: site!.time_zone,
    },
    sentAt: new Date(row.sent_at).toISOString(),
    decidedAt: row.decided_at ? new Date(row.decided_at).toISOString() : null,
    cancelReason: row.cancel_reason,
    workOrderId: side !== "service" || chosen ? row.work_order_id : null,
    attachments,
    actions,
    invitations,
    estimates,
    timeline,
  };
}

/** The shop's requests, or the company's inbox of invitations. */
export async function listRequests(user: Express.User): Promise<ServiceRequestSummaryDto[]> {
  const shop = user.role === "buyer";
  const rows = await select<
    RequestRow & {
      postal_code: string;
      invited: number;
      estimates: number;
      answer: "estimate" | "pass" | null;
    }
  >(
    `SELECT r.*, s.postal_code,
            (SELECT count(*)::int FROM service_request_invitations i WHERE i.request_id = r.id) AS invited,
            (SELECT count(*)::int FROM service_request_estimates e WHERE e.request_id = r.id AND e.status IN ('active','accepted')) AS estimates,
            ${shop ? "NULL" : "mine.answer"} AS answer
       FROM service_requests r JOIN sites s ON s.id = r.site_id
       ${shop ? "" : "JOIN service_request_invitations mine ON mine.request_id = r.id AND mine.company_id = $1"}
      WHERE ${shop ? "r.shop_company_id = $1" : "true"}
      ORDER BY r.id DESC LIMIT 200`,
    [user.companyId],
  );
  return rows.map((r) => {
    const area = siteArea(r.postal_code);
    return {
      id: r.id,
      status: r.status,
      kind: r.kind,
      machineState: r.machine_state,
      problem: r.problem,
      siteArea: `${area.city}, ${area.state} ${area.postalCode}`,
      sentAt: new Date(r.sent_at).toISOString(),
      invited: r.invited,
      estimates: shop ? r.estimates : 0,
      answer: r.answer,
    };
  });
}
