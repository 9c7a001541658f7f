import { QueryTypes, type Transaction } from "sequelize";
import type { OwnershipPeriod } from "../../shared/machines/ownership-periods.ts";
import type { OwnershipView } from "../../shared/machines/transfers.ts";
import { db } from "../db/sequelize.ts";

/** The shop whose site the machine stands at now, or null when there is no such machine. */
export async function currentOwnerOf(machineId: number, transaction?: Transaction): Promise<number | null> {
  const [row] = await db().query<{ companyId: number }>(
    `SELECT s.company_id AS "companyId" FROM equipment e JOIN sites s ON s.id = e.site_id WHERE e.id = $1`,
    { bind: [machineId], type: QueryTypes.SELECT, transaction },
  );
  return row?.companyId ?? null;
}

/** The machine stands at a site of this shop; anyone else's machine answers like a missing one. */
export async function isMachineOfShop(companyId: number, machineId: unknown): Promise<boolean> {
  const id = Number(machineId);
  if (!Number.isInteger(id) || id <= 0) return false;
  return (await currentOwnerOf(id)) === companyId;
}

/** Every shop that held the machine and when, oldest first: what history entries are filtered by. */
export async function ownershipPeriods(
  machineId: number,
  transaction?: Transaction,
): Promise<OwnershipPeriod[]> {
  const rows = await db().query<{ companyId: number; fromAt: Date; toAt: Date | null }>(
    `SELECT company_id AS "companyId", from_at AS "fromAt", to_at AS "toAt"
       FROM machine_ownerships WHERE equipment_id = $1 ORDER BY from_at, id`,
    { bind: [machineId], type: QueryTypes.SELECT, transaction },
  );
  return rows.map((r) => ({
    companyId: r.companyId,
    from: new Date(r.fromAt).toISOString(),
    to: r.toAt ? new Date(r.toAt).toISOString() : null,
  }));
}

/** The shop owns the machine now or owned it once (a seller keeps a read-only view of its own period). */
export async function hasOwnedMachine(companyId: number, machineId: unknown): Promise<boolean> {
  const id = Number(machineId);
  if (!Number.isInteger(id) || id <= 0) return false;
  const [row] = await db().query<{ n: number }>(
    "SELECT 1 AS n FROM machine_ownerships WHERE equipment_id = $1 AND company_id = $2 LIMIT 1",
    { bind: [id, companyId], type: QueryTypes.SELECT },
  );
  return row !== undefined;
}

/** Ends the open period at `at` and opens the receiver's in the same transaction as the move. */
export async function handOver(machineId: number, toCompanyId: number, at: Date, transaction: Transaction) {
  await db().query("UPDATE machine_ownerships SET to_at = $2 WHERE equipment_id = $1 AND to_at IS NULL", {
    bind: [machineId, at],
    transaction,
  });
  await db().query("INSERT INTO machine_ownerships (equipment_id, company_id, from_at) VALUES ($1, $2, $3)", {
    bind: [machineId, toCompanyId, at],
    transaction,
  });
}

/**
 * The periods a shop may see: the current owner sees every period's dates (its carried history is dated by them), a
 * former owner only its own, so it learns nothing of where the machine went after it.
 */
export async function ownershipView(companyId: number, machineId: number): Promise<OwnershipView> {
  const periods = await ownershipPeriods(machineId);
  const current = periods.some((p) => p.companyId === companyId && p.to === null);
  return {
    current,
    periods: periods
      .filter((p) => current || p.companyId === companyId)
      .map((p) => ({ from: p.from, to: p.to, yours: p.companyId === companyId })),
  };
}
