import { describe, expect, it } from "vitest";
import request from "supertest";
import { useTestApp } from "../../support/test-app.ts";
import { buildCompany } from "../../support/build-company.ts";
import { buildProvider, buildTechnician } from "../../fixtures/build-credential-row.ts";
import { Site } from "../../../server/sites/model.ts";
import { db } from "../../../server/db/sequelize.ts";
import { signIn } from "../standing/sign-in-as.ts";

const t = useTestApp();

const site = (companyId: number, name: string) =>
  Site.create({
    companyId,
    name,
    addressLine: "400 Sample Way",
    postalCode: "60601",
    timeZone: "America/Chicago",
    latitude: 41.8858,
    longitude: -87.6181,
  });

async function recordCheck(
  technician: { id: number; companyId: number },
  at: string,
  where: { id: number; companyId: number } | null,
  state = "cleared",
) {
  await db().query(
    `INSERT INTO gate_checks (technician_id, service_company_id, site_id, shop_company_id, state, checked_at)
     VALUES ($1, $2, $3, $4, $5, $6)`,
    { bind: [technician.id, technician.companyId, where?.id ?? null, where?.companyId ?? null, state, at] },
  );
}

async function world() {
  const p = await buildProvider();
  const second = await buildTechnician(p.company.id, "Wendeline Okafor-Brisk");
  const shop = await buildCompany("shop", ["buyer"]);
  const otherShop = await buildCompany("shop", ["buyer"]);
  const otherProvider = await buildProvider();
  const north = await site(shop.company.id, "North bay");
  const south = await site(shop.company.id, "South dock");
  const elsewhere = await site(otherShop.company.id, "Far yard");
  // 04:30 UTC on Mar 10 is 10:30 p.m. on Mar 9 in Chicago (CST, UTC-6; IANA time zone database).
  await recordCheck(p.technician, "2026-03-10T04:30:00Z", north);
  await recordCheck(second, "2026-03-11T15:00:00Z", south, "not_cleared");
  await recordCheck(p.technician, "2026-03-12T15:00:00Z", elsewhere);
  await recordCheck(otherProvider.technician, "2026-03-11T16:00:00Z", north);
  return { p, second, shop, otherShop, otherProvider, north, south, elsewhere };
}

describe("gate check log", () => {
  it("shows the office its own technicians' checks and the shop the checks at its own sites only", async () => {
    const w = await world();

    const office = await (await signIn(t.app, w.p.admin.email)).get("/api/gate/checks");
    const shop = await (await signIn(t.app, w.shop.users.buyer!.email)).get("/api/gate/checks");
    const otherShop = await (await signIn(t.app, w.otherShop.users.buyer!.email)).get("/api/gate/checks");
    const otherOffice = await (await signIn(t.app, w.otherProvider.admin.email)).get("/api/gate/checks");

    expect(office.status).toBe(200);
    expect(office.body.checks.map((c: { siteName: string }) => c.siteName)).toEqual([
      "Far yard",
      "South dock",
      "North bay",
    ]);
    expect(office.body.checks[0]).toMatchObject({ shopName: w.otherShop.company.name, state: "cleared" });
    expect(office.body.technicians.map((x: { name: string }) => x.name)).toContain("Wendeline Okafor-Brisk");
    expect(shop.body.checks.map((c: { technicianName: string }) => c.technicianName).sort()).toEqual(
      [w.otherProvider.technician.name, w.second.name, w.p.technician.name].sort(),
    );
    expect(shop.body.checks.every((c: { siteName: string }) => c.siteName !== "Far yard")).toBe(true);
    expect(shop.body.sites.map((s: { name: string }) => s.name)).toEqual(["North bay", "South dock"]);
    expect(otherShop.body.checks.map((c: { siteName: string }) => c.siteName)).toEqual(["Far yard"]);
    expect(otherOffice.body.checks).toHaveLength(1);
    expect(otherOffice.body.checks[0].technicianName).toBe(w.otherProvider.technician.name);
  });

  it("finds nothing of another shop's when filtering by that shop's site or technician", async () => {
    const w = await world();
    const otherShop = await signIn(t.app, w.otherShop.users.buyer!.email);

    const bySite = await otherShop.get("/api/gate/checks").query({ siteId: w.north.id });
    const byTechnician = await otherShop.get("/api/gate/checks").query({ technicianId: w.second.id });

    expect(bySite.body.checks).toEqual([]);
    expect(byTechnician.body.checks).toEqual([]);
    expect(bySite.body.sites.map((s: { name: string }) => s.name)).toEqual(["Far yard"]);
  });

  it("reads a day filter in the reader's zone, not in UTC", async () => {
    const w = await world();
    const office = await signIn(t.app, w.p.admin.email);

    const chicago = await office
      .get("/api/gate/checks")
      .query({ from: "2026-03-09", to: "2026-03-09", timeZone: "America/Chicago" });
    const utc = await office
      .get("/api/gate/checks")
      .query({ from: "2026-03-09", to: "2026-03-09", timeZone: "UTC" });
    const utcNext = await office
      .get("/api/gate/checks")
      .query({ from: "2026-03-10", to: "2026-03-10", timeZone: "UTC" });

    expect(chicago.body.timeZone).toBe("America/Chicago");
    expect(chicago.body.checks.map((c: { checkedAt: string }) => c.checkedAt)).toEqual([
      "2026-03-10T04:30:00.000Z",
    ]);
    expect(utc.body.checks).toEqual([]);
    expect(utcNext.body.checks).toHaveLength(1);
  });

  it("narrows by site and by technician", async () => {
    const w = await world();
    const shop = await signIn(t.app, w.shop.users.buyer!.email);
    const office = await signIn(t.app, w.p.admin.email);

    const south = await shop.get("/api/gate/checks").query({ siteId: w.south.id });
    const second = await office.get("/api/gate/checks").query({ technicianId: w.second.id });
    const range = await office
      .get("/api/gate/checks")
      .query({ from: "2026-03-11", to: "2026-03-12", timeZone: "America/Chicago" });

    expect(south.body.checks).toEqual([
      expect.objectContaining({ technicianName: w.second.name, state: "not_cleared" }),
    ]);
    expect(second.body.checks).toHaveLength(1);
    expect(second.body.checks[0].siteName).toBe("South dock");
    expect(range.body.checks.map((c: { siteName: string }) => c.siteName)).toEqual([
      "Far yard",
      "South dock",
    ]);
  });

  it("refuses an unknown zone and a range that ends before it starts, naming the field", async () => {
    const w = await world();
    const office = await signIn(t.app, w.p.admin.email);

    const zone = await office.get("/api/gate/checks").query({ timeZone: "Mars/Olympus" });
    const range = await office.get("/api/gate/checks").query({ from: "2026-03-12", to: "2026-03-11" });

    expect(zone.status).toBe(400);
    expect(zone.body.error.fields[0].path).toBe("query.timeZone");
    expect(range.status).toBe(400);
    expect(range.body.error.fields[0].path).toBe("query.from");
  });

  it("is closed to visitors and to technicians", async () => {
    const w = await world();

    const anonymous = await request(t.app).get("/api/gate/checks");
    const technician = await (await signIn(t.app, w.p.technicianUser.email)).get("/api/gate/checks");

    expect(anonymous.status).toBe(401);
    expect(technician.status).toBe(403);
  });
});
