import { QueryTypes, type Transaction } from "sequelize";
import { calendarDateIn } from "../../shared/dates/local-time.ts";
import { planDue, type HourReading, type PlanFacts } from "../../shared/machines/maintenance-due.ts";
import type {
  HourReadingInput,
  MaintenancePlanDto,
  MaintenancePlanInput,
  MaintenancePlanListDto,
} from "../../shared/machines/maintenance-schemas.ts";
import { startOfDateInstant } from "../../shared/standing/training-validity.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { AppError } from "../http/app-error.ts";

// Machines, sites and service requests belong to other domains; they are read here through plain SQL, no model shared.
export const select = <T extends object>(sql: string, bind: unknown[], transaction?: Transaction) =>
  db().query<T>(sql, { bind, transaction, type: QueryTypes.SELECT });

export interface MachineAtSite {
  id: number;
  site_id: number;
  company_id: number;
  time_zone: string;
  builder: string;
  model: string;
  serial_number: string | null;
  site_name: string;
}

/** The machine with its site's shop and zone; null when missing, so the caller answers 404 for a foreign one too. */
export async function findMachine(machineId: number, transaction?: Transaction) {
  const [row] = await select<MachineAtSite>(
    `SELECT e.id, e.site_id, s.company_id, s.time_zone, e.builder, e.model, e.serial_number, s.name AS site_name
       FROM equipment e JOIN sites s ON s.id = e.site_id WHERE e.id = $1`,
    [machineId],
    transaction,
  );
  return row ?? null;
}

export async function isShopMachine(companyId: number, machineId: number) {
  return (await findMachine(machineId))?.company_id === companyId;
}

async function ownMachine(user: Express.User, machineId: number, transaction?: Transaction) {
  const machine = await findMachine(machineId, transaction);
  if (!machine || machine.company_id !== user.companyId)
    throw new AppError("not_found", "That machine was not found");
  return machine;
}

export interface PlanRow {
  id: number;
  equipment_id: number;
  name: string;
  interval_kind: "months" | "hours";
  interval_months: number | null;
  interval_hours: number | null;
  last_done_on: string | null;
  last_done_hours: number | null;
  updated_at: Date;
}

export function planFacts(row: PlanRow): PlanFacts {
  return {
    interval:
      row.interval_kind === "months"
        ? { kind: "months", months: row.interval_months! }
        : { kind: "hours", hours: row.interval_hours! },
    lastDoneOn: row.last_done_on,
    lastDoneHours: row.last_done_hours,
  };
}

/** The readings the due rule uses: the latest and those of the year before it. */
export async function readingsOf(machineId: number, transaction?: Transaction): Promise<HourReading[]> {
  const rows = await select<{ read_on: string; hours: number }>(
    `SELECT read_on::text, hours FROM machine_hour_readings r
      WHERE equipment_id = $1
        AND read_on >= (SELECT max(read_on) - 366 FROM machine_hour_readings WHERE equipment_id = $1)
      ORDER BY read_on, id`,
    [machineId],
    transaction,
  );
  return rows.map((r) => ({ readOn: r.read_on, hours: r.hours }));
}

interface OpenRequestRow {
  plan_id: number;
  service_request_id: number;
  status: string;
  window_start: string;
  window_end: string;
  due_key: string;
  created_at: Date;
}

