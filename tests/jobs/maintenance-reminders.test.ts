import { describe, expect, it } from "vitest";
import { useTestApp } from "../support/test-app.ts";
import { useMailCatcher } from "../support/mail-catcher.ts";
import { buildClearedCompany, buildShop, type Shop } from "../fixtures/build-service-request-world.ts";
import { buildMachineShop } from "../fixtures/build-machine-shop.ts";
import { runLapseJob } from "../../jobs/lapse.ts";
import { JOB_DEPS, rows, runJobCli } from "./job-support.ts";

const t = useTestApp();
const catcher = useMailCatcher();

async function planOn(shop: Shop, body: Record<string, unknown>) {
  const res = await shop.agent.post(`/api/machines/${shop.equipmentId}/maintenance-plans`).send(body);
  if (res.status !== 201) throw new Error(`add plan failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.id as number;
}

const remindersOf = (planId: number) =>
  rows<{ threshold_days: number; due_key: string }>(
    "SELECT threshold_days, due_key FROM maintenance_reminders WHERE plan_id = $1 ORDER BY id",
    [planId],
  );
const bellOf = (userId: number) =>
  rows<{ title: string; link: string }>(
    "SELECT title, link FROM notifications WHERE user_id = $1 AND kind = 'maintenance.due' ORDER BY id",
    [userId],
  );
const mailTo = (email: string) =>
  rows<{ subject: string; text_body: string; html_body: string | null }>(
    "SELECT subject, text_body, html_body FROM outbox_messages WHERE to_address = $1 ORDER BY id",
    [email],
  );

async function runAt(iso: string) {
  const report = await runLapseJob({ asOf: new Date(iso) }, JOB_DEPS);
  if (report.skipped) throw new Error("the job was skipped");
  return report;
}

describe("maintenance reminders in the daily job", () => {
  it("reminds the shop's buyer 30 and 7 days before a plan falls due, once each, by bell and by e-mail", async () => {
    const shop = await buildShop(t.app);
    // Due 2027-03-31: twelve calendar months after the last inspection.
    const planId = await planOn(shop, {
      name: "Annual inspection",
      intervalKind: "months",
      intervalMonths: 12,
      lastDoneOn: "2026-03-31",
    });

    // 11 p.m. on Feb 28 in Chicago, 31 days out at the site although it is already Mar 1 in UTC.
    await runAt("2027-03-01T05:00:00Z");
    const beforeMark = await remindersOf(planId);
    const at30 = await runAt("2027-03-01T18:00:00Z");
    const rerun = await runAt("2027-03-01T18:00:00Z");
    await runAt("2027-03-02T18:00:00Z");
    const afterFirst = await remindersOf(planId);
    await runAt("2027-03-24T18:00:00Z");
    await runAt("2027-03-25T18:00:00Z");
    await runAt("2027-04-02T18:00:00Z");

    expect(beforeMark).toEqual([]);
    expect(afterFirst).toEqual([{ threshold_days: 30, due_key: "date:2027-03-31" }]);
    expect(at30.maintenanceReminders).toBeGreaterThanOrEqual(1);
    expect(rerun.maintenanceReminders).toBe(0);
    expect(await remindersOf(planId)).toEqual([
      { threshold_days: 30, due_key: "date:2027-03-31" },
      { threshold_days: 7, due_key: "date:2027-03-31" },
    ]);
    const bell = await bellOf(shop.user.id);
    expect(bell).toHaveLength(2);
    expect(bell[0]!.title).toBe(
      "Maintenance due in 30 days (Mar 31, 2027): Annual inspection on Corvane Machine Co. Corvane V-560",
    );
    expect(bell[1]!.title).toContain("due in 7 days");
    expect(bell[0]!.link).toBe(`/machines/${shop.equipmentId}/maintenance?plan=${planId}`);
    const mail = await mailTo(shop.user.email);
    expect(mail).toHaveLength(2);
    expect(mail[0]!.text_body).toContain(
      `https://clearbench.test/machines/${shop.equipmentId}/maintenance?plan=${planId}`,
    );
    expect(mail[0]!.html_body).toContain(
      `href="https://clearbench.test/machines/${shop.equipmentId}/maintenance?plan=${planId}"`,
    );
    expect(mail[0]!.html_body).toContain("Annual inspection");
    expect(mail[0]!.text_body).toContain("29 CFR 1910.147");
    const [run] = await rows<{ counts: Record<string, number> }>(
      "SELECT counts FROM job_runs WHERE id = $1",
      [at30.jobRunId],
    );
    expect(run!.counts).toMatchObject({
      maintenanceReminders: at30.maintenanceReminders,
      maintenanceEmails: at30.maintenanceEmails,
    });
  }, 60_000);

  it("sends only the 7-day reminder to a plan first seen a few days out, and starts afresh after the work", async () => {
    const shop = await buildShop(t.app);
    const planId = await planOn(shop, {
      name: "Ballbar test",
      intervalKind: "months",
      intervalMonths: 6,
      lastDoneOn: "2026-08-31",
    });

    // Due 2027-02-28: Aug 31 + 6 months, clamped to February's last day (common practice).
    await runAt("2027-02-24T18:00:00Z");
    await rows("UPDATE maintenance_plans SET last_done_on = '2027-02-26' WHERE id = $1", [planId]);
    await runAt("2027-07-27T18:00:00Z");

    expect(await remindersOf(planId)).toEqual([
      { threshold_days: 7, due_key: "date:2027-02-28" },
      { threshold_days: 30, due_key: "date:2027-08-26" },
    ]);
  }, 60_000);

  it("reminds a running-hours plan on its projected date", async () => {
    const shop = await buildShop(t.app);
    await rows(
      `INSERT INTO machine_hour_readings (equipment_id, hours, read_on, recorded_by)
       VALUES ($1, 5000, '2027-05-01', $2), ($1, 5300, '2027-05-31', $2)`,
      [shop.equipmentId, shop.user.id],
    );
    const planId = await planOn(shop, {
      name: "Spindle bearing check",
      intervalKind: "hours",
      intervalHours: 500,
      lastDoneHours: 4_900,
    });

    // 10 h a day; 100 h to go from the May 31 reading is Jun 10 (straight-line projection, common practice).
    await runAt("2027-06-03T18:00:00Z");

    expect(await remindersOf(planId)).toEqual([{ threshold_days: 7, due_key: "hours:5400" }]);
    const bell = await bellOf(shop.user.id);
    expect(bell[0]!.title).toContain("projected for Jun 10, 2027");
  }, 60_000);

  it("owes no reminder while a request raised from the plan for this due date is open", async () => {
    const shop = await buildShop(t.app);
    await buildClearedCompany(t.app);
    const planId = await planOn(shop, {
      name: "Ballbar test",
      intervalKind: "months",
      intervalMonths: 12,
      lastDoneOn: "2026-01-10",
    });
    const raised = await shop.agent
      .post(`/api/machines/${shop.equipmentId}/maintenance-plans/${planId}/service-request`)
      .send({});

    await runAt("2026-12-20T18:00:00Z");

    expect(raised.status).toBe(201);
    expect(await remindersOf(planId)).toEqual([]);
    expect(await bellOf(shop.user.id)).toEqual([]);
  }, 60_000);

  it("reminds the shop that bought the machine of a due date its seller was already reminded of, once", async () => {
    const seller = await buildShop(t.app);
    const buyer = await buildMachineShop(t.app, { machine: false });
    await planOn(seller, {
      name: "Ballbar test",
      intervalKind: "months",
      intervalMonths: 12,
      lastDoneOn: "2026-05-31",
    });
    await runAt("2027-05-03T18:00:00Z");
    const transfer = await seller.agent
      .post(`/api/machines/${seller.equipmentId}/transfers`)
      .send({ email: buyer.user.email })
      .expect(201);
    await buyer.agent
      .post(`/api/machine-transfers/${transfer.body.id}/accept`)
      .send({ siteId: buyer.siteId })
      .expect(200);

    await runAt("2027-05-04T18:00:00Z");
    await runAt("2027-05-05T18:00:00Z");

    // Due 2027-05-31; the seller had its 30-day reminder before the sale, the buyer gets its own the next day.
    expect((await bellOf(seller.user.id)).map((n) => n.title)).toEqual([
      expect.stringContaining("Maintenance due in 28 days (May 31, 2027): Ballbar test"),
    ]);
    expect((await bellOf(buyer.user.id)).map((n) => n.title)).toEqual([
      expect.stringContaining("Maintenance due in 27 days (May 31, 2027): Ballbar test"),
    ]);
    // Beside the transfer's own e-mail, one reminder.
    expect((await mailTo(buyer.user.email)).filter((m) => m.subject.includes("Ballbar test"))).toHaveLength(
      1,
    );
  });

  it("sends each reminder once when two job processes run at the same instant", async () => {
    const shop = await buildShop(t.app);
    await planOn(shop, {
      name: "Way lube and backlash check",
      intervalKind: "months",
      intervalMonths: 6,
      lastDoneOn: "2026-06-30",
    });
    const env = { DATABASE_URL: t.config.DATABASE_URL, SMTP_URL: catcher.url };

    const [a, b] = await Promise.all([
      runJobCli(["lapse", "--as-of", "2026-12-24T18:00:00Z"], env),
      runJobCli(["lapse", "--as-of", "2026-12-24T18:00:00Z"], env),
    ]);

    expect([a.code, b.code]).toEqual([0, 0]);
    const caught = catcher.to(shop.user.email);
    expect(caught).toHaveLength(1);
    expect(caught[0]!.subject).toContain("Way lube and backlash check");
    expect(caught[0]!.html).toContain("<a href=");
    expect(caught[0]!.text).toContain("Open the maintenance plans:");
  }, 90_000);
});
