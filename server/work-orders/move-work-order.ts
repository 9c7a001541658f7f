import { QueryTypes, type Transaction } from "sequelize";
import type {
  AcceptWorkOrder,
  CompleteWorkOrder,
  DeclineWorkOrder,
  WorkOrderAction,
} from "../../shared/work-orders/schemas.ts";
import { TRANSITIONS } from "../../shared/work-orders/work-order-transitions.ts";
import { isClearedNow, unmetRequirements } from "../../shared/work-orders/standing-snapshot.ts";
import { instantFromLocal } from "../../shared/dates/zoned-instant.ts";
import { formatCalendarDate, formatLocalDateTime } from "../../shared/dates/local-time.ts";
import { onSiteLines } from "../../shared/work-orders/on-site-lines.ts";
import { SAFETY_CAUTIONS, SAFETY_CAUTION_TITLE } from "../../shared/safety/cautions.ts";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { WorkOrder, WorkOrderMessage } from "./model.ts";
import { sideOf } from "./policy.ts";
import { standingSnapshotNow } from "./standing-now.ts";
import { mailOtherSide, type WorkOrderNews } from "./work-order-emails.ts";
import { onSiteDetailsOf, toWorkOrderDto } from "./dto.ts";
import { movePlanForConfirmedWork } from "../machines/maintenance-completion.ts";
import { runningAgainOnConfirm } from "../machines/downtime.ts";

type Changes = Partial<
  Pick<
    WorkOrder,
    | "declineReason"
    | "proposedDate"
    | "arrivalAt"
    | "cancelReason"
    | "disputeReason"
    | "hoursWorked"
    | "travelHours"
    | "completionNote"
    | "snapshotAccepted"
    | "snapshotCompleted"
    | "partsUsed"
  >
>;

interface Step {
  changes: (row: WorkOrder, now: Date, transaction: Transaction) => Promise<Changes> | Changes;
  news: (row: WorkOrder, actor: Express.User) => WorkOrderNews;
  /** More to write in the same transaction once the status has moved (a thread message, the job sheet). */
  after?: (row: WorkOrder, actor: Express.User, transaction: Transaction) => Promise<void>;
}

const STAMP = {
  accept: "acceptedAt",
  decline: "declinedAt",
  complete: "completedAt",
  confirm: "confirmedAt",
  dispute: "disputedAt",
  cancel: "cancelledAt",
} as const;
const SIDE_WORDS = { shop: "the shop that raised it", service: "the service company" } as const;

/**
 * One status change: checked against the side and the expected statuses, then written by a conditional update on the
 * status read, so of two people acting at once only one wins and the other gets a 409. Audit and e-mail share its
 * transaction.
 */
async function moveWorkOrder(
  actor: Express.User,
  id: number,
  action: WorkOrderAction,
  step: Step,
  link: string,
) {
  const { side, from, to } = TRANSITIONS[action];
  const row = await db().transaction(async (transaction) => {
    const current = await WorkOrder.findByPk(id, { transaction });
    const actorSide = current ? sideOf(actor, current) : null;
    if (!current || !actorSide) throw new AppError("not_found", "That work order was not found");
    if (actorSide !== side)
      throw new AppError("forbidden", `Only ${SIDE_WORDS[side]} may ${action} this work order`);
    if (!from.includes(current.status))
      throw new AppError(
        "conflict",
        `This work order is ${current.status}; only a ${from.join(" or ")} one can be changed that way`,
      );
    const now = new Date();
    const changes = await step.changes(current, now, transaction);
    const [count, rows] = await WorkOrder.update(
      { ...changes, status: to, [STAMP[action]]: now },
      { where: { id, status: current.status }, returning: true, transaction },
    );
    const updated = rows[0];
    if (count === 0 || !updated)
      throw new AppError("conflict", "Someone else changed this work order first; reload it");
    await recordAudit(
      {
        actorUserId: actor.id,
        action: `work_order.${to}`,
        subjectType: "work_order",
        subjectId: id,
        before: { status: current.status },
        after: { status: to, ...changes },
      },
      transaction,
    );
    await mailOtherSide(
      updated,
      side === "shop" ? "service" : "shop",
      step.news(updated, actor),
      link,
      transaction,
    );
    await step.after?.(updated, actor, transaction);
    return updated;
  });
  return toWorkOrderDto(row, side);
}

