import { writeFile } from "node:fs/promises";
import pg from "pg";
import { Sequelize } from "sequelize";
import { runLapseJob } from "../lapse.ts";
import { withDatabase } from "./bench-cluster.ts";
import { DEFAULT_WARNING_DAYS } from "../../shared/standing/warning-windows.ts";
import { measureLapseFloor, type LapseFloorResult } from "./lapse-floor.ts";

export interface LapseBenchResult {
  asOf: string;
  lapsed: number;
  noticesCreated: number;
  emailsQueued: number;
  changedStandings: number;
  statements: number;
  jobMs: number;
  jobSteps: Record<string, number>;
  floorMs: number;
  floorRows: number;
  /** The floor's steps (ms) and rows written per step; floorRows is the lapsed count, as before. */
  floor: LapseFloorResult;
  ratio: number;
}

const WARNING_DAYS = [...DEFAULT_WARNING_DAYS];

async function copyDatabase(clusterUrl: string, template: string, name: string): Promise<string> {
  const admin = new pg.Client({ connectionString: withDatabase(clusterUrl, "postgres") });
  await admin.connect();
  try {
    await admin.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
    await admin.query(`CREATE DATABASE "${name}" TEMPLATE "${template}"`);
  } finally {
    await admin.end();
  }
  return withDatabase(clusterUrl, name);
}

async function dropDatabase(clusterUrl: string, name: string): Promise<void> {
  const admin = new pg.Client({ connectionString: withDatabase(clusterUrl, "postgres") });
  await admin.connect();
  await admin.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`).finally(() => admin.end());
}

/**
 * The daily job over the 300,000 credentials against its floor, each on a fresh copy of the large database (CREATE
 * DATABASE ... TEMPLATE) so both see the same rows; then its statements replayed under EXPLAIN (ANALYZE, BUFFERS) on a
 * third copy, in order, in one transaction that is rolled back.
 */
export async function benchLapseJob(
  clusterUrl: string,
  template: string,
  asOf: Date,
  explainPath: string,
  say: (l: string) => void,
): Promise<LapseBenchResult> {
  const [jobUrl, floorUrl, explainUrl] = await Promise.all(
    ["bench_lapse_job", "bench_lapse_floor", "bench_lapse_explain"].map((n) =>
      copyDatabase(clusterUrl, template, n),
    ),
  );
  const sequelize = new Sequelize(jobUrl!, {
    dialect: "postgres",
    logging: false,
    define: { underscored: true },
  });
  const original = sequelize.query.bind(sequelize);
  const statements: { sql: string; bind: unknown[] }[] = [];
  (sequelize as unknown as { query: unknown }).query = (sql: string, options?: { bind?: unknown[] }) => {
    statements.push({ sql, bind: options?.bind ?? [] });
    return (original as (s: string, o?: unknown) => Promise<unknown>)(sql, options);
  };
  try {
    await sequelize.authenticate();
    statements.length = 0;
    const t0 = performance.now();
    const report = await runLapseJob(
      { asOf },
      { sequelize, warningDays: WARNING_DAYS, publicUrl: "http://127.0.0.1" },
    );
    const jobMs = performance.now() - t0;
    if (report.skipped) throw new Error("the lapse job skipped: another run holds the lock");
    say(
      `  lapse job: ${report.lapsed} lapsed, ${report.noticesCreated} notices, ${report.emailsQueued} e-mails, ${report.changedStandings.length} standings changed in ${Math.round(jobMs)} ms`,
    );

    const floorClient = new pg.Client({ connectionString: floorUrl });
    await floorClient.connect();
    const floor = await measureLapseFloor(floorClient, {
      asOf,
      warningDays: WARNING_DAYS,
      publicUrl: "http://127.0.0.1",
      changed: report.changedStandings,
    }).finally(() => floorClient.end());
    const floorMs = floor.ms;
    say(
      `  floor (${floor.statements} statements: lapse, warn, queue, standings): ${floorMs} ms (steps ms: ${JSON.stringify(floor.steps)}; rows: ${JSON.stringify(floor.rows)})`,
    );

    await explainReplay(explainUrl!, statements, explainPath);
    return {
      asOf: asOf.toISOString(),
      lapsed: report.lapsed,
      noticesCreated: report.noticesCreated,
      emailsQueued: report.emailsQueued,
      changedStandings: report.changedStandings.length,
      statements: report.statements,
      jobMs: Math.round(jobMs),
      jobSteps: report.timings,
      floorMs: Math.round(floorMs),
      floorRows: floor.rows.lapsed ?? 0,
      floor,
      ratio: Math.round((jobMs / floorMs) * 10) / 10,
    };
  } finally {
    await sequelize.close();
    for (const n of ["bench_lapse_job", "bench_lapse_floor", "bench_lapse_explain"])
      await dropDatabase(clusterUrl, n);
  }
}

async function explainReplay(
  url: string,
  statements: { sql: string; bind: unknown[] }[],
  file: string,
): Promise<void> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  const parts: string[] = [];
  try {
    await client.query("BEGIN");
    for (const s of statements) {
      const short = s.sql.length > 2_000 ? `${s.sql.slice(0, 2_000)} ...` : s.sql;
      const bindText = JSON.stringify(s.bind).slice(0, 300);
      if (!/^\s*(SELECT|INSERT|UPDATE|DELETE|WITH)\b/i.test(s.sql)) continue;
      if (/pg_try_advisory_xact_lock/.test(s.sql)) {
        await client.query(s.sql, s.bind);
        continue;
      }
      const { rows } = await client.query<{ "QUERY PLAN": string }>(
        `EXPLAIN (ANALYZE, BUFFERS) ${s.sql}`,
        s.bind,
      );
      parts.push(
        `### statement\n${short}\n-- bind: ${bindText}\n\n${rows.map((r) => r["QUERY PLAN"]).join("\n")}\n`,
      );
    }
  } finally {
    await client.query("ROLLBACK").catch(() => undefined);
    await client.end();
  }
  await writeFile(file, parts.join("\n"));
}
