import { QueryTypes, type Transaction } from "sequelize";
import {
  DOWNTIME_CHART_MONTHS,
  downtimeByMonth,
  serviceTimesByCompany,
  summariseDowntime,
} from "../../shared/machines/downtime.ts";
import type { MachineDowntimeDto } from "../../shared/machines/downtime-schemas.ts";
import { db } from "../db/sequelize.ts";
import { selectRows } from "../db/sql.ts";
import { recordAudit } from "../audit/index.ts";

type Opener =
  | { by: "hand"; userId: number }
  | { by: "service_request"; userId: number; serviceRequestId: number }
  | { by: "work_order"; userId: number; workOrderId: number };
type Closer = { by: "hand"; userId: number } | { by: "confirmation"; userId: number; workOrderId: number };

/** The audit event of a period opening or ending, in the same transaction. */
function auditPeriod(
  action: "machine.down" | "machine.running",
  equipmentId: number,
  userId: number,
  after: Record<string, unknown>,
  transaction: Transaction,
) {
  return recordAudit(
    { actorUserId: userId, action, subjectType: "equipment", subjectId: equipmentId, after },
    transaction,
  );
}

/**
 * Opens a downtime period for the machine unless one is open already (a request raised for a machine already marked
 * down is the same stoppage, not a second one). Returns whether a period was opened. The machine's state is the
 * caller's: the form writes its own, a request or work order calls `markDownBy`.
 */
export async function openDowntime(
  equipmentId: number,
  opener: Opener,
  at: Date,
  transaction: Transaction,
): Promise<boolean> {
  const rows = await selectRows<{ id: number }>(
    transaction,
    `INSERT INTO machine_downtime (equipment_id, started_at, opened_by, opened_by_user_id, service_request_id, work_order_id)
     VALUES ($1, $2, $3, $4, $5, $6)
     ON CONFLICT (equipment_id) WHERE ended_at IS NULL DO NOTHING RETURNING id`,
    [
      equipmentId,
      at,
      opener.by,
      opener.userId,
      opener.by === "service_request" ? opener.serviceRequestId : null,
      opener.by === "work_order" ? opener.workOrderId : null,
    ],
  );
  const opened = rows[0];
  if (opened)
    await auditPeriod(
      "machine.down",
      equipmentId,
      opener.userId,
      { downtimeId: opened.id, startedAt: at.toISOString(), openedBy: opener.by },
      transaction,
    );
  return opened !== undefined;
}

/** Ends the machine's open period, if any, at `at` (never before it began). Returns whether one was closed. */
export async function closeDowntime(
  equipmentId: number,
  closer: Closer,
  at: Date,
  transaction: Transaction,
): Promise<boolean> {
  const rows = await selectRows<{ id: number; ended_at: Date }>(
    transaction,
    `UPDATE machine_downtime SET ended_at = GREATEST($2::timestamptz, started_at), closed_by = $3,
            closed_by_user_id = $4, closed_work_order_id = $5
      WHERE equipment_id = $1 AND ended_at IS NULL RETURNING id, ended_at`,
    [equipmentId, at, closer.by, closer.userId, closer.by === "confirmation" ? closer.workOrderId : null],
  );
  const closed = rows[0];
  if (closed)
    await auditPeriod(
      "machine.running",
      equipmentId,
      closer.userId,
      { downtimeId: closed.id, endedAt: new Date(closed.ended_at).toISOString(), closedBy: closer.by },
      transaction,
    );
  return closed !== undefined;
}

/**
 * A service request or work order raised for a machine that is down: the machine is marked down (a machine out of
 * service or sold keeps its state) and its period opens at the moment the shop called for help.
 */
export async function markDownBy(
  equipmentId: number,
  opener: Exclude<Opener, { by: "hand" }>,
  at: Date,
  transaction: Transaction,
): Promise<void> {
  const [machine] = await selectRows<{ id: number }>(
    transaction,
    "UPDATE equipment SET state = 'down', updated_at = $2 WHERE id = $1 AND state IN ('running','down') RETURNING id",
    [equipmentId, at],
  );
  if (machine) await openDowntime(equipmentId, opener, at, transaction);
}

/**
 * The shop confirmed work on a machine that was down for it: the machine runs again from the moment the company
 * completed the work (not from when the shop got round to confirming), and its open period ends there.
 */
