import { QueryTypes, type Sequelize, type Transaction } from "sequelize";

// Statements issued inside a transaction, for the job's report (a set-based job issues a fixed handful, whatever the data size).
const statementCounts = new WeakMap<Transaction, { count: number }>();

export function countStatements(transaction: Transaction): { count: number } {
  const counter = { count: 0 };
  statementCounts.set(transaction, counter);
  return counter;
}

/** The connection that owns the transaction (a job may run on its own pool, not the app's). */
function connectionOf(transaction: Transaction): Sequelize {
  return (transaction as unknown as { sequelize: Sequelize }).sequelize;
}

/** One parameterised SELECT (or statement with RETURNING) inside the caller's transaction. */
export async function selectRows<T extends object>(
  transaction: Transaction,
  sql: string,
  bind: unknown[] = [],
): Promise<T[]> {
  const counter = statementCounts.get(transaction);
  if (counter) counter.count += 1;
  return connectionOf(transaction).query<T>(sql, { bind, transaction, type: QueryTypes.SELECT });
}

/** One parameterised statement without a result set. */
export async function runStatement(
  transaction: Transaction,
  sql: string,
  bind: unknown[] = [],
): Promise<void> {
  const counter = statementCounts.get(transaction);
  if (counter) counter.count += 1;
  await connectionOf(transaction).query(sql, { bind, transaction });
}
