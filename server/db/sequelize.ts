import { AsyncLocalStorage } from "node:async_hooks";
import { Sequelize } from "sequelize";
import pg from "pg";

// Dates leave PostgreSQL as ISO text for DATE columns (a calendar date must never shift by zone).
pg.types.setTypeParser(pg.types.builtins.DATE, (v: string) => v);
// BIGINT counts fit in a JS number here (row counts, dollars).
pg.types.setTypeParser(pg.types.builtins.INT8, (v: string) => Number(v));

let instance: Sequelize | undefined;

/** Set only while a read-only request runs on the replica (server/db/replica.ts); db() then hands that out. */
export const readConnection = new AsyncLocalStorage<Sequelize>();

export function newSequelize(url: string, options: { poolMax?: number } = {}): Sequelize {
  return new Sequelize(url, {
    dialect: "postgres",
    logging: false,
    define: { underscored: true },
    pool: { max: options.poolMax ?? 10, acquire: 5_000, idle: 10_000 },
    dialectOptions: { connectionTimeoutMillis: 3_000 },
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
