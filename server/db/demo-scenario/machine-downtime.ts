import { QueryTypes, type Transaction } from "sequelize";
import { db } from "../sequelize.ts";

const HOUR = 3_600_000;
const DAY = 24 * HOUR;

/**
 * The Tamsin shop's Joliet mill stood down three times in the last year: a coolant pump stoppage the shop marked
 * itself seven months ago, the hot spindle it wrote down 100 days ago, and the worn spindle bearings 42 days ago that
 * the confirmed work order brought back. The machine page opens on a chart with something in it and one company's
 * response and repair times.
 */
export async function insertDemoMachineDowntime(today: Date, transaction: Transaction): Promise<void> {
  const [mill] = await db().query<{
    id: number;
    buyer: number;
    work_order_id: number;
    created_at: Date;
    completed_at: Date;
  }>(
    `SELECT e.id, w.created_by AS buyer, w.id AS work_order_id, w.created_at, w.completed_at
       FROM equipment e JOIN work_orders w ON w.equipment_id = e.id AND w.status = 'confirmed'
      WHERE e.serial_number = 'VM40-2209' ORDER BY w.id LIMIT 1`,
    { transaction, type: QueryTypes.SELECT },
  );
  if (!mill) throw new Error("demo machine downtime: the Joliet mill's confirmed work order is missing");
  const ago = (days: number, hours = 0) => new Date(today.getTime() - days * DAY + hours * HOUR);
  const rows: [Date, Date, string, number | null, string, number | null][] = [
    [ago(212), ago(212, 9.5), "hand", null, "hand", null],
    [ago(101), ago(100, 4), "hand", null, "hand", null],
    [
      new Date(mill.created_at),
      new Date(mill.completed_at),
      "work_order",
      mill.work_order_id,
      "confirmation",
      mill.work_order_id,
    ],
  ];
  for (const [startedAt, endedAt, openedBy, workOrderId, closedBy, closedWorkOrderId] of rows)
    await db().query(
      `INSERT INTO machine_downtime (equipment_id, started_at, ended_at, opened_by, opened_by_user_id, work_order_id,
         closed_by, closed_by_user_id, closed_work_order_id)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $5, $8)`,
      {
        bind: [mill.id, startedAt, endedAt, openedBy, mill.buyer, workOrderId, closedBy, closedWorkOrderId],
        transaction,
      },
    );
}