export async function listPlans(
  user: Express.User,
  machineId: number,
  asOf = new Date(),
): Promise<MaintenancePlanListDto> {
  const machine = await ownMachine(user, machineId);
  const today = calendarDateIn(asOf, machine.time_zone);
  const [plans, readings, latest, requests] = await Promise.all([
    select<PlanRow>(
      `SELECT id, equipment_id, name, interval_kind, interval_months, interval_hours, last_done_on::text,
              last_done_hours, updated_at
         FROM maintenance_plans WHERE equipment_id = $1 ORDER BY name, id`,
      [machineId],
    ),
    readingsOf(machineId),
    select<{ hours: number; read_on: string; created_at: Date }>(
      `SELECT hours, read_on::text, created_at FROM machine_hour_readings WHERE equipment_id = $1
        ORDER BY read_on DESC, id DESC LIMIT 1`,
      [machineId],
    ),
    select<OpenRequestRow>(
      `SELECT mpr.plan_id, mpr.service_request_id, sr.status, mpr.window_start::text, mpr.window_end::text,
              mpr.due_key, mpr.created_at
         FROM maintenance_plan_requests mpr
         JOIN maintenance_plans p ON p.id = mpr.plan_id
         JOIN service_requests sr ON sr.id = mpr.service_request_id
        WHERE p.equipment_id = $1 AND mpr.done_work_order_id IS NULL AND sr.status IN ('open', 'decided')
        ORDER BY mpr.created_at DESC`,
      [machineId],
    ),
  ]);
  const reading = latest[0];
  return {
    machineId,
    machine: {
      builder: machine.builder,
      model: machine.model,
      serialNumber: machine.serial_number,
      siteName: machine.site_name,
    },
    today,
    siteTimeZone: machine.time_zone,
    latestReading: reading
      ? { hours: reading.hours, readOn: reading.read_on, recordedAt: reading.created_at.toISOString() }
      : null,
    plans: plans.map((p) => toPlanDto(p, readings, today, requests, machine.time_zone)),
  };
}

function toPlanDto(
  row: PlanRow,
  readings: HourReading[],
  today: string,
  requests: OpenRequestRow[],
  timeZone: string,
): MaintenancePlanDto {
  const due = planDue(planFacts(row), readings, today);
  const open = requests.find((r) => r.plan_id === row.id && r.due_key === due.dueKey);
  return {
    id: row.id,
    machineId: row.equipment_id,
    name: row.name,
    intervalKind: row.interval_kind,
    intervalMonths: row.interval_months,
    intervalHours: row.interval_hours,
    lastDoneOn: row.last_done_on,
    lastDoneHours: row.last_done_hours,
    due,
    dueStartsAt: due.dueOn ? startOfDateInstant(due.dueOn, timeZone).toISOString() : null,
    openRequest: open
      ? {
          serviceRequestId: open.service_request_id,
          status: open.status,
          windowStart: open.window_start,
          windowEnd: open.window_end,
          createdAt: open.created_at.toISOString(),
        }
      : null,
    updatedAt: new Date(row.updated_at).toISOString(),
  };
}

function refuseFutureDate(path: string, isoDate: string | undefined, today: string) {
  if (isoDate && isoDate > today)
    throw new AppError("invalid_input", "That date is still to come at the machine's site", [
      { path, message: `must not be after today at the site (${today})` },
    ]);
}

function columnsOf(input: MaintenancePlanInput) {
  const months = input.intervalKind === "months";
  return [
    input.name,
    input.intervalKind,
    months ? input.intervalMonths! : null,
    months ? null : input.intervalHours!,
    months ? input.lastDoneOn! : (input.lastDoneOn ?? null),
    months ? (input.lastDoneHours ?? null) : input.lastDoneHours!,
  ];
}

const PLAN_COLUMNS = `id, equipment_id, name, interval_kind, interval_months, interval_hours, last_done_on::text,
  last_done_hours, updated_at`;

async function planOf(machineId: number, planId: number, transaction: Transaction) {
  const [row] = await select<PlanRow>(
    `SELECT ${PLAN_COLUMNS} FROM maintenance_plans WHERE id = $1 AND equipment_id = $2 FOR UPDATE`,
    [planId, machineId],
    transaction,
  );
  if (!row) throw new AppError("not_found", "That maintenance plan was not found");
  return row;
}

async function planDtoNow(user: Express.User, machineId: number, planId: number) {
  const list = await listPlans(user, machineId);
  return list.plans.find((p) => p.id === planId)!;
}

