import { QueryTypes, type Transaction } from "sequelize";
import { db } from "../db/sequelize.ts";

// This domain reads sites, machines, technicians and standings of other domains through plain SQL, so no model is shared.
export const select = <T extends object>(sql: string, bind: unknown[], transaction?: Transaction) =>
  db().query<T>(sql, { bind, transaction, type: QueryTypes.SELECT });

export async function selectOne<T extends object>(
  sql: string,
  bind: unknown[],
  transaction?: Transaction,
): Promise<T | undefined> {
  return (await select<T>(sql, bind, transaction))[0];
}

export async function insertReturningId(
  sql: string,
  bind: unknown[],
  transaction?: Transaction,
): Promise<number> {
  const [row] = await select<{ id: number }>(`${sql} RETURNING id`, bind, transaction);
  return row!.id;
}

export async function run(sql: string, bind: unknown[], transaction?: Transaction): Promise<void> {
  await db().query(sql, { bind, transaction });
}
