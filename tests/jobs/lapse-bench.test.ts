import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes, Sequelize } from "sequelize";
import { buildTestApp, type TestApp } from "../support/test-app.ts";
import { migrate } from "../../server/db/migrate.ts";
import { runLapseJob } from "../../jobs/lapse.ts";
import { checkStandingConsistency } from "../../server/standing/index.ts";
import { JOB_DEPS } from "./job-support.ts";

// Timing of the daily job over 200,000 generated credentials, in a database of its own. Slow (about a minute), so
// it runs only with BENCH_LAPSE=1 and prints its figures.
const BENCH = process.env.BENCH_LAPSE === "1";
const COMPANIES = 2_000;
const TECHNICIANS_PER_COMPANY = 10;
const CREDENTIALS = 200_000;
const AS_OF = new Date("2027-06-01T11:00:00Z");

let t: TestApp;
let admin: Sequelize;
let bench: Sequelize;
const dbName = `clearbench_bench_${process.pid}`;

beforeAll(async () => {
  if (!BENCH) return;
  t = buildTestApp();
  const url = new URL(t.config.DATABASE_URL!);
  admin = new Sequelize(url.toString(), { dialect: "postgres", logging: false });
  await admin.query(`CREATE DATABASE ${dbName}`);
  url.pathname = `/${dbName}`;
  bench = new Sequelize(url.toString(), { dialect: "postgres", logging: false, pool: { max: 4 } });
  await migrate(bench);
  await generate(bench);
}, 600_000);

afterAll(async () => {
  if (!BENCH) return;
  await bench.close();
  await admin.query(`DROP DATABASE ${dbName}`);
  await admin.close();
  await t.close();
});

/** Companies, users, technicians, documents and credentials, each with one INSERT ... SELECT generate_series. */
async function generate(s: Sequelize) {
  const zones =
    "ARRAY['America/Chicago','America/New_York','America/Denver','America/Los_Angeles','America/Phoenix']";
  await s.query(`
    INSERT INTO companies (name, kind, address_line, postal_code, time_zone)
    SELECT 'Bench Service ' || g, 'service', g || ' Bench Road', '60601', (${zones})[1 + g % 5] FROM generate_series(1, ${COMPANIES}) g;
    INSERT INTO users (company_id, email, name, role, password_hash)
    SELECT id, 'office-' || id || '@bench.test', 'Office ' || id, 'provider_admin', NULL FROM companies;
    INSERT INTO technicians (company_id, name, postal_code, service_radius_km, hourly_rate_cents, travel_rate_cents)
    SELECT c.id, 'Bench Tech ' || c.id || '-' || g, '60601', 150, 14000, 10000
      FROM companies c CROSS JOIN generate_series(1, ${TECHNICIANS_PER_COMPANY}) g;
    INSERT INTO users (company_id, email, name, role, technician_id)
    SELECT company_id, 'tech-' || id || '@bench.test', name, 'technician', id FROM technicians WHERE id % 5 = 0;
    INSERT INTO documents (company_id, uploaded_by, sha256, size_bytes, mime, original_name, extraction_method)
    SELECT u.company_id, u.id, md5(u.id::text) || md5(u.email), 1000, 'application/pdf', 'bench.pdf', 'none'
      FROM users u WHERE u.role = 'provider_admin';
  `);
  // Lapse instants spread evenly from a year before to a year after the run; 90 % verified, the rest submitted or superseded.
  await s.query(
    `WITH gen AS (
       SELECT g, (${COMPANIES} > 0) AS ok, $1::timestamptz - interval '365 days' + (g % 730) * interval '1 day' + (g % 24) * interval '1 hour' AS lapses_at
         FROM generate_series(1, ${CREDENTIALS}) g
     ), placed AS (
       SELECT gen.*, t.id AS technician_id, t.company_id,
              (ARRAY['arc_flash','lockout_tagout','first_aid_cpr','powered_truck'])[1 + g % 4] AS card
         FROM gen JOIN technicians t ON t.id = 1 + g % ${COMPANIES * TECHNICIANS_PER_COMPANY}
     )
     INSERT INTO credentials (type_code, company_id, technician_id, document_id, state, fields, submitted_by, lapses_at)
     SELECT CASE WHEN g % 50 = 0 THEN 'general_liability' WHEN g % 50 = 1 THEN 'workers_comp' ELSE card END,
            p.company_id,
            CASE WHEN g % 50 IN (0, 1) THEN NULL ELSE p.technician_id END,
            d.id,
            CASE WHEN g % 20 = 7 THEN 'submitted' WHEN g % 20 = 13 THEN 'superseded' ELSE 'verified' END,
            CASE WHEN g % 50 IN (0, 1) THEN jsonb_build_object(
                   'insurerName', 'Bench Mutual', 'policyNumber', 'P-' || g,
                   'effectiveDate', to_char(p.lapses_at - interval '1 year', 'YYYY-MM-DD'),
                   'expirationDate', to_char(p.lapses_at, 'YYYY-MM-DD'),
                   'limits', jsonb_build_object('eachOccurrence', 1000000, 'generalAggregate', 2000000))
                 ELSE jsonb_build_object('holderName', 'Bench Tech', 'issueDate', to_char(p.lapses_at - interval '36 months', 'YYYY-MM-DD'),
                   'expiryDate', to_char(p.lapses_at - interval '1 day', 'YYYY-MM-DD')) END,
            d.uploaded_by, p.lapses_at
       FROM placed p JOIN documents d ON d.company_id = p.company_id`,
    { bind: [AS_OF] },
  );
  await s.query("ANALYZE");
}

