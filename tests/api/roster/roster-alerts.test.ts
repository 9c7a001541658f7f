import { describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { sequelize, signedInAs, useTestApp } from "../../support/test-app.ts";
import { buildCompany } from "../../support/build-company.ts";
import { emitStandingsChanged, type ChangedStanding } from "../../../server/standing/index.ts";
import { sweepRosterAlerts } from "../../../server/roster/index.ts";
import { Technician } from "../../../server/technicians/model.ts";
import type { Standing } from "../../../shared/standing/standing-types.ts";

const t = useTestApp();

const DAY = 86_400_000;

async function shopWithRoster() {
  const { users, company } = await buildCompany("shop", ["buyer"]);
  const agent = await signedInAs(t.app, users.buyer!.email);
  const provider = await buildCompany("service", []);
  const technician = await Technician.create({
    companyId: provider.company.id,
    name: `Dagny Varga ${provider.tag}`,
    email: null,
    phone: null,
    technologies: ["grinder"],
    controlFamilies: [],
    postalCode: "60601",
    latitude: 41.8858,
    longitude: -87.6181,
    serviceRadiusKm: 100,
    hourlyRateCents: 13000,
    travelRateCents: 9000,
  });
  await storeBaseline(technician.id, "cleared", null);
  return { agent, buyer: users.buyer!, shop: company, provider: provider.company, technician };
}

async function storeBaseline(
  technicianId: number,
  standing: Standing,
  earliestLapse: Date | null,
  results: unknown[] = [],
) {
  await sequelize().query(
    `INSERT INTO technician_standings (technician_id, requirement_set_id, standing, earliest_lapse, results, computed_at)
     VALUES ($1, NULL, $2, $3, $4, now())
     ON CONFLICT (technician_id, (coalesce(requirement_set_id, 0))) DO UPDATE
       SET standing = EXCLUDED.standing, earliest_lapse = EXCLUDED.earliest_lapse, results = EXCLUDED.results, computed_at = now()`,
    { bind: [technicianId, standing, earliestLapse, JSON.stringify(results)] },
  );
}

async function alertsFor(userId: number, email: string) {
  const [notifications, mails] = await Promise.all([
    sequelize().query<{ kind: string; title: string }>(
      "SELECT kind, title FROM notifications WHERE user_id = $1",
      { bind: [userId], type: QueryTypes.SELECT },
    ),
    sequelize().query<{ subject: string; text_body: string; html_body: string | null }>(
      "SELECT subject, text_body, html_body FROM outbox_messages WHERE to_address = $1",
      {
        bind: [email],
        type: QueryTypes.SELECT,
      },
    ),
  ]);
  return { notifications, mails };
}

const change = (
  technicianId: number,
  companyId: number,
  before: Standing,
  after: Standing,
  earliestLapse: string | null = null,
): ChangedStanding => ({
  technicianId,
  companyId,
  requirementSetId: null,
  before,
  after,
  earliestLapse,
});

const lapsedGl = {
  requirement: {
    id: "baseline_general_liability",
    label: "General liability in force",
    typeCodes: ["general_liability"],
  },
  status: "unmet",
  reason: "lapsed",
  detail: "Commercial general liability lapsed on Dec 1, 2026.",
  credentialId: 1,
  lapsesAt: "2026-12-01T06:01:00.000Z",
};

describe("roster alerts", () => {
  it("tells each buyer once, in the app and by e-mail, when a rostered technician stops being cleared", async () => {
    const { agent, buyer, technician, provider } = await shopWithRoster();
    await agent.post("/api/roster").send({ technicianId: technician.id }).expect(201);
    await storeBaseline(technician.id, "not_cleared", null, [lapsedGl]);

    await emitStandingsChanged([change(technician.id, provider.id, "cleared", "not_cleared")]);
    await emitStandingsChanged([change(technician.id, provider.id, "cleared", "not_cleared")]);

    const { notifications, mails } = await alertsFor(buyer.id, buyer.email);
    expect(notifications).toEqual([
      { kind: "roster_stopped_clearing", title: expect.stringContaining("no longer cleared") },
    ]);
    expect(mails).toHaveLength(1);
  });

  it("tells the shop once when a technician rostered through the company comes within 30 days of a lapse", async () => {
    const { agent, buyer, technician, provider } = await shopWithRoster();
    await agent.post("/api/roster").send({ serviceCompanyId: provider.id }).expect(201);
    const lapse = new Date(Date.now() + 12 * DAY);
    await storeBaseline(technician.id, "lapsing", lapse);

    await emitStandingsChanged([
      change(technician.id, provider.id, "cleared", "lapsing", lapse.toISOString()),
    ]);
    await emitStandingsChanged([
      change(technician.id, provider.id, "cleared", "lapsing", lapse.toISOString()),
    ]);

    const { notifications, mails } = await alertsFor(buyer.id, buyer.email);
    expect(notifications).toEqual([
      { kind: "roster_lapse_within_30_days", title: expect.stringContaining("lapses in 12 days") },
    ]);
    expect(mails).toHaveLength(1);
    const [mail] = mails;
    // An absolute link (PUBLIC_URL), a date on the shop's clock with its zone, never ISO, and both parts.
    expect(mail!.text_body).toMatch(/See your roster: https?:\/\/[^\s]+\/roster\b/);
    expect(mail!.text_body).not.toMatch(/\d{4}-\d{2}-\d{2}/);
    expect(mail!.text_body).toMatch(/\b(CST|CDT)\b/);
    expect(mail!.html_body).toMatch(/<a href="https?:\/\/[^"]+\/roster">See your roster<\/a>/);
    // The credential lapses, not the person.
    expect(mail!.subject).not.toMatch(new RegExp(`^${technician.name}[^,]* lapses`));
  });

  it("stays quiet for a lapse more than 30 days away and for technicians on no roster", async () => {
    const { agent, buyer, technician, provider } = await shopWithRoster();
    await agent.post("/api/roster").send({ technicianId: technician.id }).expect(201);
    const stranger = await shopWithRoster();
    const farLapse = new Date(Date.now() + 45 * DAY);
    await storeBaseline(technician.id, "lapsing", farLapse);
    await storeBaseline(stranger.technician.id, "not_cleared", null, [lapsedGl]);

    await emitStandingsChanged([
      change(technician.id, provider.id, "cleared", "lapsing", farLapse.toISOString()),
      change(stranger.technician.id, stranger.provider.id, "cleared", "not_cleared"),
    ]);

    expect((await alertsFor(buyer.id, buyer.email)).notifications).toEqual([]);
    expect((await alertsFor(stranger.buyer.id, stranger.buyer.email)).notifications).toEqual([]);
  });

  it("never names a technician of a rostered company who was never listed, on a change or in the daily sweep", async () => {
    const { agent, buyer, provider } = await shopWithRoster();
    await agent.post("/api/roster").send({ serviceCompanyId: provider.id }).expect(201);
    const hidden = await Technician.create({
      companyId: provider.id,
      name: `Perpetua Lindqvist ${provider.id}`,
      email: null,
      phone: null,
      technologies: ["lathe"],
      controlFamilies: [],
      postalCode: "60601",
      latitude: 41.8858,
      longitude: -87.6181,
      serviceRadiusKm: 100,
      hourlyRateCents: 13000,
      travelRateCents: 9000,
    });
    await storeBaseline(hidden.id, "not_cleared", null, [lapsedGl]);

    await emitStandingsChanged([
      { ...change(hidden.id, provider.id, "cleared", "not_cleared"), before: null },
    ]);
    await sweepRosterAlerts();

    const { notifications, mails } = await alertsFor(buyer.id, buyer.email);
    expect(notifications.map((n) => n.title).join(" ")).not.toContain("Perpetua");
    expect(mails.map((m) => m.subject).join(" ")).not.toContain("Perpetua");
  });

  it("still tells a shop that rostered only the company when a listed technician leaves the directory", async () => {
    const { agent, buyer, technician, provider } = await shopWithRoster();
    await agent.post("/api/roster").send({ serviceCompanyId: provider.id }).expect(201);
    await storeBaseline(technician.id, "not_cleared", null, [lapsedGl]);

    await emitStandingsChanged([change(technician.id, provider.id, "cleared", "not_cleared")]);

    const { notifications } = await alertsFor(buyer.id, buyer.email);
    expect(notifications).toEqual([
      { kind: "roster_stopped_clearing", title: expect.stringContaining(technician.name) },
    ]);
  });
});