export async function runningAgainOnConfirm(
  workOrder: { id: number; equipmentId: number | null; urgency: string; completedAt: Date | null },
  actorUserId: number,
  now: Date,
  transaction: Transaction,
): Promise<void> {
  if (workOrder.equipmentId === null || workOrder.urgency !== "down") return;
  const [machine] = await selectRows<{ id: number }>(
    transaction,
    "UPDATE equipment SET state = 'running', updated_at = $2 WHERE id = $1 AND state = 'down' RETURNING id",
    [workOrder.equipmentId, now],
  );
  if (!machine) return;
  await closeDowntime(
    workOrder.equipmentId,
    { by: "confirmation", userId: actorUserId, workOrderId: workOrder.id },
    workOrder.completedAt ?? now,
    transaction,
  );
}

/** A hand change of state (the machine form, the page's buttons): leaving "down" ends the period, entering opens one. */
export async function followStateChange(
  equipmentId: number,
  before: string | null,
  after: string,
  userId: number,
  at: Date,
  transaction: Transaction,
): Promise<void> {
  if (before === after) return;
  if (after === "down") await openDowntime(equipmentId, { by: "hand", userId }, at, transaction);
  else if (before === "down") await closeDowntime(equipmentId, { by: "hand", userId }, at, transaction);
}

interface PeriodRow {
  id: number;
  started_at: Date;
  ended_at: Date | null;
  opened_by: "hand" | "service_request" | "work_order";
  closed_by: "hand" | "confirmation" | null;
  service_request_id: number | null;
  work_order_id: number | null;
}

interface WorkRow {
  company_id: number;
  company_name: string;
  called_at: Date;
  on_site_at: Date | null;
  completed_at: Date | null;
}

/**
 * The machine page's downtime panel: hours down per month of the last year in the site's zone, the periods, and the
 * response and repair times of each company whose work on this machine was confirmed in that year. Periods and work
 * read here are facts about the machine, so a new owner sees the year's chart whole; prices and people are not read.
 */
export async function readMachineDowntime(machineId: number, now: Date): Promise<MachineDowntimeDto> {
  const [site] = await db().query<{ time_zone: string }>(
    "SELECT s.time_zone FROM equipment e JOIN sites s ON s.id = e.site_id WHERE e.id = $1",
    { bind: [machineId], type: QueryTypes.SELECT },
  );
  const timeZone = site?.time_zone ?? "UTC";
  const firstMonth = downtimeByMonth([], now, timeZone)[0]!.month;
  const [periods, work] = await Promise.all([
    db().query<PeriodRow>(
      `SELECT id, started_at, ended_at, opened_by, closed_by, service_request_id, work_order_id
         FROM machine_downtime
        WHERE equipment_id = $1 AND (ended_at IS NULL OR ended_at >= ($2::date::timestamp AT TIME ZONE $3))
        ORDER BY started_at DESC, id DESC`,
      { bind: [machineId, `${firstMonth}-01`, timeZone], type: QueryTypes.SELECT },
    ),
    db().query<WorkRow>(
      `SELECT w.service_company_id AS company_id, c.name AS company_name,
              COALESCE(i.invited_at, w.created_at) AS called_at,
              COALESCE(w.arrival_at, w.accepted_at) AS on_site_at, w.completed_at
         FROM work_orders w
         JOIN companies c ON c.id = w.service_company_id
         LEFT JOIN service_requests sr ON sr.work_order_id = w.id
         LEFT JOIN service_request_invitations i ON i.request_id = sr.id AND i.company_id = w.service_company_id
        WHERE w.equipment_id = $1 AND w.status = 'confirmed'
          AND w.completed_at >= $2::timestamptz - make_interval(months => $3)`,
      { bind: [machineId, now, DOWNTIME_CHART_MONTHS], type: QueryTypes.SELECT },
    ),
  ]);
  const asPeriods = periods.map((p) => ({
    startedAt: new Date(p.started_at),
    endedAt: p.ended_at ? new Date(p.ended_at) : null,
  }));
  const summary = summariseDowntime(asPeriods, now, timeZone);
  return {
    machineId,
    timeZone,
    months: summary.months,
    totalHours: summary.totalHours,
    periods: summary.periods,
    medianHoursToRestore: summary.medianHoursToRestore,
    downSince: summary.downSince?.toISOString() ?? null,
    recent: periods.map((p) => ({
      id: p.id,
      startedAt: new Date(p.started_at).toISOString(),
      endedAt: p.ended_at ? new Date(p.ended_at).toISOString() : null,
      openedBy: p.opened_by,
      closedBy: p.closed_by,
      serviceRequestId: p.service_request_id,
      workOrderId: p.work_order_id,
    })),
    companies: serviceTimesByCompany(
      work.map((w) => ({
        companyId: w.company_id,
        companyName: w.company_name,
        calledAt: new Date(w.called_at),
        onSiteAt: w.on_site_at ? new Date(w.on_site_at) : null,
        completedAt: w.completed_at ? new Date(w.completed_at) : null,
      })),
    ),
  };
}
