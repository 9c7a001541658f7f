import { AsyncLocalStorage } from "node:async_hooks";
import { Sequelize } from "sequelize";
import pg from "pg";

// Dates leave PostgreSQL as ISO text for DATE columns (a calendar date must never shift by zone).
pg.types.setTypeParser(pg.types.builtins.DATE, (v: string) => v);
// BIGINT counts fit in a JS number here (row counts, dollars).
pg.types.setTypeParser(pg.types.builtins.INT8, (v: string) => Number(v));

let instance: Sequelize | undefined;

/**
 * Planner settings of every app connection (and of the bench's bare-pg ceiling, so both run alike). No JIT: the app
 * sends short statements whose planned cost can be high (a nearest-first walk is costed as if it read the whole
 * index, though its LIMIT stops it after a page), and compiling one costs more than running it. random_page_cost 1.1:
 * the hot tables sit in memory or on SSD, where a random read costs about what a sequential one does (PostgreSQL
 * manual, "Planner Cost Constants"); at the default 4 the planner sorts a whole radius rather than walking the
 * GiST index nearest first.
 */
export const PLANNER_OPTIONS = "-c jit=off -c random_page_cost=1.1";

/** Set only while a read-only request runs on the replica (server/db/replica.ts); db() then hands that out. */
export const readConnection = new AsyncLocalStorage<Sequelize>();

export function newSequelize(url: string, options: { poolMax?: number } = {}): Sequelize {
  return new Sequelize(url, {
    dialect: "postgres",
    logging: false,
    define: { underscored: true },
    pool: { max: options.poolMax ?? 10, acquire: 5_000, idle: 10_000 },
    dialectOptions: { connectionTimeoutMillis: 3_000, options: PLANNER_OPTIONS },
  });
}

export function connectDatabase(url: string, options: { poolMax?: number } = {}): Sequelize {
  instance = newSequelize(url, options);
  return instance;
}

export function db(): Sequelize {
  const reading = readConnection.getStore();
  if (reading) return reading;
  if (!instance) throw new Error("Database not connected: call connectDatabase first");
  return instance;
}

/** Always the primary, even inside a replica read (health checks, writes that must not be lost). */
export function primaryDb(): Sequelize {
  if (!instance) throw new Error("Database not connected: call connectDatabase first");
  return instance;
}
