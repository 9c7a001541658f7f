import { randomUUID } from "node:crypto";
import pg from "pg";

/** A new, empty database in the suite's cluster, for a test that must not see (or touch) other tests' rows. */
export async function createTestDatabase(prefix: string): Promise<{ name: string; url: string }> {
  const name = `${prefix}_${randomUUID().slice(0, 8)}`;
  const admin = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await admin.connect();
  try {
    await admin.query(`CREATE DATABASE ${name}`);
  } finally {
    await admin.end();
  }
  const url = new URL(process.env.DATABASE_URL!);
  url.pathname = `/${name}`;
  return { name, url: url.toString() };
}
