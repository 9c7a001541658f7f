import { QueryTypes, type Transaction } from "sequelize";
import type { RaiseWorkOrder } from "../../shared/work-orders/schemas.ts";
import { isClearedNow, unmetRequirements } from "../../shared/work-orders/standing-snapshot.ts";
import { preferredDateProblem } from "../../shared/work-orders/preferred-dates.ts";
import { AppError } from "../http/app-error.ts";
import { atLeast } from "../../shared/visibility/technician-visibility.ts";
import { viewLevelOf } from "../technicians/index.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { WorkOrder } from "./model.ts";
import { findEquipment, findRequirementSet, findSite, findTechnicianForWork } from "./shop-records.ts";
import { standingSnapshotNow } from "./standing-now.ts";
import { mailOtherSide } from "./work-order-emails.ts";
import { toWorkOrderDto } from "./dto.ts";
import { markDownBy } from "../machines/downtime.ts";

const unknown = (path: string, message: string) =>
  new AppError("invalid_input", message, [{ path, message: "unknown or not yours" }]);

/** Refuses preferred dates in the past or years ahead; `now` is the server's clock, read once by the caller. */
function checkPreferredDates(dates: string[], now: Date) {
  const today = now.toISOString().slice(0, 10);
  const fields = dates.flatMap((date, i) => {
    const message = preferredDateProblem(date, today);
    return message ? [{ path: `body.preferredDates.${i}`, message }] : [];
  });
  if (fields.length > 0) throw new AppError("invalid_input", fields[0]!.message, fields);
}

/** Checks that every id in the request names a record this shop may use, and settles the machine technology. */
async function resolveTargets(buyer: Express.User, input: RaiseWorkOrder) {
  const [site, technician, level, equipment, requirementSet] = await Promise.all([
    findSite(input.siteId),
    findTechnicianForWork(input.technicianId),
    viewLevelOf(buyer, input.technicianId),
    input.equipmentId ? findEquipment(input.equipmentId) : undefined,
    input.requirementSetId ? findRequirementSet(input.requirementSetId) : undefined,
  ]);
  if (!site || site.company_id !== buyer.companyId)
    throw unknown("body.siteId", "Choose one of your shop's sites");
  // A technician the shared rule hides from shops is refused exactly like an unknown id: no reasons, no name.
  if (!technician || !atLeast(level, "directory") || technician.company_kind !== "service")
    throw unknown("body.technicianId", "That technician was not found");
  if (input.equipmentId && (!equipment || equipment.site_id !== site.id))
    throw unknown("body.equipmentId", "Choose a machine at that site");
  if (
    input.requirementSetId &&
    (!requirementSet || requirementSet.company_id !== buyer.companyId || !requirementSet.active)
  ) {
    throw unknown("body.requirementSetId", "Choose one of your shop's requirement sets");
  }
  const technology = input.technology ?? equipment?.technology;
  if (!technology) {
    throw new AppError("invalid_input", "Say which machine technology the job is on", [
      { path: "body.technology", message: "required without a machine" },
    ]);
  }
  return { site, technician, equipment, technology };
}

async function siteRequirementSetId(
  companyId: number,
  siteId: number,
  transaction: Transaction,
): Promise<number | null> {
  const rows = await db().query<{ id: number }>(
    "SELECT id FROM requirement_sets WHERE site_id = $1 AND company_id = $2 AND active ORDER BY id LIMIT 1",
    { bind: [siteId, companyId], type: QueryTypes.SELECT, transaction },
  );
  return rows[0]?.id ?? null;
}

/**
 * Writes a work order inside the caller's transaction, after the standing check at this very instant (409 naming what
 * is unmet otherwise). Used by a buyer raising one directly and by an accepted service-request estimate, so both carry
 * the same snapshot, audit and checks.
 */
export async function raiseWorkOrderWithin(
  buyer: Express.User,
  input: RaiseWorkOrder,
  warningDays: number,
  link: (id: number) => string,
  transaction: Transaction,
  options: { mailServiceSide?: boolean; copiedFromId?: number } = {},
) {
  const now = new Date();
  checkPreferredDates(input.preferredDates, now);
  const { site, technician, equipment, technology } = await resolveTargets(buyer, input);
  // Left out (not null): the site's own rules decide, as they do in the directory.
  const requirementSetId =
    input.requirementSetId === undefined
      ? await siteRequirementSetId(buyer.companyId, site.id, transaction)
      : input.requirementSetId;
  const snapshot = await standingSnapshotNow(technician.id, requirementSetId, now, warningDays, transaction);
  if (!isClearedNow(snapshot.standing)) {
    throw new AppError(
      "conflict",
      `${snapshot.technicianName} is not cleared right now, so no work order can be raised`,
      unmetRequirements(snapshot),
    );
  }
  const row = await WorkOrder.create(
    {
      shopCompanyId: buyer.companyId,
      siteId: site.id,
      equipmentId: equipment?.id ?? null,
      technicianId: technician.id,
      serviceCompanyId: technician.company_id,
      requirementSetId,
      technology,
      problem: input.problem,
      urgency: input.urgency,
      preferredDates: input.preferredDates,
      workKind: input.kind ?? null,
      problemArea: input.problemArea ?? null,
      // Left out: the site's own contact, induction note, PO and cap, as the site's page records them.
      siteContactName: input.siteContactName ?? site.contact_name,
      siteContactPhone: input.siteContactPhone ?? site.contact_phone,
      poNumber: input.poNumber ?? site.default_po_number,
      notToExceedCents: input.notToExceedCents ?? site.default_not_to_exceed_cents,
      safetyInductionNote: input.safetyInductionNote ?? site.safety_induction_note,
      copiedFromId: options.copiedFromId ?? null,
      createdBy: buyer.id,
    },
    { transaction },
  );
  await recordAudit(
    {
      actorUserId: buyer.id,
      action: "work_order.raised",
      subjectType: "work_order",
      subjectId: row.id,
      after: { ...row.toJSON(), standing: snapshot.standing },
    },
    transaction,
  );
  if (options.mailServiceSide ?? true) {
    const urgent = input.urgency === "down" ? " (machine down)" : "";
    await mailOtherSide(
      row,
      "service",
      {
        subject: `new request${urgent} for ${snapshot.technicianName}`,
        lines: [
          `${buyer.name} raised a work order for ${snapshot.technicianName} at ${site.name}${urgent}.`,
          `Problem: ${input.problem}`,
        ],
        next: {
          sentence: "Accept or decline the request; the shop waits for your answer.",
          label: "Accept or decline",
        },
      },
      link(row.id),
      transaction,
    );
  }
  return { row, snapshot };
}

/**
 * A buyer raises a work order to a technician for one of the shop's sites. Refused with 409 when the technician is not
 * cleared against the baseline (and the chosen requirement set) at this very instant.
 */
export async function raiseWorkOrder(
  buyer: Express.User,
  input: RaiseWorkOrder,
  warningDays: number,
  link: (id: number) => string,
) {
  const { row } = await db().transaction(async (transaction) => {
    const raised = await raiseWorkOrderWithin(buyer, input, warningDays, link, transaction);
    // Called straight to a technician for a machine that is down: its downtime runs from this call. (A work order that
    // comes from an accepted estimate continues the request's period instead.)
    if (raised.row.urgency === "down" && raised.row.equipmentId !== null)
      await markDownBy(
        raised.row.equipmentId,
        { by: "work_order", userId: buyer.id, workOrderId: raised.row.id },
        raised.row.createdAt,
        transaction,
      );
    return raised;
  });
  return toWorkOrderDto(row, "shop");
}
