import { describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { useTestApp, sequelize } from "../../support/test-app.ts";
import { buildCompany } from "../../support/build-company.ts";
import { useDirectoryWorld } from "../../support/directory-suite.ts";

const t = useTestApp();
const { world, buyer } = useDirectoryWorld(t, { seed: 23, count: 12, companies: 3 });

async function firstRowNearSite(onSiteHours: number) {
  const res = await buyer
    .get("/api/directory")
    .query({ siteId: world.site.id, radiusMiles: 1200, onSiteHours, limit: 5 });
  expect(res.status).toBe(200);
  expect(res.body.rows.length).toBeGreaterThan(0);
  return res.body.rows[0];
}

describe("one estimate for one technician and site", () => {
  it.each([4, 0.5, 9])(
    "gives the same call-out on the technician page as in the directory row for %s h on site",
    async (hours) => {
      const row = await firstRowNearSite(hours);

      const page = await buyer
        .get(`/api/directory/technicians/${row.technicianId}`)
        .query({ onSiteHours: hours, siteId: world.site.id });

      expect(page.status).toBe(200);
      expect(page.body.chosenSiteId).toBe(world.site.id);
      expect(page.body.assumptions.onSiteHours).toBe(hours);
      const estimate = page.body.estimates.find((e: { siteId: number }) => e.siteId === world.site.id);
      expect(estimate.callOut).toEqual(row.callOut);
      expect(estimate.roadMiles).toBe(row.roadMiles);
      // Labour is the hours on site at the hourly rate (common practice), so the carried hours show in the figure.
      expect(estimate.callOut.labourCents).toBe(Math.round(hours * row.hourlyRateCents));
    },
  );

  it("differs from the default when the hours are not carried, which is what the buyer saw before", async () => {
    const row = await firstRowNearSite(4);

    const page = await buyer.get(`/api/directory/technicians/${row.technicianId}`);

    const estimate = page.body.estimates.find((e: { siteId: number }) => e.siteId === world.site.id);
    expect(page.body.assumptions.onSiteHours).toBe(2);
    expect(estimate.callOut.totalCents).toBe(row.callOut.totalCents - 2 * row.hourlyRateCents);
  });

  it("ignores a site that is not the caller's own and refuses a malformed one", async () => {
    const row = await firstRowNearSite(4);
    const other = await buildCompany("shop", []);
    const [foreign] = await sequelize().query<{ id: number }>(
      `INSERT INTO sites (company_id, name, address_line, postal_code, time_zone, latitude, longitude)
       VALUES ($1, 'Harrowgate Annex', '12 Quarry Lane', '60601', 'America/Chicago', 41.8858, -87.6181)
       RETURNING id`,
      { bind: [other.company.id], type: QueryTypes.SELECT },
    );

    const ignored = await buyer
      .get(`/api/directory/technicians/${row.technicianId}`)
      .query({ onSiteHours: 4, siteId: foreign!.id });
    const malformed = await buyer
      .get(`/api/directory/technicians/${row.technicianId}`)
      .query({ onSiteHours: 4, siteId: "north" });

    expect(ignored.status).toBe(200);
    expect(ignored.body.chosenSiteId).toBeNull();
    expect(ignored.body.estimates.map((e: { siteId: number }) => e.siteId)).not.toContain(foreign!.id);
    expect(malformed.status).toBe(400);
    expect(JSON.stringify(malformed.body)).toMatch(/siteId/);
  });
});
