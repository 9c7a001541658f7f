import { describe, expect, it } from "vitest";
import request from "supertest";
import Papa from "papaparse";
import { sequelize, signedInAs, useTestApp } from "../../support/test-app.ts";
import { buildCompany } from "../../support/build-company.ts";
import { Technician } from "../../../server/technicians/model.ts";
import type { Standing } from "../../../shared/standing/standing-types.ts";

const t = useTestApp();

async function signedInBuyer() {
  const { users, company } = await buildCompany("shop", ["buyer"]);
  const agent = await signedInAs(t.app, users.buyer!.email);
  return { agent, company, user: users.buyer! };
}

async function buildRosterableTechnician(
  standing: Standing,
  earliestLapse: Date | null = null,
  name = "Orla Penhallow",
) {
  const { company } = await buildCompany("service", []);
  const technician = await Technician.create({
    companyId: company.id,
    name,
    email: null,
    phone: null,
    technologies: ["lathe"],
    controlFamilies: ["S30"],
    postalCode: "60601",
    latitude: 41.8858,
    longitude: -87.6181,
    serviceRadiusKm: 200,
    hourlyRateCents: 15000,
    travelRateCents: 9000,
  });
  await sequelize().query(
    `INSERT INTO technician_standings (technician_id, requirement_set_id, standing, earliest_lapse, results, computed_at)
     VALUES ($1, NULL, $2, $3, '[]'::jsonb, now())`,
    { bind: [technician.id, standing, earliestLapse] },
  );
  return { company, technician };
}

describe("roster", () => {
  it("adds a technician and a whole service company, lists them with standing and next lapse, and removes one", async () => {
    const { agent } = await signedInBuyer();
    const lapse = new Date(Date.now() + 45 * 86_400_000);
    const one = await buildRosterableTechnician("lapsing", lapse);
    const whole = await buildRosterableTechnician("cleared");

    const addedTech = await agent.post("/api/roster").send({ technicianId: one.technician.id });
    const addedCompany = await agent.post("/api/roster").send({ serviceCompanyId: whole.company.id });
    const listed = await agent.get("/api/roster");
    const removed = await agent.delete(`/api/roster/${addedTech.body.id}`);
    const afterRemoval = await agent.get("/api/roster");

    expect(addedTech.status).toBe(201);
    expect(addedTech.body).toMatchObject({ kind: "technician", technicianId: one.technician.id });
    expect(addedCompany.body).toMatchObject({ kind: "company", serviceCompanyId: whole.company.id });
    const techEntry = listed.body.find((e: { id: number }) => e.id === addedTech.body.id);
    expect(techEntry.technicians).toEqual([
      expect.objectContaining({
        technicianId: one.technician.id,
        standing: "lapsing",
        nextLapse: lapse.toISOString(),
      }),
    ]);
    expect(
      listed.body
        .find((e: { id: number }) => e.id === addedCompany.body.id)
        .technicians.map((x: { technicianId: number }) => x.technicianId),
    ).toEqual([whole.technician.id]);
    expect(removed.status).toBe(204);
    expect(afterRemoval.body.map((e: { id: number }) => e.id)).toEqual([addedCompany.body.id]);
  });

  it("refuses the same technician twice with 409", async () => {
    const { agent } = await signedInBuyer();
    const { technician } = await buildRosterableTechnician("cleared");
    await agent.post("/api/roster").send({ technicianId: technician.id }).expect(201);

    const again = await agent.post("/api/roster").send({ technicianId: technician.id });

    expect(again.status).toBe(409);
  });

  it("answers 404 for a technician who is not listed in the directory", async () => {
    const { agent } = await signedInBuyer();
    const { technician } = await buildRosterableTechnician("not_cleared");

    const res = await agent.post("/api/roster").send({ technicianId: technician.id });

    expect(res.status).toBe(404);
  });

  it("refuses an entry naming both or neither subject with 422 naming body.technicianId", async () => {
    const { agent } = await signedInBuyer();

    const neither = await agent.post("/api/roster").send({});
    const both = await agent.post("/api/roster").send({ technicianId: 1, serviceCompanyId: 1 });

    expect(neither.status).toBe(422);
    expect(neither.body.error.fields[0].path).toBe("body.technicianId");
    expect(both.status).toBe(422);
  });

  it("exports the roster as CSV with one line per technician", async () => {
    const { agent } = await signedInBuyer();
    const lapse = new Date(Date.now() + 20 * 86_400_000);
    const { technician, company } = await buildRosterableTechnician("lapsing", lapse, "=Formula Quist");
    await agent.post("/api/roster").send({ technicianId: technician.id }).expect(201);

    const res = await agent.get("/api/roster/export.csv");

    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toMatch(/^text\/csv/);
    expect(res.headers["content-disposition"]).toMatch(/^attachment; filename="?roster\.csv"?$/);
    const parsed = Papa.parse<string[]>(res.text.trim());
    expect(parsed.data[0]).toEqual(["technician", "company", "standing", "next lapse", "added at"]);
    // A leading "=" is escaped with a quote so spreadsheets never evaluate it (OWASP "CSV Injection").
    expect(parsed.data[1]?.slice(0, 4)).toEqual([
      "'=Formula Quist",
      company.name,
      "Lapsing",
      lapse.toISOString(),
    ]);
    expect(parsed.data).toHaveLength(2);
  });

  it("answers 401 signed out, 403 to a provider and 404 for another shop's entry", async () => {
    const owner = await signedInBuyer();
    const other = await signedInBuyer();
    const { technician } = await buildRosterableTechnician("cleared");
    const entry = (await owner.agent.post("/api/roster").send({ technicianId: technician.id }).expect(201))
      .body;
    const { users } = await buildCompany("service", ["provider_admin"]);
    const provider = await signedInAs(t.app, users.provider_admin!.email);

    const anonymous = await request(t.app).get("/api/roster");
    const forbidden = await provider.get("/api/roster/export.csv");
    const foreign = await other.agent.delete(`/api/roster/${entry.id}`);

    expect(anonymous.status).toBe(401);
    expect(forbidden.status).toBe(403);
    expect(foreign.status).toBe(404);
    expect((await owner.agent.get("/api/roster")).body).toHaveLength(1);
  });
});
