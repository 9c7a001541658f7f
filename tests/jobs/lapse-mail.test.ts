import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Sequelize } from "sequelize";
import { buildTestApp, type TestApp } from "../support/test-app.ts";
import { startTestMailCatcher } from "../support/mail-catcher.ts";
import { freePort } from "../support/free-port.ts";
import {
  buildClearedProvider,
  buildCredentialRow,
  insuranceFields,
  trainingFields,
} from "../fixtures/build-credential-row.ts";
import { runLapseJob } from "../../jobs/lapse.ts";
import { runSendOutbox } from "../../jobs/send-outbox.ts";
import { db } from "../../server/db/sequelize.ts";
import { createSmtpMailer } from "../../server/mail/index.ts";
import { deliverAll, JOB_DEPS, rows } from "./job-support.ts";

let t: TestApp;
let catcher: Awaited<ReturnType<typeof startTestMailCatcher>>;
beforeAll(async () => {
  t = buildTestApp();
  catcher = await startTestMailCatcher();
});
afterAll(async () => {
  await catcher.close();
  await t.close();
});

const FROM = "Clearbench <no-reply@clearbench.test>";

async function providerWithCard(issueDate = "2024-05-15") {
  const provider = await buildClearedProvider({ glExpires: "2028-06-01" });
  const card = await buildCredentialRow({
    companyId: provider.company.id,
    technicianId: provider.technician.id,
    typeCode: "arc_flash",
    fields: trainingFields({ issueDate }),
    submittedBy: provider.admin.id,
  });
  return { ...provider, card };
}

