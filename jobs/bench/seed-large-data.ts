import { createRequire } from "node:module";
import bcrypt from "bcrypt";
import pg from "pg";
import { Sequelize } from "sequelize";
import { migrate } from "../../server/db/migrate.ts";
import { refreshStandings } from "../../server/standing/index.ts";
import { withDatabase } from "./bench-cluster.ts";
import {
  companiesSql,
  companyCredentialsSql,
  LARGE,
  SEEDED_RANDOM_SQL,
  sitesSql,
  steadyStateNoticesSql,
  techniciansSql,
  technicianCredentialsSql,
  usersSql,
  workOrdersSql,
  ZIPS_TABLE_SQL,
} from "./large-data-sql.ts";
import { DEFAULT_WARNING_DAYS } from "../../shared/standing/warning-windows.ts";

/** Bump when the generated data changes shape, so the bench reloads it. */
export const SEED_VERSION = 1;
export const LARGE_PASSWORD = "clearbench-large";
// The production default cost (server/config.ts BCRYPT_COST), so the sign-in figure is the real one.
const PASSWORD_COST = 12;
const WARNING_DAYS = [...DEFAULT_WARNING_DAYS];

export interface SeedInfo {
  anchor: Date;
  version: number;
}

const require = createRequire(import.meta.url);
const zipcodes = require("zipcodes") as {
  codes: Record<string, { zip: string; latitude: number; longitude: number; state: string }>;
};
const zipZones = require("zipcode-to-timezone") as { lookup(zip: string): string | null | undefined };
// The 48 contiguous states and DC: machine-tool service is a drive-to trade.
const OFF_MAINLAND = new Set(["AK", "HI", "PR", "VI", "GU", "AS", "MP", "FM", "MH", "PW", "AA", "AE", "AP"]);

function mainlandZips() {
  return Object.values(zipcodes.codes)
    .filter((z) => !OFF_MAINLAND.has(z.state) && z.latitude !== 0 && zipZones.lookup(z.zip))
    .sort((a, b) => a.zip.localeCompare(b.zip));
}

/** What the last seed recorded, or null when the database is missing or was seeded by another version. */
export async function readSeedInfo(clusterUrl: string, database: string): Promise<SeedInfo | null> {
  const client = new pg.Client({ connectionString: withDatabase(clusterUrl, database) });
  try {
    await client.connect();
    const { rows } = await client.query<{ anchor: Date; version: number }>(
      "SELECT anchor, version FROM bench_seed_info",
    );
    const row = rows[0];
    return row && row.version === SEED_VERSION ? { anchor: row.anchor, version: row.version } : null;
  } catch {
    return null;
  } finally {
    await client.end().catch(() => undefined);
  }
}

/** Midnight UTC of today: the instant the data set is built around (lapse dates, notices, standings). */
function todayAnchor(): Date {
  const now = new Date();
  return new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate()));
}

/**
 * Drops and rebuilds `database` in the cluster at `clusterUrl` with the large data set: migrations, then one bulk
 * INSERT ... SELECT generate_series per table (a seeded hash for every random choice), the baseline standings through the
 * server's own refresh code, and ANALYZE.
 */
export async function seedLargeDataSet(
  clusterUrl: string,
  database: string,
  say: (line: string) => void,
): Promise<SeedInfo> {
  if (database === "clearbench") throw new Error("refusing to seed the demo database");
  const started = performance.now();
  const step = async (label: string, work: () => Promise<unknown>) => {
    const t0 = performance.now();
    await work();
    say(`  ${label.padEnd(44)} ${((performance.now() - t0) / 1000).toFixed(1).padStart(6)} s`);
  };
  const admin = new pg.Client({ connectionString: withDatabase(clusterUrl, "postgres") });
  await admin.connect();
  await admin.query(`DROP DATABASE IF EXISTS "${database}" WITH (FORCE)`);
  await admin.query(`CREATE DATABASE "${database}"`);
  await admin.end();

  const url = withDatabase(clusterUrl, database);
  const sequelize = new Sequelize(url, {
    dialect: "postgres",
    logging: false,
    define: { underscored: true },
  });
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  const anchor = todayAnchor();
  say(`Seeding ${database} (anchor ${anchor.toISOString().slice(0, 10)})`);
  try {
    await step("migrations", () => migrate(sequelize));
    // Bulk load: no parallel workers (row order stays the same), no wait for the WAL flush.
    await client.query(
      "SET synchronous_commit = off; SET max_parallel_workers_per_gather = 0; SET work_mem = '64MB'",
    );
    await client.query(SEEDED_RANDOM_SQL);
    await client.query(ZIPS_TABLE_SQL);
    const zips = mainlandZips();
    await step(`postal codes (${zips.length} real ZIP centroids)`, () =>
      client.query(
        `INSERT INTO bench_zips SELECT * FROM unnest($1::int[], $2::text[], $3::float8[], $4::float8[], $5::text[])`,
        [
          zips.map((_z, i) => i + 1),
          zips.map((z) => z.zip),
          zips.map((z) => z.latitude),
          zips.map((z) => z.longitude),
          zips.map((z) => zipZones.lookup(z.zip)),
        ],
      ),
    );
    const hash = await bcrypt.hash(LARGE_PASSWORD, PASSWORD_COST);
    await step(`companies (${LARGE.serviceCompanies} service, ${LARGE.shops} shops)`, () =>
      client.query(companiesSql()),
    );
    await step("users (offices, buyers, reviewer, admin)", () =>
      client.query(usersSql().replaceAll("$1", `'${hash}'`)),
    );
    await step(`technicians (${LARGE.technicians}) and documents`, () =>
      client.query(techniciansSql().replaceAll("$1", `'${hash}'`)),
    );
    await step("company credentials (insurance)", () => client.query(companyCredentialsSql(), [anchor]));
    await step("technician credentials (cards)", () => client.query(technicianCredentialsSql(), [anchor]));
    await step(`sites (${LARGE.sites}) and equipment`, () => client.query(sitesSql()));
    await step(`work orders (${LARGE.workOrders}), reviews, ratings`, () =>
      client.query(workOrdersSql().replaceAll("$1", `'${anchor.toISOString()}'::timestamptz`)),
    );
    await step("notices already sent by the anchor", () =>
      client.query(steadyStateNoticesSql(WARNING_DAYS), [anchor, WARNING_DAYS]),
    );
    await step("baseline standings (server refresh code)", () =>
      sequelize.transaction((transaction) => refreshStandings("all", transaction, anchor)),
    );
    // VACUUM too: the visibility map lets count queries (the review queue) read their index alone from the start.
    await step("VACUUM ANALYZE", () => client.query("VACUUM ANALYZE"));
    const { rows } = await client.query<{ n: number }>("SELECT count(*)::int AS n FROM credentials");
    if (rows[0]?.n !== LARGE.credentials)
      throw new Error(`expected ${LARGE.credentials} credentials, made ${rows[0]?.n}`);
    await client.query(
      "CREATE TABLE bench_seed_info (anchor timestamptz NOT NULL, version int NOT NULL, seconds float8 NOT NULL)",
    );
    const seconds = (performance.now() - started) / 1000;
    await client.query("INSERT INTO bench_seed_info VALUES ($1, $2, $3)", [anchor, SEED_VERSION, seconds]);
    say(`Seeded in ${seconds.toFixed(1)} s`);
    return { anchor, version: SEED_VERSION };
  } finally {
    await client.end();
    await sequelize.close();
  }
}
