import { QueryTypes, type Transaction } from "sequelize";
import { calendarDateIn } from "../../../shared/dates/local-time.ts";
import { addCalendarDays } from "../../../shared/standing/iso-date.ts";
import { addCalendarMonths } from "../../../shared/standing/training-validity.ts";
import { db } from "../sequelize.ts";

/**
 * Maintenance plans on the Tamsin Joliet mill: an annual inspection coming due in 24 days (the daily job's 30-day
 * reminder goes out on its next run), a six-month way lube and backlash check done lately, and a running-hours
 * spindle check with a year of meter readings so its date is projected.
 */
export async function insertDemoMaintenancePlans(today: Date, transaction: Transaction): Promise<void> {
  const [machine] = await db().query<{ id: number; buyer: number; time_zone: string }>(
    `SELECT e.id, u.id AS buyer, s.time_zone FROM equipment e
       JOIN sites s ON s.id = e.site_id
       JOIN users u ON u.company_id = s.company_id AND u.role = 'buyer'
      WHERE e.serial_number = 'VM40-2209' ORDER BY u.id LIMIT 1`,
    { transaction, type: QueryTypes.SELECT },
  );
  if (!machine) throw new Error("demo maintenance plans: the Joliet mill is missing");
  const day = calendarDateIn(today, machine.time_zone);
  const plan = (values: unknown[]) =>
    db().query(
      `INSERT INTO maintenance_plans (equipment_id, name, interval_kind, interval_months, interval_hours, last_done_on,
         last_done_hours, created_by)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8)`,
      { bind: [machine.id, ...values, machine.buyer], transaction },
    );
  await plan([
    "Annual inspection",
    "months",
    12,
    null,
    addCalendarDays(addCalendarMonths(day, -12), 24),
    null,
  ]);
  await plan(["Way lube and backlash check", "months", 6, null, addCalendarMonths(day, -2), null]);
  await plan(["Spindle bearing check", "hours", null, 2_000, null, 14_200]);
  await db().query(
    `INSERT INTO machine_hour_readings (equipment_id, hours, read_on, recorded_by)
     VALUES ($1, 12850, $2, $4), ($1, 15700, $3, $4)`,
    { bind: [machine.id, addCalendarDays(day, -360), day, machine.buyer], transaction },
  );
}
