import { QueryTypes, type Transaction } from "sequelize";
import { calendarDateIn } from "../../shared/dates/local-time.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";

interface LinkedPlan {
  link_id: number;
  plan_id: number;
  interval_kind: "months" | "hours";
  last_done_on: string | null;
  last_done_hours: number | null;
  interval_hours: number | null;
  time_zone: string;
  latest_hours: number | null;
}

function hoursAtService(plan: LinkedPlan): number | null {
  if (plan.interval_kind !== "hours") return plan.last_done_hours;
  const last = plan.last_done_hours ?? 0;
  return plan.latest_hours !== null && plan.latest_hours > last
    ? plan.latest_hours
    : last + (plan.interval_hours ?? 0);
}

/**
 * Moves the maintenance plan a confirmed work order served: the work counts as done on the day the company completed
 * it at the site (not the day the shop got round to confirming), and a running-hours plan restarts from the latest
 * meter reading, or from the due reading when the shop never read the meter. Runs in the confirmation's transaction.
 */
export async function movePlanForConfirmedWork(
  workOrder: { id: number; completedAt: Date | null },
  actorUserId: number,
  transaction: Transaction,
): Promise<void> {
  const [linked] = await db().query<LinkedPlan>(
    `SELECT mpr.id AS link_id, p.id AS plan_id, p.interval_kind, p.last_done_on::text, p.last_done_hours,
            p.interval_hours, s.time_zone,
            (SELECT r.hours FROM machine_hour_readings r WHERE r.equipment_id = p.equipment_id
              ORDER BY r.read_on DESC, r.id DESC LIMIT 1) AS latest_hours
       FROM maintenance_plan_requests mpr
       JOIN service_requests sr ON sr.id = mpr.service_request_id
       JOIN maintenance_plans p ON p.id = mpr.plan_id
       JOIN equipment e ON e.id = p.equipment_id
       JOIN sites s ON s.id = e.site_id
      WHERE sr.work_order_id = $1 AND mpr.done_work_order_id IS NULL
      FOR UPDATE OF p, mpr`,
    { bind: [workOrder.id], transaction, type: QueryTypes.SELECT },
  );
  if (!linked) return;
  const doneOn = calendarDateIn(workOrder.completedAt ?? new Date(), linked.time_zone);
  const doneHours = hoursAtService(linked);
  await db().query(
    `UPDATE maintenance_plans SET last_done_on = $2, last_done_hours = $3, updated_at = now() WHERE id = $1`,
    { bind: [linked.plan_id, doneOn, doneHours], transaction },
  );
  await db().query(
    "UPDATE maintenance_plan_requests SET done_work_order_id = $2, done_on = $3 WHERE id = $1",
    { bind: [linked.link_id, workOrder.id, doneOn], transaction },
  );
  await recordAudit(
    {
      actorUserId,
      action: "maintenance_plan.done",
      subjectType: "maintenance_plan",
      subjectId: linked.plan_id,
      before: { lastDoneOn: linked.last_done_on, lastDoneHours: linked.last_done_hours },
      after: { lastDoneOn: doneOn, lastDoneHours: doneHours, workOrderId: workOrder.id },
    },
    transaction,
  );
}
