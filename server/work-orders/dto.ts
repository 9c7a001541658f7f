import { QueryTypes } from "sequelize";
import type {
  OnSiteDetailsDto,
  WorkOrderDto,
  WorkOrderSide,
  WorkOrderSummaryDto,
} from "../../shared/work-orders/schemas.ts";
import {
  availableActions,
  canSendAgain,
  seesOnSiteDetails,
} from "../../shared/work-orders/work-order-transitions.ts";
import type { StandingSnapshot } from "../../shared/work-orders/standing-snapshot.ts";
import { snapshotForBuyer } from "../../shared/visibility/technician-visibility.ts";
import { db } from "../db/sequelize.ts";
import { lookupPostalCode } from "../geo/index.ts";
import type { WorkOrder } from "./model.ts";

interface NamesRow {
  id: number;
  shop_name: string;
  site_name: string;
  site_address_line: string;
  site_postal_code: string | null;
  site_time_zone: string | null;
  technician_name: string;
  service_company_name: string;
  requirement_set_name: string | null;
  created_by_name: string;
  e_builder: string | null;
  e_control_family: string | null;
  e_technology: string | null;
  e_model: string | null;
  e_serial_number: string | null;
}

/** The names a work order shows, for many work orders in one query. */
async function loadNames(ids: number[]): Promise<Map<number, NamesRow>> {
  if (ids.length === 0) return new Map();
  const rows = await db().query<NamesRow>(
    `SELECT wo.id, shop.name AS shop_name, s.name AS site_name, s.address_line AS site_address_line, s.postal_code AS site_postal_code, s.time_zone AS site_time_zone,
            t.name AS technician_name, svc.name AS service_company_name, rs.name AS requirement_set_name, u.name AS created_by_name,
            e.builder AS e_builder, e.control_family AS e_control_family, e.technology AS e_technology, e.model AS e_model,
            e.serial_number AS e_serial_number
       FROM work_orders wo
       JOIN companies shop ON shop.id = wo.shop_company_id
       JOIN sites s ON s.id = wo.site_id
       JOIN technicians t ON t.id = wo.technician_id
       JOIN companies svc ON svc.id = wo.service_company_id
       JOIN users u ON u.id = wo.created_by
       LEFT JOIN requirement_sets rs ON rs.id = wo.requirement_set_id
       LEFT JOIN equipment e ON e.id = wo.equipment_id
      WHERE wo.id = ANY($1::int[])`,
    { bind: [ids], type: QueryTypes.SELECT },
  );
  return new Map(rows.map((r) => [r.id, r]));
}

const iso = (d: Date | null) => (d ? d.toISOString() : null);
const hours = (v: string | null) => (v === null ? null : Number(v));

export async function toWorkOrderSummaries(rows: WorkOrder[]): Promise<WorkOrderSummaryDto[]> {
  const names = await loadNames(rows.map((r) => r.id));
  return rows.map((r) => {
    const n = names.get(r.id)!;
    return {
      id: r.id,
      status: r.status,
      urgency: r.urgency,
      technology: r.technology,
      problem: r.problem,
      shopName: n.shop_name,
      siteName: n.site_name,
      technicianName: n.technician_name,
      serviceCompanyName: n.service_company_name,
      createdAt: r.createdAt.toISOString(),
      updatedAt: r.updatedAt.toISOString(),
    };
  });
}

/** The shop reads snapshots through the shared buyer rule; the service side reads its own credentials in full. */
function snapshotFor(side: WorkOrderSide, snapshot: StandingSnapshot | null): StandingSnapshot | null {
  if (!snapshot) return null;
  return side === "shop" ? snapshotForBuyer(snapshot) : snapshot;
}

/** Where to go and whom to ask for, with what the shop will pay; the caller decides whether this side may read it. */
export function onSiteDetailsOf(
  r: WorkOrder,
  addressLine: string,
  postalCode: string | null,
): OnSiteDetailsDto {
  const place = postalCode ? lookupPostalCode(postalCode) : undefined;
  return {
    addressLine,
    city: place?.city ?? null,
    state: place?.state ?? null,
    postalCode,
    siteContactName: r.siteContactName,
    siteContactPhone: r.siteContactPhone,
    poNumber: r.poNumber,
    notToExceedCents: r.notToExceedCents,
    safetyInductionNote: r.safetyInductionNote,
  };
}

/** The copies a shop sent on after a decline; the first service side never learns where the job went. */
async function copiesOf(id: number): Promise<number[]> {
  const rows = await db().query<{ id: number }>(
    "SELECT id FROM work_orders WHERE copied_from_id = $1 ORDER BY id",
    { bind: [id], type: QueryTypes.SELECT },
  );
  return rows.map((row) => row.id);
}

export async function toWorkOrderDto(r: WorkOrder, side: WorkOrderSide): Promise<WorkOrderDto> {
  const n = (await loadNames([r.id])).get(r.id)!;
  const onSite = seesOnSiteDetails(side, r.acceptedAt)
    ? { onSite: onSiteDetailsOf(r, n.site_address_line, n.site_postal_code) }
    : {};
  return {
    id: r.id,
    status: r.status,
    yourSide: side,
    actions: availableActions(r.status, side),
    urgency: r.urgency,
    technology: r.technology,
    problem: r.problem,
    preferredDates: r.preferredDates,
    shop: { companyId: r.shopCompanyId, name: n.shop_name },
    site: { id: r.siteId, name: n.site_name, postalCode: n.site_postal_code, timeZone: n.site_time_zone },
    equipment:
      r.equipmentId === null
        ? null
        : {
            id: r.equipmentId,
            builder: n.e_builder ?? "",
            controlFamily: n.e_control_family,
            technology: n.e_technology ?? r.technology,
            model: n.e_model,
            serialNumber: n.e_serial_number,
          },
    technician: {
      id: r.technicianId,
      name: n.technician_name,
      companyId: r.serviceCompanyId,
      companyName: n.service_company_name,
    },
    requirementSet:
      r.requirementSetId === null ? null : { id: r.requirementSetId, name: n.requirement_set_name ?? "" },
    ...onSite,
    declineReason: r.declineReason,
    proposedDate: r.proposedDate,
    arrivalAt: iso(r.arrivalAt),
    cancelReason: r.cancelReason,
    disputeReason: r.disputeReason,
    copiedFromId: side === "shop" ? r.copiedFromId : null,
    copies: side === "shop" ? await copiesOf(r.id) : [],
    canSendAgain: canSendAgain(r.status, side),
    hoursWorked: hours(r.hoursWorked),
    travelHours: hours(r.travelHours),
    completionNote: r.completionNote,
    kind: r.workKind ?? null,
    problemArea: r.problemArea ?? null,
    partsUsed: r.partsUsed ?? [],
    snapshotAccepted: snapshotFor(side, r.snapshotAccepted),
    snapshotCompleted: snapshotFor(side, r.snapshotCompleted),
    createdBy: { id: r.createdBy, name: n.created_by_name },
    createdAt: r.createdAt.toISOString(),
    acceptedAt: iso(r.acceptedAt),
    declinedAt: iso(r.declinedAt),
    completedAt: iso(r.completedAt),
    confirmedAt: iso(r.confirmedAt),
    cancelledAt: iso(r.cancelledAt),
    disputedAt: iso(r.disputedAt),
    updatedAt: r.updatedAt.toISOString(),
  };
}
