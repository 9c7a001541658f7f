import type { RaiseWorkOrder, SendAgain } from "../../shared/work-orders/schemas.ts";
import { canSendAgain } from "../../shared/work-orders/work-order-transitions.ts";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { loadForSide } from "./find-work-orders.ts";
import { raiseWorkOrderWithin } from "./raise-work-order.ts";
import { toWorkOrderDto } from "./dto.ts";

const orUndefined = <T>(v: T | null) => (v === null ? undefined : v);

/**
 * A declined job copied into a new work order for the technician the buyer picks: the same site, machine, rules, problem
 * and on-site details, checked like any new work order (the technician must be one the shop may see, and cleared now).
 */
export async function sendAgain(
  buyer: Express.User,
  id: number,
  input: SendAgain,
  warningDays: number,
  link: (id: number) => string,
) {
  const { row: original, side } = await loadForSide(buyer, id);
  if (side !== "shop") throw new AppError("forbidden", "Only the shop that raised it may send the job on");
  if (!canSendAgain(original.status, side))
    throw new AppError(
      "conflict",
      `This work order is ${original.status}; only a declined job can be sent on`,
    );
  const today = new Date().toISOString().slice(0, 10);
  const copy: RaiseWorkOrder = {
    technicianId: input.technicianId,
    siteId: original.siteId,
    equipmentId: orUndefined(original.equipmentId),
    requirementSetId: original.requirementSetId,
    technology: original.technology,
    problem: original.problem,
    urgency: original.urgency,
    // Dates already gone by are dropped rather than refused: the buyer is sending the job on now.
    preferredDates: input.preferredDates ?? original.preferredDates.filter((d) => d >= today),
    siteContactName: orUndefined(original.siteContactName),
    siteContactPhone: orUndefined(original.siteContactPhone),
    poNumber: orUndefined(original.poNumber),
    notToExceedCents: orUndefined(original.notToExceedCents),
    safetyInductionNote: orUndefined(original.safetyInductionNote),
  };
  const { row } = await db().transaction((transaction) =>
    raiseWorkOrderWithin(buyer, copy, warningDays, link, transaction, { copiedFromId: original.id }),
  );
  return toWorkOrderDto(row, "shop");
}