async function count(s: Sequelize, sql: string): Promise<number> {
  const [row] = await s.query<{ n: number }>(sql, { type: QueryTypes.SELECT });
  return Number(row?.n ?? 0);
}

describe.runIf(BENCH)("lapse job over 200,000 credentials", () => {
  it("runs set-based: catch-up run, next day's run, and the consistency check", async () => {
    const credentials = await count(bench, "SELECT count(*) AS n FROM credentials");

    const firstStart = performance.now();
    const first = await runLapseJob({ asOf: AS_OF }, { ...JOB_DEPS, sequelize: bench });
    const firstMs = performance.now() - firstStart;
    const secondStart = performance.now();
    const second = await runLapseJob(
      { asOf: new Date(AS_OF.getTime() + 86_400_000) },
      { ...JOB_DEPS, sequelize: bench },
    );
    const secondMs = performance.now() - secondStart;
    const checkStart = performance.now();
    const check = await bench.transaction((tx) => checkStandingConsistency(tx));
    const checkMs = performance.now() - checkStart;

    expect(credentials).toBe(CREDENTIALS);
    expect(first.skipped || second.skipped).toBe(false);
    if (first.skipped || second.skipped) return;
    process.stdout.write(
      [
        `bench: ${credentials} credentials, ${COMPANIES * TECHNICIANS_PER_COMPANY} technicians`,
        `  first run (catch-up): ${firstMs.toFixed(0)} ms, ${first.lapsed} lapsed, ${first.noticesCreated} notices, ${first.emailsQueued} e-mails, ${first.changedStandings.length} standings changed, ${first.statements} statements`,
        `    steps (ms): ${JSON.stringify(first.timings)}`,
        `  next day's run:       ${secondMs.toFixed(0)} ms, ${second.lapsed} lapsed, ${second.noticesCreated} notices, ${second.emailsQueued} e-mails, ${second.changedStandings.length} standings changed, ${second.statements} statements`,
        `    steps (ms): ${JSON.stringify(second.timings)}`,
        `  consistency check:    ${checkMs.toFixed(0)} ms over ${check.checked} stored standings, ${check.differences.length} differences`,
        "",
      ].join("\n"),
    );
    expect(first.lapsed).toBeGreaterThan(50_000);
    expect(check.differences).toEqual([]);
  }, 600_000);
});
