import type { Transaction } from "sequelize";
import type { CompleteWorkOrder, WorkOrderAction } from "../../shared/work-orders/schemas.ts";
import { TRANSITIONS } from "../../shared/work-orders/work-order-transitions.ts";
import { isClearedNow, unmetRequirements } from "../../shared/work-orders/standing-snapshot.ts";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { WorkOrder } from "./model.ts";
import { sideOf } from "./policy.ts";
import { standingSnapshotNow } from "./standing-now.ts";
import { mailOtherSide, type WorkOrderNews } from "./work-order-emails.ts";
import { toWorkOrderDto } from "./dto.ts";
import { movePlanForConfirmedWork } from "../machines/maintenance-completion.ts";

type Changes = Partial<
  Pick<
    WorkOrder,
    | "declineReason"
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
}

const STAMP = {
  accept: "acceptedAt",
  decline: "declinedAt",
  complete: "completedAt",
  confirm: "confirmedAt",
} as const;
const SIDE_WORDS = { shop: "the shop that raised it", service: "the service company" } as const;

/**
 * One status change: checked against the side and the expected status, then written by a conditional update on that
 * status, so of two people acting at once only one wins and the other gets a 409. Audit and e-mail share its transaction.
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
    if (current.status !== from)
      throw new AppError(
        "conflict",
        `This work order is ${current.status}; only a ${from} one can be changed that way`,
      );
    const now = new Date();
    const changes = await step.changes(current, now, transaction);
    const [count, rows] = await WorkOrder.update(
      { ...changes, status: to, [STAMP[action]]: now },
      { where: { id, status: from }, returning: true, transaction },
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
        before: { status: from },
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
    return updated;
  });
  return toWorkOrderDto(row, side);
}

export function acceptWorkOrder(actor: Express.User, id: number, warningDays: number, link: string) {
  return moveWorkOrder(
    actor,
    id,
    "accept",
    {
      // A technician who stopped being cleared since the request cannot take the job: the snapshot is the shop's proof.
      changes: async (row, now, transaction) => {
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
        return { snapshotAccepted: snapshot };
      },
      news: (row, who) => ({
        subject: "accepted",
        lines: [`${who.name} accepted work order #${row.id}.`],
        next: {
          sentence:
            "Agree the arrival time in the work order's messages, and have the site's lockout/tagout procedure and any permits ready.",
          label: "Open the work order",
        },
      }),
    },
    link,
  );
}

export function declineWorkOrder(actor: Express.User, id: number, reason: string, link: string) {
  return moveWorkOrder(
    actor,
    id,
    "decline",
    {
      changes: () => ({ declineReason: reason }),
      news: (row, who) => ({
        subject: "declined",
        lines: [`${who.name} declined work order #${row.id}.`, `Reason: ${reason}`],
        next: {
          sentence: "Search the directory for another cleared technician and raise a new work order.",
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
            "Check the work on site, then confirm it is complete (or reply in the messages if something is open).",
          label: "Confirm the work order",
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
      // Confirmed preventive maintenance moves its plan to the next due date in the same transaction.
      changes: async (row, _now, transaction) => {
        await movePlanForConfirmedWork(row, actor.id, transaction);
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
