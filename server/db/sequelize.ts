import { Sequelize } from "sequelize";
import pg from "pg";

// Dates leave PostgreSQL as ISO text for DATE columns (a calendar date must never shift by zone).
pg.types.setTypeParser(pg.types.builtins.DATE, (v: string) => v);
// BIGINT counts fit in a JS number here (row counts, dollars).
pg.types.setTypeParser(pg.types.builtins.INT8, (v: string) => Number(v));

let instance: Sequelize | undefined;

export function connectDatabase(url: string, options: { poolMax?: number } = {}): Sequelize {
  instance = new Sequelize(url, {
    dialect: "postgres",
    logging: false,
    define: { underscored: true },
    pool: { max: options.poolMax ?? 10, acquire: 5_000, idle: 10_000 },
    dialectOptions: { connectionTimeoutMillis: 3_000 },
  });
  return instance;
}

export function db(): Sequelize {
  if (!instance) throw new Error("Database not connected: call connectDatabase first");
  return instance;
}
