import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { randomUUID } from "node:crypto";
import type { ChildProcess } from "node:child_process";
import pg from "pg";
import request from "supertest";
import { startServerProcess, stopProcess } from "../support/server-process.ts";
import { startTestMailCatcher } from "../support/mail-catcher.ts";
import { submitLiabilityCertificate } from "../support/submit-credential.ts";
import { hashPassword, setPasswordCost } from "../../server/accounts/passwords.ts";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../shared/api/error-body.ts";
import { createTestDatabase } from "../support/test-database.ts";

let databaseUrl: string;
let mail: Awaited<ReturnType<typeof startTestMailCatcher>>;
const children: ChildProcess[] = [];
beforeAll(async () => {
  databaseUrl = (await createTestDatabase("instances")).url;
  mail = await startTestMailCatcher();
});
afterAll(async () => {
  for (const child of children) await stopProcess(child);
  await mail.close();
});

const agentOn = (base: string, cookie?: string) => {
  const agent = request.agent(base);
  agent.set(CSRF_HEADER, CSRF_HEADER_VALUE);
  if (cookie) agent.set("Cookie", cookie);
  return agent;
};

describe("two server instances on one database", () => {
  it("share sessions, and the scheduled lapse job fires in both but each tick runs once and mails once", async () => {
    const uploadsDir = mkdtempSync(path.join(tmpdir(), "clearbench-instances-"));
    const env = {
      DATABASE_URL: databaseUrl,
      UPLOADS_DIR: uploadsDir,
      PORT: "0",
      NODE_ENV: "test",
      BCRYPT_COST: "4",
      SMTP_URL: mail.url,
      RUN_SCHEDULE: "false",
    };
    const a = await startServerProcess(env);
    children.push(a.child);

    // A service company whose verified liability policy expires tomorrow (12:01 a.m. standard time, Chicago).
    const signUp = await agentOn(a.url)
      .post("/api/auth/sign-up")
      .send({
        kind: "service",
        companyName: "Thornbury Spindle Care LLC",
        addressLine: "4 Arbor Mill Road",
        postalCode: "60601",
        name: "Adaeze Holloway",
        email: `office-${randomUUID().slice(0, 6)}@example.test`,
        password: "instance password 1",
      });
    const cookie = ([] as string[])
      .concat(signUp.headers["set-cookie"] ?? [])
      .map((c) => c.split(";")[0])
      .join("; ");
    const tomorrow = new Date(Date.now() + 36 * 3_600_000).toISOString().slice(0, 10);
    const credential = await submitLiabilityCertificate(agentOn(a.url, cookie), 95, {
      effectiveDate: "2026-01-01",
      expirationDate: tomorrow,
    });
    setPasswordCost(4);
    const db = new pg.Client({ connectionString: databaseUrl });
    await db.connect();
    const platform = await db.query<{ id: number }>(
      "INSERT INTO companies (name, kind, time_zone) VALUES ('Instances Platform', 'platform', 'America/Chicago') RETURNING id",
    );
    await db.query(
      "INSERT INTO users (company_id, email, name, role, password_hash) VALUES ($1, 'reviewer@instances.test', 'Bram Oyelaran', 'reviewer', $2)",
      [platform.rows[0]!.id, await hashPassword("instance password 2")],
    );
    const reviewer = agentOn(a.url);
    await reviewer
      .post("/api/auth/sign-in")
      .send({ email: "reviewer@instances.test", password: "instance password 2" })
      .expect(200);
    await reviewer.post(`/api/credentials/${credential.id}/verify`).send({}).expect(200);
    await stopProcess(a.child);
    mail.messages.length = 0;

    // Both instances fire the job every 3 seconds.
    const scheduled = { ...env, RUN_SCHEDULE: "true", JOB_CRON: "*/3 * * * * *" };
    const [one, two] = await Promise.all([startServerProcess(scheduled), startServerProcess(scheduled)]);
    children.push(one.child, two.child);
    const sessionOnOther = await agentOn(two.url, cookie).get("/api/auth/me");
    await new Promise((r) => setTimeout(r, 7_500));
    // Stopped before counting, so no tick can start between the count and the logs it is compared with.
    await stopProcess(one.child);
    await stopProcess(two.child);
    const ticks = await db.query<{ n: number }>(
      "SELECT count(*)::int AS n FROM job_ticks WHERE job = 'lapse'",
    );
    const runs = await db.query<{ n: number }>("SELECT count(*)::int AS n FROM job_runs WHERE job = 'lapse'");
    const notices = await db.query<{ n: number }>("SELECT count(*)::int AS n FROM notices");
    await db.end();

    expect(sessionOnOther.status).toBe(200);
    expect(ticks.rows[0]!.n).toBeGreaterThanOrEqual(2);
    expect(runs.rows[0]!.n).toBe(ticks.rows[0]!.n);
    const finished = (out: string) => (out.match(/"job":"lapse".*scheduled job finished/g) ?? []).length;
    const deferred = (out: string) =>
      (out.match(/"job":"lapse".*already run by another instance/g) ?? []).length;
    // Both timers fired every tick: one instance ran it, the other stood aside.
    expect(finished(one.output()) + finished(two.output())).toBe(ticks.rows[0]!.n);
    expect(deferred(one.output()) + deferred(two.output())).toBeGreaterThanOrEqual(ticks.rows[0]!.n - 1);
    expect(notices.rows[0]!.n).toBeGreaterThanOrEqual(1);
    const warnings = mail.messages.filter((m) => /liability/i.test(m.subject));
    expect(warnings).toHaveLength(notices.rows[0]!.n);
  }, 90_000);
});
