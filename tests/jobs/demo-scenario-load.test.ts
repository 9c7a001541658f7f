import { createHash, randomUUID } from "node:crypto";
import { mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import pg from "pg";
import { QueryTypes, type Sequelize } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { setPasswordCost } from "../../server/accounts/passwords.ts";
import { initModels } from "../../server/db/associations.ts";
import { buildDemoWorld, loadDemoScenarioOnce } from "../../server/db/demo-scenario/index.ts";
import { migrate } from "../../server/db/migrate.ts";
import { connectDatabase } from "../../server/db/sequelize.ts";
import { listMachineHistory } from "../../server/machines/service-history.ts";
import { readMachineDowntime } from "../../server/machines/downtime.ts";
import { planDue, reminderThresholdFor } from "../../shared/machines/maintenance-due.ts";

// The demo loads into an empty database only, so it gets a throw-away database of its own in the suite's cluster.
const databaseName = `demo_check_${randomUUID().slice(0, 8)}`;
const adminUrl = process.env.DATABASE_URL!;
const today = new Date("2026-12-02T15:00:00Z");
const world = buildDemoWorld(today);
let sequelize: Sequelize;
let uploadsDir: string;
let loaded: boolean;
let elapsedMs: number;

async function admin(sql: string) {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

const rows = <T extends object>(sql: string) => sequelize.query<T>(sql, { type: QueryTypes.SELECT });
const count = async (table: string) =>
  (await rows<{ n: number }>(`SELECT count(*)::int AS n FROM ${table}`))[0]!.n;

beforeAll(async () => {
  await admin(`CREATE DATABASE ${databaseName}`);
  const url = new URL(adminUrl);
  url.pathname = `/${databaseName}`;
  sequelize = connectDatabase(url.toString());
  await migrate(sequelize);
  initModels(sequelize);
  setPasswordCost(4);
  uploadsDir = mkdtempSync(path.join(tmpdir(), "clearbench-demo-uploads-"));
  const started = performance.now();
  loaded = await loadDemoScenarioOnce({ uploadsDir, today });
  elapsedMs = performance.now() - started;
});

afterAll(async () => {
  await sequelize?.close();
  await admin(`DROP DATABASE IF EXISTS ${databaseName}`);
  if (uploadsDir) rmSync(uploadsDir, { recursive: true, force: true });
});

describe("loading the demo scenario", () => {
  it("loads into an empty database", () => {
    expect(loaded).toBe(true);
    process.stdout.write(`demo scenario loaded in ${elapsedMs.toFixed(0)} ms\n`);
  });

  it("writes every company, user, technician, document and credential of the world", async () => {
    const users = world.companies.reduce((sum, c) => sum + c.users.length, 0);

    const counts = await Promise.all(
      ["companies", "users", "technicians", "documents", "credentials"].map(count),
    );

    expect(counts).toEqual([
      world.companies.length,
      users,
      world.technicians.length,
      world.credentials.length,
      world.credentials.length,
    ]);
  });

  it("stores credentials in the states the world gives them", async () => {
    const expected: Record<string, number> = {};
    for (const c of world.credentials) expected[c.state] = (expected[c.state] ?? 0) + 1;

    const stored = await rows<{ state: string; n: number }>(
      "SELECT state, count(*)::int AS n FROM credentials GROUP BY state",
    );

    expect(Object.fromEntries(stored.map((r) => [r.state, r.n]))).toEqual(expected);
  });

  it("stores each document's file under its hash, with nothing left in the incoming folder", async () => {
    const documents = await rows<{ sha256: string; size_bytes: number }>(
      "SELECT sha256, size_bytes FROM documents",
    );

    for (const d of documents) {
      const bytes = readFileSync(path.join(uploadsDir, "store", d.sha256.slice(0, 2), d.sha256));
      expect(createHash("sha256").update(bytes).digest("hex")).toBe(d.sha256);
      expect(bytes.byteLength).toBe(d.size_bytes);
      expect(bytes.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    }
    expect(readdirSync(path.join(uploadsDir, "incoming"))).toEqual([]);
  });

  it("links each technician user to a technician of the same company", async () => {
    const links = await rows<{ email: string; same_company: boolean | null }>(
      `SELECT u.email, t.company_id = u.company_id AS same_company
         FROM users u LEFT JOIN technicians t ON t.id = u.technician_id WHERE u.role = 'technician'`,
    );

    expect(links.length).toBeGreaterThan(0);
    expect(links.filter((l) => l.same_company !== true)).toEqual([]);
  });

  it("records who submitted and who decided each credential in the audit trail", async () => {
    const decided = world.credentials.filter((c) => c.state !== "submitted").length;

    const actions = await rows<{ action: string; n: number }>(
      "SELECT action, count(*)::int AS n FROM audit_events WHERE subject_type = 'credential' GROUP BY action",
    );
    const byAction = Object.fromEntries(actions.map((a) => [a.action, a.n]));

    expect(byAction["credential.submitted"]).toBe(world.credentials.length);
    expect((byAction["credential.verified"] ?? 0) + (byAction["credential.returned"] ?? 0)).toBe(decided);
  });

  it("computes baseline standings: Kestrel cleared, Bluewater lapsing, Copperline not cleared", async () => {
    const standings = await rows<{ company: string; standing: string }>(
      `SELECT DISTINCT c.name AS company, s.standing
         FROM technician_standings s JOIN technicians t ON t.id = s.technician_id JOIN companies c ON c.id = t.company_id
        WHERE s.requirement_set_id IS NULL ORDER BY 1`,
    );

    expect(standings).toEqual([
      { company: "Bluewater Spindle Works Inc.", standing: "lapsing" },
      { company: "Copperline Field Technicians Co.", standing: "not_cleared" },
      { company: "Kestrel Ridge Machine Service LLC", standing: "cleared" },
    ]);
  });

  it("gives the demo shop's mill a history: a work order on the platform and a shop record, the repeat flagged", async () => {
    const [machine] = await rows<{ id: number; company_id: number }>(
      "SELECT e.id, s.company_id FROM equipment e JOIN sites s ON s.id = e.site_id WHERE e.serial_number = 'VM40-2209'",
    );

    const history = await listMachineHistory(machine!.id, machine!.company_id);

    expect(history.entries.map((e) => e.source)).toEqual(["platform", "shop_record"]);
    expect(history.entries[0]!.repeatOf).toBe(history.entries[1]!.key);
    expect(history.entries[0]!.standingSnapshot).not.toBeNull();
  });

  it("charts the mill's stoppages of the year, the last ended by the confirmed work order", async () => {
    const [machine] = await rows<{ id: number }>(
      "SELECT id FROM equipment WHERE serial_number = 'VM40-2209'",
    );

    const downtime = await readMachineDowntime(machine!.id, today);

    expect(downtime.periods).toBe(3);
    expect(downtime.downSince).toBeNull();
    expect(downtime.months.filter((m) => m.hours > 0)).toHaveLength(3);
    expect(downtime.recent[0]).toMatchObject({ openedBy: "work_order", closedBy: "confirmation" });
    expect(downtime.companies).toEqual([
      expect.objectContaining({ companyName: "Kestrel Ridge Machine Service LLC", workOrders: 1 }),
    ]);
  });

  it("has a maintenance plan coming due that the next daily run reminds the shop of", async () => {
    const plans = await rows<{ name: string; last_done_on: string; interval_months: number }>(
      "SELECT name, last_done_on::text, interval_months FROM maintenance_plans WHERE interval_kind = 'months'",
    );

    const owed = plans.filter(
      (p) =>
        reminderThresholdFor(
          planDue(
            {
              interval: { kind: "months", months: p.interval_months },
              lastDoneOn: p.last_done_on,
              lastDoneHours: null,
            },
            [],
            "2026-12-02",
          ).daysUntil,
        ) === 30,
    );

    expect(owed.map((p) => p.name)).toEqual(["Annual inspection"]);
  });

  it("does nothing when data is already there", async () => {
    const before = await count("credentials");

    const again = await loadDemoScenarioOnce({ uploadsDir, today });

    expect(again).toBe(false);
    expect(await count("credentials")).toBe(before);
  });
});