export async function addPlan(user: Express.User, machineId: number, input: MaintenancePlanInput) {
  const id = await db().transaction(async (transaction) => {
    const machine = await ownMachine(user, machineId, transaction);
    refuseFutureDate("body.lastDoneOn", input.lastDoneOn, calendarDateIn(new Date(), machine.time_zone));
    const [row] = await select<PlanRow>(
      `INSERT INTO maintenance_plans (equipment_id, name, interval_kind, interval_months, interval_hours, last_done_on,
         last_done_hours, created_by)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8) RETURNING ${PLAN_COLUMNS}`,
      [machineId, ...columnsOf(input), user.id],
      transaction,
    );
    await recordAudit(
      {
        actorUserId: user.id,
        action: "maintenance_plan.added",
        subjectType: "maintenance_plan",
        subjectId: row!.id,
        after: { ...row },
      },
      transaction,
    );
    return row!.id;
  });
  return planDtoNow(user, machineId, id);
}

export async function changePlan(
  user: Express.User,
  machineId: number,
  planId: number,
  input: MaintenancePlanInput,
) {
  await db().transaction(async (transaction) => {
    const machine = await ownMachine(user, machineId, transaction);
    refuseFutureDate("body.lastDoneOn", input.lastDoneOn, calendarDateIn(new Date(), machine.time_zone));
    const before = await planOf(machineId, planId, transaction);
    const [after] = await select<PlanRow>(
      `UPDATE maintenance_plans SET name = $3, interval_kind = $4, interval_months = $5, interval_hours = $6,
         last_done_on = $7, last_done_hours = $8, updated_at = now()
       WHERE id = $1 AND equipment_id = $2 RETURNING ${PLAN_COLUMNS}`,
      [planId, machineId, ...columnsOf(input)],
      transaction,
    );
    await recordAudit(
      {
        actorUserId: user.id,
        action: "maintenance_plan.changed",
        subjectType: "maintenance_plan",
        subjectId: planId,
        before: { ...before },
        after: { ...after },
      },
      transaction,
    );
  });
  return planDtoNow(user, machineId, planId);
}

export async function removePlan(user: Express.User, machineId: number, planId: number) {
  await db().transaction(async (transaction) => {
    await ownMachine(user, machineId, transaction);
    const before = await planOf(machineId, planId, transaction);
    await db().query("DELETE FROM maintenance_plans WHERE id = $1", { bind: [planId], transaction });
    await recordAudit(
      {
        actorUserId: user.id,
        action: "maintenance_plan.removed",
        subjectType: "maintenance_plan",
        subjectId: planId,
        before: { ...before },
      },
      transaction,
    );
  });
}

/** A meter never runs backwards, so a reading below the latest one is a typing slip and is refused. */
export async function recordHourReading(user: Express.User, machineId: number, input: HourReadingInput) {
  await db().transaction(async (transaction) => {
    const machine = await ownMachine(user, machineId, transaction);
    const today = calendarDateIn(new Date(), machine.time_zone);
    const readOn = input.readOn ?? today;
    refuseFutureDate("body.readOn", readOn, today);
    // Serialises readings of one machine, so two at once cannot both pass the check against the latest.
    await db().query("SELECT id FROM equipment WHERE id = $1 FOR UPDATE", { bind: [machineId], transaction });
    const [latest] = await select<{ hours: number; read_on: string }>(
      `SELECT hours, read_on::text FROM machine_hour_readings WHERE equipment_id = $1
        ORDER BY read_on DESC, id DESC LIMIT 1`,
      [machineId],
      transaction,
    );
    if (latest && readOn >= latest.read_on && input.hours < latest.hours)
      throw new AppError("invalid_input", "The meter reads less than it did before", [
        { path: "body.hours", message: `must be at least ${latest.hours} (read on ${latest.read_on})` },
      ]);
    await db().query(
      "INSERT INTO machine_hour_readings (equipment_id, hours, read_on, recorded_by) VALUES ($1, $2, $3, $4)",
      { bind: [machineId, input.hours, readOn, user.id], transaction },
    );
  });
  return listPlans(user, machineId);
}
