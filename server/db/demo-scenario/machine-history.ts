import { QueryTypes, type Transaction } from "sequelize";
import { DEFAULT_WARNING_DAYS } from "../../../shared/standing/warning-windows.ts";
import { standingSnapshotNow } from "../../work-orders/index.ts";
import { db } from "../sequelize.ts";

const DAY = 86_400_000;

async function one<T extends object>(sql: string, bind: unknown[], transaction: Transaction): Promise<T> {
  const [row] = await db().query<T>(sql, { bind, transaction, type: QueryTypes.SELECT });
  if (!row) throw new Error(`demo machine history: nothing for ${sql.slice(0, 60)}`);
  return row;
}

/**
 * The Tamsin shop's Joliet mill gets a history: a spindle repair the shop wrote down itself 100 days ago, and a
 * confirmed work order for the same spindle fault 40 days ago, so the page opens on a flagged repeat fault. The work
 * order carries the snapshots it would have taken on those days.
 */
export async function insertDemoMachineHistory(today: Date, transaction: Transaction): Promise<void> {
  const machine = await one<{ id: number; site_id: number; shop_id: number; buyer: number }>(
    `SELECT e.id, e.site_id, s.company_id AS shop_id,
            (SELECT u.id FROM users u WHERE u.company_id = s.company_id AND u.role = 'buyer' ORDER BY u.id LIMIT 1) AS buyer
       FROM equipment e JOIN sites s ON s.id = e.site_id WHERE e.serial_number = 'VM40-2209'`,
    [],
    transaction,
  );
  const tech = await one<{ id: number; company_id: number }>(
    "SELECT id, company_id FROM technicians WHERE name = 'Tobias Wren'",
    [],
    transaction,
  );
  const daysAgo = (n: number) => new Date(today.getTime() - n * DAY);
  await db().query(
    `UPDATE equipment SET year_built = 2017, in_service_on = $2, building = 'Building C', bay = 'Bay 7',
            notes = 'Through-spindle coolant; 40-taper. Chip conveyor replaced at installation.'
      WHERE id = $1`,
    {
      bind: [
        machine.id,
        daysAgo(6 * 365)
          .toISOString()
          .slice(0, 10),
      ],
      transaction,
    },
  );

  await db().query(
    `INSERT INTO machine_shop_records (equipment_id, shop_company_id, performed_on, work_kind, problem_area,
       service_company_name, technician_name, hours_on_site, travel_hours, note, parts_used, recorded_by, created_at)
     VALUES ($1, $2, $3, 'repair', 'spindle', 'Quillfield Spindle Service', 'Ansel Morrow', 5.5, 2, $4, $5::jsonb, $6, $7)`,
    {
      bind: [
        machine.id,
        machine.shop_id,
        daysAgo(100).toISOString().slice(0, 10),
        "Spindle ran hot above 8,000 rpm. Flushed and regreased the front bearings; vibration back within limits.",
        JSON.stringify([
          { description: "Spindle bearing grease cartridge", partNumber: "SG-12", quantity: 2 },
        ]),
        machine.buyer,
        daysAgo(99),
      ],
      transaction,
    },
  );

  const accepted = daysAgo(41);
  const completed = daysAgo(40);
  const warningDays = Math.max(...DEFAULT_WARNING_DAYS);
  // One transaction is one connection, which runs one statement at a time: read in turn.
  const atAccept = await standingSnapshotNow(tech.id, null, accepted, warningDays, transaction);
  const atCompletion = await standingSnapshotNow(tech.id, null, completed, warningDays, transaction);
  await db().query(
    `INSERT INTO work_orders (shop_company_id, site_id, equipment_id, technician_id, service_company_id, technology,
       problem, urgency, preferred_dates, status, hours_worked, travel_hours, completion_note, snapshot_accepted,
       snapshot_completed, work_kind, problem_area, parts_used, created_by, accepted_at, completed_at, confirmed_at,
       created_at, updated_at)
     VALUES ($1, $2, $3, $4, $5, 'mill', $6, 'high', '[]'::jsonb, 'confirmed', 3.5, 1.5, $7, $8::jsonb, $9::jsonb,
       'repair', 'spindle', $10::jsonb, $11, $12, $13, $14, $15, $14)`,
    {
      bind: [
        machine.shop_id,
        machine.site_id,
        machine.id,
        tech.id,
        tech.company_id,
        "Spindle running hot again and a knocking sound at high speed; alarm 4102 after twenty minutes.",
        "Front spindle bearings worn through. Replaced the bearing pair, set preload, ran in for an hour; temperature steady.",
        JSON.stringify(atAccept),
        JSON.stringify(atCompletion),
        JSON.stringify([
          { description: "Angular contact bearing pair", partNumber: "AC-7014-P4", quantity: 1 },
          { description: "Spindle seal kit", partNumber: null, quantity: 1 },
        ]),
        machine.buyer,
        accepted,
        completed,
        daysAgo(39),
        daysAgo(42),
      ],
      transaction,
    },
  );
}