interface SiteRow {
  time_zone: string;
  address_line: string;
  postal_code: string | null;
}

async function siteOf(row: WorkOrder, transaction: Transaction): Promise<SiteRow> {
  const [site] = await db().query<SiteRow>(
    "SELECT time_zone, address_line, postal_code FROM sites WHERE id = $1",
    { bind: [row.siteId], type: QueryTypes.SELECT, transaction },
  );
  return site ?? { time_zone: "UTC", address_line: "", postal_code: null };
}

const ARRIVAL_HORIZON_DAYS = 366;

function arrivalInstant(local: string, timeZone: string, now: Date): Date {
  const refuse = (message: string) =>
    new AppError("invalid_input", message, [{ path: "body.arrivalLocal", message }]);
  const instant = instantFromLocal(local, timeZone);
  if (!instant) throw refuse(`That time does not exist in ${timeZone} (the clocks skip it); pick another`);
  if (instant.getTime() <= now.getTime()) throw refuse("Choose an arrival time that is still ahead");
  if (instant.getTime() > now.getTime() + ARRIVAL_HORIZON_DAYS * 86_400_000)
    throw refuse("Choose an arrival time within a year");
  return instant;
}

export function acceptWorkOrder(
  actor: Express.User,
  id: number,
  input: AcceptWorkOrder,
  warningDays: number,
  link: string,
) {
  let zone = "UTC";
  return moveWorkOrder(
    actor,
    id,
    "accept",
    {
      // A technician who stopped being cleared since the request cannot take the job: the snapshot is the shop's proof.
      changes: async (row, now, transaction) => {
        zone = (await siteOf(row, transaction)).time_zone;
        const arrivalAt = arrivalInstant(input.arrivalLocal, zone, now);
        const snapshot = await standingSnapshotNow(
          row.technicianId,
          row.requirementSetId,
          now,
          warningDays,
          transaction,
        );
        if (!isClearedNow(snapshot.standing)) {
          throw new AppError(
            "conflict",
            `${snapshot.technicianName} is not cleared right now; renew what lapsed before accepting`,
            unmetRequirements(snapshot),
          );
        }
        return { snapshotAccepted: snapshot, arrivalAt };
      },
      news: (row, who) => ({
        subject: "accepted",
        lines: [
          `${who.name} accepted work order #${row.id}.`,
          `Arrival: ${formatLocalDateTime(row.arrivalAt!, zone)} (the site's time).`,
        ],
        next: {
          sentence:
            "Have the site's lockout/tagout procedure and any permits ready for the arrival time; change plans in the work order's messages.",
          label: "Open the work order",
        },
      }),
      // The job sheet goes to the service side only now, with the details that were withheld while it was a request.
      after: async (row, who, transaction) => {
        const site = await siteOf(row, transaction);
        const lines = onSiteLines(onSiteDetailsOf(row, site.address_line, site.postal_code));
        await mailOtherSide(
          row,
          "service",
          {
            subject: "accepted, what you need on site",
            lines: [
              `${who.name} accepted work order #${row.id}. Arrival: ${formatLocalDateTime(row.arrivalAt!, site.time_zone)} (the site's time).`,
              ...lines.map(([label, value]) => `${label}: ${value}`),
            ],
            next: {
              sentence: "Check in with the on-site contact and follow the site's induction before any work.",
              label: "Open the work order",
            },
            after: [`${SAFETY_CAUTION_TITLE}: ${SAFETY_CAUTIONS.join(" ")}`],
          },
          link,
          transaction,
        );
      },
    },
    link,
  );
}

