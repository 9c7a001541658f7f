import { createHash } from "node:crypto";
import { BaseError, DatabaseError, QueryTypes, type Sequelize, type Transaction } from "sequelize";
import { db } from "./sequelize.ts";

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

/** The pg client under a Sequelize pool connection (Sequelize's own type parsers are set on it). */
interface PooledClient {
  query(config: { name?: string; text: string; values: unknown[] }): Promise<{ rows: unknown[] }>;
  connection: { parsedStatements: Record<string, string> };
  _invalid?: boolean;
}
interface PoolManager {
  getConnection(): Promise<PooledClient>;
  releaseConnection(client: PooledClient): void;
}

/**
 * Statements kept prepared on one connection at most: the directory's text varies with the filters chosen, and every
 * prepared statement holds its plan in the server process, so past this many a new text runs unnamed.
 */
const PREPARED_PER_CONNECTION = 48;
const names = new Map<string, string>();

function statementName(sql: string): string {
  let name = names.get(sql);
  if (name === undefined) {
    name = `cb_${createHash("sha1").update(sql).digest("hex").slice(0, 24)}`;
    if (names.size < 1_000) names.set(sql, name);
  }
  return name;
}

// Sequelize binds strings with NUL bytes escaped (PostgreSQL text cannot hold one); the same here.
const bindValue = (v: unknown) => (typeof v === "string" ? v.replace(/\0/g, "\\0") : v);

/**
 * One parameterised statement outside a transaction (a SELECT, or a write with its rows returned), sent as a named
 * prepared statement on db()'s pool (the replica inside readFromReplica): PostgreSQL parses and plans the hot paths'
 * statements once per connection instead of on every call (planning the technician page's statement took twice its
 * execution), and the rows come straight from pg with the same type parsing as db().query, without Sequelize's
 * per-query work. Errors arrive wrapped as db().query's do.
 */
export async function preparedRows<T extends object>(sql: string, bind: unknown[] = []): Promise<T[]> {
  const manager = db().connectionManager as unknown as PoolManager;
  const client = await manager.getConnection();
  try {
    const prepared = client.connection.parsedStatements;
    const name = statementName(sql);
    const named = name in prepared || Object.keys(prepared).length < PREPARED_PER_CONNECTION;
    const result = await client.query({
      ...(named ? { name } : {}),
      text: sql,
      values: bind.map(bindValue),
    });
    return result.rows as T[];
  } catch (err) {
    if ((err as { code?: string }).code === "ECONNRESET") client._invalid = true;
    throw err instanceof BaseError
      ? err
      : new DatabaseError(err as Error & { sql: string; parameters: object });
  } finally {
    manager.releaseConnection(client);
  }
}