describe("lapse notices by e-mail", () => {
  it("sends each notice once when the job runs twice", async () => {
    const p = await providerWithCard();
    const asOf = new Date("2027-05-09T11:00:00Z"); // 6 days 18 h before the card's lapse: the 7-day window

    await runLapseJob({ asOf }, JOB_DEPS);
    await deliverAll(catcher);
    await runLapseJob({ asOf }, JOB_DEPS);
    await runLapseJob({ asOf: new Date(asOf.getTime() + 3_600_000) }, JOB_DEPS);
    await deliverAll(catcher);

    expect(catcher.to(p.admin.email)).toHaveLength(1);
    expect(catcher.to(p.technicianUser.email)).toHaveLength(1);
  });

  it("sends each notice once when two instances race on separate connections, and one of them is skipped or finds nothing", async () => {
    const p = await providerWithCard();
    const asOf = new Date("2027-05-15T12:00:00Z"); // inside the 1-day window
    const pools = [0, 1].map(
      () => new Sequelize(t.config.DATABASE_URL!, { dialect: "postgres", logging: false }),
    );

    const results = await Promise.all(
      pools.map((sequelize) => runLapseJob({ asOf }, { ...JOB_DEPS, sequelize })),
    );
    await Promise.all(pools.map((s) => s.close()));
    await deliverAll(catcher);

    const ran = results.filter((r) => !r.skipped);
    expect(ran.length).toBeGreaterThanOrEqual(1);
    expect(ran.reduce((n, r) => n + (r.skipped ? 0 : r.noticesCreated), 0)).toBeGreaterThanOrEqual(1);
    expect(catcher.to(p.admin.email)).toHaveLength(1);
    expect(catcher.to(p.technicianUser.email)).toHaveLength(1);
  });

  it("skips the run while another instance holds the advisory lock", async () => {
    const holder = new Sequelize(t.config.DATABASE_URL!, { dialect: "postgres", logging: false });
    let release!: () => void;
    const released = new Promise<void>((resolve) => (release = resolve));
    let locked!: () => void;
    const lockTaken = new Promise<void>((resolve) => (locked = resolve));
    const holding = holder.transaction(async (transaction) => {
      await holder.query("SELECT pg_advisory_xact_lock(1668047361)", { transaction }); // 0x636c6201, the lapse job's key
      locked();
      await released;
    });
    await lockTaken;

    const result = await runLapseJob({ asOf: new Date("2027-05-20T12:00:00Z") }, JOB_DEPS);
    release();
    await holding;
    await holder.close();

    expect(result).toEqual({ skipped: true });
  });

  it("loses nothing while SMTP is down and sends it once SMTP is back", async () => {
    await deliverAll(catcher);
    const p = await providerWithCard("2024-06-20");
    await runLapseJob({ asOf: new Date("2027-06-19T12:00:00Z") }, JOB_DEPS);
    const downMailer = createSmtpMailer(`smtp://127.0.0.1:${await freePort()}`);

    // Each round tries the 50 oldest due rows; a failed row waits for its backoff, so a few rounds reach every row.
    let down = { sent: 0, retried: 0, failed: 0 };
    for (let round = 0; round < 5; round += 1) {
      const report = await runSendOutbox({ asOf: new Date() }, { mailer: downMailer, from: FROM });
      down = {
        sent: down.sent + report.sent,
        retried: down.retried + report.retried,
        failed: down.failed + report.failed,
      };
    }
    downMailer.close();
    const pending = await rows<{ status: string; attempts: number }>(
      "SELECT status, attempts FROM outbox_messages WHERE to_address = $1",
      [p.admin.email],
    );
    const upMailer = createSmtpMailer(catcher.url);
    const up = await runSendOutbox(
      { asOf: new Date(Date.now() + 10 * 60_000) },
      { mailer: upMailer, from: FROM },
    );
    upMailer.close();

    expect(down.sent).toBe(0);
    expect(down.retried).toBeGreaterThan(0);
    expect(pending).toEqual([{ status: "pending", attempts: 1 }]);
    expect(up.sent).toBeGreaterThan(0);
    expect(catcher.to(p.admin.email)).toHaveLength(1);
    expect(catcher.to(p.technicianUser.email)).toHaveLength(1);
  });

  it("e-mails the credential, the holder, the lapse date in the company's zone and a link to upload the renewal, as text and HTML", async () => {
    const p = await buildClearedProvider({ glExpires: "2027-08-01", timeZone: "America/New_York" });

    await runLapseJob({ asOf: new Date("2027-07-31T12:00:00Z") }, JOB_DEPS);
    await deliverAll(catcher);

    const [mail] = catcher.to(p.admin.email);
    // 12:01 a.m. standard time on 2027-08-01 in New York is 05:01Z, 1:01 AM EDT on the wall clock (standard time all year, ISO CG DS 01 wording, from memory).
    expect(mail?.subject).toBe(`Commercial general liability for ${p.company.name} lapses in 1 day`);
    expect(mail?.text).toContain("Sunday, August 1, 2027 at 1:01 AM EDT");
    expect(mail?.text).toContain("https://clearbench.test/provider/documents/new?type=general_liability");
    expect(mail?.html).toContain(
      '<a href="https://clearbench.test/provider/documents/new?type=general_liability">',
    );
    expect(mail?.html).toContain("Commercial general liability held by");
    // A company-held policy goes to the office only, not to each technician.
    expect(catcher.to(p.technicianUser.email)).toHaveLength(0);
  });

  it("tells the office on the lapse itself that the technicians are hidden and cannot take work orders, and that a reviewer verifies the renewal", async () => {
    const p = await buildClearedProvider({ glExpires: "2027-08-01", timeZone: "America/New_York" });

    await runLapseJob({ asOf: new Date("2027-08-01T12:00:00Z") }, JOB_DEPS);
    await deliverAll(catcher);

    const mails = catcher.to(p.admin.email);
    const lapsed = mails.find((m) => m.subject.startsWith("Lapsed:"));
    expect(lapsed?.text).toContain("hidden from shops in the directory and cannot take new work orders");
    expect(lapsed?.text).toContain("a Clearbench reviewer verifies it");
    // Uploaders cannot verify their own documents: the old wording told them to "upload and verify".
    expect(lapsed?.text).not.toMatch(/upload and verify/i);
    expect(lapsed?.html).toContain("hidden from shops");
    expect(lapsed?.text).toMatch(/https:\/\/clearbench\.test\//);
  });

  it("gives the technician a link to their own card upload and an in-app notification", async () => {
    const p = await providerWithCard("2024-07-02");

    await runLapseJob({ asOf: new Date("2027-07-01T12:00:00Z") }, JOB_DEPS);
    await deliverAll(catcher);

    const [mail] = catcher.to(p.technicianUser.email);
    expect(mail?.text).toContain("https://clearbench.test/technician/upload-card?type=arc_flash");
    expect(mail?.text).toContain(p.technician.name);
    const notes = await rows<{ user_id: number; kind: string; link: string }>(
      "SELECT user_id, kind, link FROM notifications WHERE user_id = ANY($1::int[]) ORDER BY user_id",
      [[p.admin.id, p.technicianUser.id]],
    );
    expect(notes).toEqual([
      {
        user_id: p.admin.id,
        kind: "credential_lapsing",
        link: `https://clearbench.test/provider/documents/new?type=arc_flash&technicianId=${p.technician.id}`,
      },
      {
        user_id: p.technicianUser.id,
        kind: "credential_lapsing",
        link: "https://clearbench.test/technician/upload-card?type=arc_flash",
      },
    ]);
  });
});

describe("lapse notice wording", () => {
  it("words every e-mail and notification in full, escaping the HTML and taking the link base with or without its slash", async () => {
    const p = await providerWithCard("2024-05-15");
    await db().query(
      "UPDATE credentials SET state = 'superseded' WHERE company_id = $1 AND type_code = 'general_liability'",
      {
        bind: [p.company.id],
      },
    );
    const gl = await buildCredentialRow({
      companyId: p.company.id,
      typeCode: "general_liability",
      fields: insuranceFields({ expirationDate: "2027-05-09" }),
      submittedBy: p.admin.id,
      timeZone: p.company.timeZone,
    });
    await db().query("UPDATE companies SET name = 'Birch & Pike <Tools>' WHERE id = $1", {
      bind: [p.company.id],
    });
    await db().query(`UPDATE technicians SET name = 'Rhian O''Neil "Rook"' WHERE id = $1`, {
      bind: [p.technician.id],
    });
    await db().query("UPDATE users SET name = 'Ana & Bo' WHERE id = $1", { bind: [p.admin.id] });
    await db().query("UPDATE users SET name = 'Rhian' WHERE id = $1", { bind: [p.technicianUser.id] });

    // Chicago (the fixture's zone): the card counts through 2027-05-15 (NFPA 70E 110.6(A)(3): 36 months), so it stops at
    // 2027-05-16 00:00 CDT, 6 days 18 h after the run: "7 days" (whole days of 24 h, rounded up). The policy ends at
    // 12:01 a.m. standard time on 2027-05-09, 1:01 AM CDT (ISO CG DS 01 wording, from memory), before the run.
    const report = await runLapseJob(
      { asOf: new Date("2027-05-09T11:00:00Z") },
      { ...JOB_DEPS, publicUrl: "https://clearbench.test/" },
    );
    await deliverAll(catcher);

    expect(report.skipped).toBe(false);
    const cardLink = `https://clearbench.test/provider/documents/new?type=arc_flash&technicianId=${p.technician.id}`;
    const glLink = "https://clearbench.test/provider/documents/new?type=general_liability";
    const holder = 'Rhian O\'Neil "Rook" (Birch & Pike <Tools>)';
    const cardBody = `Electrical safety (arc flash) training held by ${holder} lapses on Sunday, May 16, 2027 at 12:00 AM CDT. If no verified renewal is on file by then, Rhian O'Neil "Rook" is hidden from shops in the directory and cannot take new work orders.`;
    const glBody =
      "Commercial general liability held by Birch & Pike <Tools> lapsed on Sunday, May 9, 2027 at 1:01 AM CDT. It no longer counts: every technician of Birch & Pike <Tools> who needs it is hidden from shops in the directory and cannot take new work orders until a renewal is uploaded and a Clearbench reviewer verifies it.";
    const lapsingNext = "Upload the renewal before then, leaving a reviewer time to verify it.";
    const lapsedNext = "Upload the renewal now; once a reviewer verifies it, the standing is restored.";
    const text = (name: string, body: string, next: string, link: string) =>
      `Hello ${name},\n\n${body}\n\n${next}\n\nUpload the renewal: ${link}\n\nClearbench`;
    const html = (name: string, body: string, next: string, link: string) =>
      [
        `<p>Hello ${name},</p>`,
        `<p>${body}</p>`,
        `<p><strong>${next}</strong></p>`,
        `<p><a href="${link}">Upload the renewal</a></p>`,
        "<p>Clearbench</p>",
      ].join("\n");
    const cardBodyHtml = `Electrical safety (arc flash) training held by Rhian O&#39;Neil &quot;Rook&quot; (Birch &amp; Pike &lt;Tools&gt;) lapses on Sunday, May 16, 2027 at 12:00 AM CDT. If no verified renewal is on file by then, Rhian O&#39;Neil &quot;Rook&quot; is hidden from shops in the directory and cannot take new work orders.`;
    const glBodyHtml =
      "Commercial general liability held by Birch &amp; Pike &lt;Tools&gt; lapsed on Sunday, May 9, 2027 at 1:01 AM CDT. It no longer counts: every technician of Birch &amp; Pike &lt;Tools&gt; who needs it is hidden from shops in the directory and cannot take new work orders until a renewal is uploaded and a Clearbench reviewer verifies it.";

    const office = catcher.to(p.admin.email).map((m) => ({ subject: m.subject, text: m.text, html: m.html }));
    expect(office).toEqual(
      expect.arrayContaining([
        {
          subject: "Lapsed: Commercial general liability for Birch & Pike <Tools>",
          text: text("Ana & Bo", glBody, lapsedNext, glLink),
          html: html("Ana &amp; Bo", glBodyHtml, lapsedNext, glLink),
        },
        {
          subject: `Electrical safety (arc flash) training for ${holder} lapses in 7 days`,
          text: text("Ana & Bo", cardBody, lapsingNext, cardLink),
          html: html("Ana &amp; Bo", cardBodyHtml, lapsingNext, cardLink.replace("&", "&amp;")),
        },
      ]),
    );
    expect(office).toHaveLength(2);
    const own = catcher.to(p.technicianUser.email);
    const ownLink = "https://clearbench.test/technician/upload-card?type=arc_flash";
    expect(own.map((m) => ({ subject: m.subject, text: m.text, html: m.html }))).toEqual([
      {
        subject: `Electrical safety (arc flash) training for ${holder} lapses in 7 days`,
        text: text("Rhian", cardBody, lapsingNext, ownLink),
        html: html("Rhian", cardBodyHtml, lapsingNext, ownLink),
      },
    ]);
    const notes = await rows<{ user_id: number; kind: string; title: string; body: string; link: string }>(
      `SELECT n.user_id, n.kind, n.title, n.body, n.link FROM notifications n JOIN notices x ON x.id = n.notice_id
        WHERE x.credential_id = ANY($1::int[]) ORDER BY n.id`,
      [[gl.id, p.card.id]],
    );
    expect(notes).toEqual(
      expect.arrayContaining([
        {
          user_id: p.admin.id,
          kind: "credential_lapsed",
          title: "Lapsed: Commercial general liability for Birch & Pike <Tools>",
          body: glBody,
          link: glLink,
        },
        {
          user_id: p.admin.id,
          kind: "credential_lapsing",
          title: `Electrical safety (arc flash) training for ${holder} lapses in 7 days`,
          body: cardBody,
          link: cardLink,
        },
        {
          user_id: p.technicianUser.id,
          kind: "credential_lapsing",
          title: `Electrical safety (arc flash) training for ${holder} lapses in 7 days`,
          body: cardBody,
          link: ownLink,
        },
      ]),
    );
    expect(notes).toHaveLength(3);
  });
});

describe("lapse job statements", () => {
  it("issues the same small number of SQL statements whatever the number of credentials", async () => {
    let issued = 0;
    const counting = new Sequelize(t.config.DATABASE_URL!, {
      dialect: "postgres",
      logging: () => (issued += 1),
    });
    for (let i = 0; i < 3; i += 1) await providerWithCard("2024-08-10");

    const first = await runLapseJob(
      { asOf: new Date("2027-08-09T12:00:00Z") },
      { ...JOB_DEPS, sequelize: counting },
    );
    const firstIssued = issued;
    for (let i = 0; i < 12; i += 1) await providerWithCard("2024-08-12");
    issued = 0;
    const second = await runLapseJob(
      { asOf: new Date("2027-08-11T12:00:00Z") },
      { ...JOB_DEPS, sequelize: counting },
    );
    await counting.close();

    expect(first.skipped || second.skipped).toBe(false);
    if (first.skipped || second.skipped) return;
    expect(second.noticesCreated).toBeGreaterThan(first.noticesCreated);
    expect(second.statements).toBe(first.statements);
    expect(issued).toBe(firstIssued);
    expect(second.statements).toBe(issued);
  });
});