export function declineWorkOrder(actor: Express.User, id: number, input: DeclineWorkOrder, link: string) {
  const { reason, proposedDate } = input;
  return moveWorkOrder(
    actor,
    id,
    "decline",
    {
      changes: (_row, now) => {
        if (proposedDate && proposedDate < now.toISOString().slice(0, 10)) {
          const message = "Propose a date that is still ahead";
          throw new AppError("invalid_input", message, [{ path: "body.proposedDate", message }]);
        }
        return { declineReason: reason, proposedDate: proposedDate ?? null };
      },
      news: (row, who) => ({
        subject: "declined",
        lines: [
          `${who.name} declined work order #${row.id}.`,
          `Reason: ${reason}`,
          ...(proposedDate ? [`They could come on ${formatCalendarDate(proposedDate)} instead.`] : []),
        ],
        next: {
          sentence: proposedDate
            ? "Take the proposed date, or send the same job to another cleared technician, from the work order."
            : "Send the same job to another cleared technician from the work order.",
          label: "Open the work order",
        },
      }),
    },
    link,
  );
}

export function completeWorkOrder(
  actor: Express.User,
  id: number,
  input: CompleteWorkOrder,
  warningDays: number,
  link: string,
) {
  return moveWorkOrder(
    actor,
    id,
    "complete",
    {
      // Recorded whatever it shows: the work is done, and the snapshot says what stood on that day.
      changes: async (row, now, transaction) => ({
        hoursWorked: input.hoursWorked.toFixed(2),
        travelHours: input.travelHours.toFixed(2),
        completionNote: input.note ?? null,
        partsUsed: input.partsUsed,
        snapshotCompleted: await standingSnapshotNow(
          row.technicianId,
          row.requirementSetId,
          now,
          warningDays,
          transaction,
        ),
      }),
      news: (row, who) => ({
        subject: "completed, please confirm",
        lines: [
          `${who.name} marked work order #${row.id} completed: ${input.hoursWorked} hours on site, ${input.travelHours} hours travel.`,
          ...(input.note ? [`Note: ${input.note}`] : []),
        ],
        next: {
          sentence:
            "Check the work on site, then confirm it is complete, or dispute it with a reason if something is open.",
          label: "Confirm or dispute",
        },
      }),
    },
    link,
  );
}

export function confirmWorkOrder(actor: Express.User, id: number, link: string) {
  return moveWorkOrder(
    actor,
    id,
    "confirm",
    {
      // Confirmed preventive maintenance moves its plan to the next due date, and a machine that was down for this
      // work runs again, in the same transaction.
      changes: async (row, now, transaction) => {
        await movePlanForConfirmedWork(row, actor.id, transaction);
        await runningAgainOnConfirm(row, actor.id, now, transaction);
        return {};
      },
      news: (row, who) => ({
        subject: "confirmed",
        lines: [`${who.name} confirmed that work order #${row.id} is complete.`],
        next: {
          sentence: "Nothing more is needed; the shop can now rate the work.",
          label: "Open the work order",
        },
      }),
    },
    link,
  );
}

/** The reason goes into the thread, where both sides settle it; the rating waits until the shop confirms. */
export function disputeWorkOrder(actor: Express.User, id: number, reason: string, link: string) {
  return moveWorkOrder(
    actor,
    id,
    "dispute",
    {
      changes: () => ({ disputeReason: reason }),
      news: (row, who) => ({
        subject: "disputed",
        lines: [`${who.name} disputed the completion of work order #${row.id}.`, `Reason: ${reason}`],
        next: {
          sentence:
            "Answer in the work order's messages; record the completion again once the open point is done.",
          label: "Open the work order",
        },
        bell: "work_order.disputed",
      }),
      after: async (row, who, transaction) => {
        await WorkOrderMessage.create(
          {
            workOrderId: row.id,
            authorUserId: who.id,
            side: "shop",
            body: `Disputed the completion: ${reason}`,
            documentId: null,
          },
          { transaction },
        );
      },
    },
    link,
  );
}

export function cancelWorkOrder(actor: Express.User, id: number, reason: string, link: string) {
  return moveWorkOrder(
    actor,
    id,
    "cancel",
    {
      changes: () => ({ cancelReason: reason }),
      news: (row, who) => ({
        subject: "cancelled by the shop",
        lines: [`${who.name} cancelled work order #${row.id}.`, `Reason: ${reason}`],
        next: {
          sentence: "Nothing more is needed: do not travel to the site for this job.",
          label: "Open the work order",
        },
        bell: "work_order.cancelled",
      }),
    },
    link,
  );
}
