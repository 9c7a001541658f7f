import { describe, expect, it } from "vitest";
import request from "supertest";
import { QueryTypes } from "sequelize";
import { useTestApp, sequelize, signedInAs } from "../../support/test-app.ts";
import { buildCompany } from "../../support/build-company.ts";
import { useDirectoryWorld } from "../../support/directory-suite.ts";

const t = useTestApp();
const { world, buyer } = useDirectoryWorld(t, { seed: 5, count: 12, companies: 3 });

const listed = () =>
  world.technicians.filter((x) => x.active && (x.baseline === "cleared" || x.baseline === "lapsing"));

describe("technician page for buyers", () => {
  it("shows verified credentials in force, with download ids for insurance certificates only", async () => {
    const tech = listed().find((x) =>
      x.credentials.some((c) => c.state === "verified" && (c.lapsesAt === null || c.lapsesAt > new Date())),
    )!;

    const res = await buyer.get(`/api/directory/technicians/${tech.id}`);

    expect(res.status).toBe(200);
    const expected = tech.credentials.filter(
      (c) => c.state === "verified" && (c.lapsesAt === null || c.lapsesAt > new Date()),
    );
    expect(res.body.credentials.map((c: { typeCode: string }) => c.typeCode).sort()).toEqual(
      expected.map((c) => c.typeCode).sort(),
    );
    for (const c of res.body.credentials) {
      expect(c.documentId === null).toBe(c.category !== "insurance");
    }
    expect(res.body.caution).toMatch(/information only/);
  });

  it("gives the standing against each of the shop's requirement sets, with the reason for an unmet requirement", async () => {
    const tech = listed()[0]!;
    const [set] = await sequelize().query<{ id: number }>(
      `INSERT INTO requirement_sets (company_id, name, requirements) VALUES ($1, 'Needs confined space', $2) RETURNING id`,
      {
        bind: [
          world.shopId,
          JSON.stringify([{ id: "cs", label: "Confined space entry", typeCodes: ["confined_space"] }]),
        ],
        type: QueryTypes.SELECT,
      },
    );

    const res = await buyer.get(`/api/directory/technicians/${tech.id}`);

    const computed = res.body.requirementSets.find(
      (s: { requirementSetId: number }) => s.requirementSetId === set!.id,
    );
    expect(computed).toMatchObject({ standing: "not_cleared", source: "computed" });
    expect(computed.unmet).toEqual([
      { label: "Confined space entry", reason: "missing", detail: expect.stringMatching(/No .* on file/) },
    ]);
    const stored = res.body.requirementSets.find(
      (s: { requirementSetId: number }) => s.requirementSetId === world.requirementSetId,
    );
    if (tech.setStanding) expect(stored).toMatchObject({ standing: tech.setStanding, source: "stored" });
  });

  it("gives the call-out estimate for each of the shop's sites from the shared estimate", async () => {
    const tech = listed()[0]!;

    const res = await buyer.get(`/api/directory/technicians/${tech.id}`).query({ onSiteHours: 4 });

    const estimate = res.body.estimates.find((e: { siteId: number }) => e.siteId === world.site.id);
    // Travel is billed portal to portal, both ways, at the travel rate (common practice); driveHours is
    // shown rounded to 0.01 h, hence the tolerance of one rounding step each way.
    expect(
      Math.abs(estimate.callOut.travelCents - 2 * estimate.driveHours * res.body.travelRateCents),
    ).toBeLessThanOrEqual(0.01 * res.body.travelRateCents + 1);
    expect(estimate.callOut.totalCents).toBe(
      estimate.callOut.travelCents + estimate.callOut.labourCents + estimate.callOut.mileageCents,
    );
    expect(estimate.callOut.labourCents).toBe(4 * tech.hourlyRateCents);
    expect(res.body.rating.count).toBe(tech.ratingCount);
  });

  it("answers 404 for a technician whose baseline standing is not cleared", async () => {
    const hidden = world.technicians.find(
      (x) => x.baseline === "not_cleared" || x.baseline === null || !x.active,
    )!;

    const res = await buyer.get(`/api/directory/technicians/${hidden.id}`);

    expect(res.status).toBe(404);
  });

  it("answers an inactive or not cleared technician exactly as a missing id, for every hidden one", async () => {
    const hidden = world.technicians
      .filter((x) => x.baseline === "not_cleared" || x.baseline === null || !x.active)
      .slice(0, 40);
    const missing = await buyer.get("/api/directory/technicians/99999999");

    expect(hidden.length).toBeGreaterThan(0);
    expect(missing.status).toBe(404);
    for (const h of hidden) {
      const res = await buyer.get(`/api/directory/technicians/${h.id}`);
      expect([res.status, res.body]).toEqual([404, missing.body]);
    }
  });

  it("answers 401 signed out and 403 to a provider", async () => {
    const { users } = await buildCompany("service", ["provider_admin"]);
    const provider = await signedInAs(t.app, users.provider_admin!.email);
    const id = listed()[0]!.id;

    const anonymous = await request(t.app).get(`/api/directory/technicians/${id}`);
    const forbidden = await provider.get(`/api/directory/technicians/${id}`);

    expect(anonymous.status).toBe(401);
    expect(forbidden.status).toBe(403);
  });
});
