import { describe, expect, it } from "vitest";
import request from "supertest";
import { useTestApp, signedInAs } from "../../support/test-app.ts";
import { buildCompany } from "../../support/build-company.ts";
import { useDirectoryWorld } from "../../support/directory-suite.ts";
import { greatCircleDistanceKm } from "../../../shared/geo/great-circle-distance.ts";
import { milesToKm } from "../../../shared/geo/units.ts";
import { bayesianAverage } from "../../../shared/ranking/rating-score.ts";
import { Equipment } from "../../../server/sites/model.ts";
import { bruteForceDirectory, toQuery } from "./brute-force-directory.ts";
import { readAllPages } from "./directory-pages.ts";

const t = useTestApp();
const { world, buyer } = useDirectoryWorld(t, { seed: 7 });

const ours = (ids: number[]) => {
  const world_ = new Set(world.technicians.map((x) => x.id));
  return ids.filter((id) => world_.has(id)).sort((a, b) => a - b);
};

describe("directory: who appears", () => {
  it("lists only active technicians whose stored baseline standing is cleared or lapsing", async () => {
    const { rows } = await readAllPages(buyer, { limit: "50" });

    const expected = world.technicians
      .filter((x) => x.active && (x.baseline === "cleared" || x.baseline === "lapsing"))
      .map((x) => x.id);
    expect(ours(rows.map((r) => r.technicianId))).toEqual(expected.sort((a, b) => a - b));
    expect(rows.every((r) => r.standing === "cleared" || r.standing === "lapsing")).toBe(true);
  });

  it("honours the technician's service radius and the buyer's radius together", async () => {
    const radiusMiles = 125;
    const radiusKm = milesToKm(radiusMiles);

    const { rows } = await readAllPages(buyer, {
      siteId: String(world.site.id),
      radiusMiles: String(radiusMiles),
    });

    const site = { lat: world.site.latitude, lon: world.site.longitude };
    for (const row of rows) {
      const tech = world.technicians.find((x) => x.id === row.technicianId);
      if (!tech) continue; // another test file's world near the same site
      expect(row.distanceKm!).toBeLessThanOrEqual(Math.min(tech.serviceRadiusKm, radiusKm) + 0.01);
    }
    const outsideOwnRadius = world.technicians.filter((x) => {
      const km = greatCircleDistanceKm(site, { lat: x.latitude, lon: x.longitude });
      return km <= radiusKm && km > x.serviceRadiusKm;
    });
    expect(outsideOwnRadius.length).toBeGreaterThan(0);
    expect(rows.some((r) => outsideOwnRadius.some((x) => x.id === r.technicianId))).toBe(false);
    expect(ours(rows.map((r) => r.technicianId))).toEqual(
      bruteForceDirectory(world, { radiusMiles }, new Date()),
    );
  });

  it("applies the default 100-mile radius when a site is chosen without one", async () => {
    const { rows } = await readAllPages(buyer, { siteId: String(world.site.id) });

    expect(ours(rows.map((r) => r.technicianId))).toEqual(
      bruteForceDirectory(world, { radiusMiles: 100 }, new Date()),
    );
  });

  it.each([
    ["credentialTypes", { credentialTypes: ["arc_flash"] }],
    ["oemBuilder", { oemBuilder: "aldenmark" }],
    ["controlFamily", { controlFamily: "K7" }],
    ["minOemLevel", { minOemLevel: 2 }],
    ["technology", { technology: "lathe" }],
    ["minEachOccurrence", { minEachOccurrence: 1_000_000 }],
    ["minAggregate", { minAggregate: 2_000_000 }],
    ["minAutoCsl", { minAutoCsl: 1_000_000 }],
    ["requirementSetId", { requirementSet: true }],
    ["minRating", { minRating: 3.5 }],
    ["q", { q: "AN" }],
  ] as const)("filters by %s exactly as the plain rule says", async (_name, filters) => {
    const { rows } = await readAllPages(buyer, toQuery(world, filters));

    const expected = bruteForceDirectory(world, filters, new Date());
    expect(ours(rows.map((r) => r.technicianId))).toEqual(expected);
    // The seeded world makes each filter keep some technicians and drop others, so the check can fail either way.
    expect(expected.length).toBeGreaterThan(0);
    expect(expected.length).toBeLessThan(bruteForceDirectory(world, {}, new Date()).length);
  });

  it("fills technology, control family and builder from a machine at the shop's site", async () => {
    const machine = await Equipment.create({
      siteId: world.site.id,
      builder: "Brisca",
      controlFamily: "QX",
      technology: "mill",
      model: "B-20",
      serialNumber: null,
    });

    const res = await buyer.get("/api/directory").query({ equipmentId: machine.id, limit: 50 });

    expect(res.status).toBe(200);
    expect(res.body.fromEquipment).toEqual({ technology: "mill", controlFamily: "QX", builder: "Brisca" });
    const expected = bruteForceDirectory(
      world,
      { technology: "mill", controlFamily: "QX", oemBuilder: "Brisca" },
      new Date(),
    );
    expect(ours(res.body.rows.map((r: { technicianId: number }) => r.technicianId))).toEqual(expected);
  });
});

describe("directory: rows", () => {
  it("carries distance in km and miles, drive time, the call-out estimate and the rating with its score", async () => {
    const res = await buyer
      .get("/api/directory")
      .query({ siteId: world.site.id, radiusMiles: 250, onSiteHours: 3, limit: 50 });

    expect(res.status).toBe(200);
    const row = res.body.rows.find((r: { technicianId: number }) =>
      world.technicians.some((x) => x.id === r.technicianId),
    );
    const tech = world.technicians.find((x) => x.id === row.technicianId)!;
    const km = greatCircleDistanceKm(
      { lat: world.site.latitude, lon: world.site.longitude },
      { lat: tech.latitude, lon: tech.longitude },
    );
    expect(row.distanceKm).toBeCloseTo(km, 1);
    expect(row.distanceMiles).toBeCloseTo(km / 1.609344, 1);
    expect(row.driveHours).toBeGreaterThan(0);
    expect(row.callOut.labourCents).toBe(3 * tech.hourlyRateCents);
    expect(row.callOut.totalCents).toBe(
      row.callOut.travelCents + row.callOut.labourCents + row.callOut.mileageCents,
    );
    expect(row.rating.count).toBe(tech.ratingCount);
    expect(row.rating.score).toBeCloseTo(
      bayesianAverage({ count: tech.ratingCount, sumStars: tech.starSum }),
      4,
    );
    expect(res.body.scoreSource).toMatch(/Bayesian average/);
  });

  it("names the filter that removed the most candidates when nothing matches", async () => {
    const res = await buyer.get("/api/directory").query({ q: `nobody-${world.tag}`, technology: "mill" });

    expect(res.status).toBe(200);
    expect(res.body.rows).toEqual([]);
    expect(res.body.emptyReason.filter).toBe("q");
    expect(res.body.emptyReason.removed).toBeGreaterThan(0);
  });

  it("names the only filter when a single filter empties the list", async () => {
    const res = await buyer.get("/api/directory").query({ q: `nobody-${world.tag}` });

    expect(res.status).toBe(200);
    expect(res.body.emptyReason).toEqual({ filter: "q", removed: expect.any(Number) });
  });
});

describe("directory: sorting and pages", () => {
  it.each([
    ["distance", (r: { distanceKm: number }) => r.distanceKm, 1],
    ["score", (r: { rating: { score: number } }) => r.rating.score, -1],
    ["hourlyRate", (r: { hourlyRateCents: number }) => r.hourlyRateCents, 1],
    [
      "soonestLapse",
      (r: { earliestLapse: string | null }) =>
        r.earliestLapse ? Date.parse(r.earliestLapse) : Number.MAX_SAFE_INTEGER,
      1,
    ],
  ] as const)("sorts by %s across pages", async (sort, key, direction) => {
    const { rows } = await readAllPages(buyer, {
      siteId: String(world.site.id),
      radiusMiles: "250",
      sort,
      limit: "4",
    });

    const values = rows.map((r) => key(r as never) * direction);
    expect(values).toEqual([...values].sort((a, b) => a - b));
  });

  it("pages by cursor without duplicates or gaps, whatever the page size", async () => {
    const query = { siteId: String(world.site.id), radiusMiles: "250", sort: "score" };
    const { rows: whole } = await readAllPages(buyer, { ...query, limit: "50" });

    for (const limit of ["1", "3", "7"]) {
      const { rows, pages } = await readAllPages(buyer, { ...query, limit });

      expect(rows.map((r) => r.technicianId)).toEqual(whole.map((r) => r.technicianId));
      expect(new Set(rows.map((r) => r.technicianId)).size).toBe(rows.length);
      expect(pages.slice(0, -1).every((p) => p.rows.length === Number(limit))).toBe(true);
    }
  });

  it("refuses a cursor from another sort order", async () => {
    const first = await buyer.get("/api/directory").query({ sort: "hourlyRate", limit: 1 });

    const res = await buyer.get("/api/directory").query({ sort: "score", cursor: first.body.nextCursor });

    expect(res.status).toBe(400);
    expect(res.body.error.fields[0].path).toBe("query.cursor");
  });

  it("refuses a limit above 50 and sorting by distance without a site, naming the parameter", async () => {
    const tooMany = await buyer.get("/api/directory").query({ limit: 51 });
    const noSite = await buyer.get("/api/directory").query({ sort: "distance" });

    expect(tooMany.status).toBe(400);
    expect(tooMany.body.error.fields[0].path).toBe("query.limit");
    expect(noSite.status).toBe(400);
    expect(noSite.body.error.fields[0].path).toBe("query.sort");
  });
});

describe("directory: access", () => {
  it("answers 401 when signed out", async () => {
    const res = await request(t.app).get("/api/directory");

    expect(res.status).toBe(401);
  });

  it("answers 403 to a service company's admin", async () => {
    const { users } = await buildCompany("service", ["provider_admin"]);
    const agent = await signedInAs(t.app, users.provider_admin!.email);

    const res = await agent.get("/api/directory");

    expect(res.status).toBe(403);
  });

  it("answers 404 for another shop's site or requirement set", async () => {
    const { users } = await buildCompany("shop", ["buyer"]);
    const other = await signedInAs(t.app, users.buyer!.email);

    const site = await other.get("/api/directory").query({ siteId: world.site.id });
    const set = await other.get("/api/directory").query({ requirementSetId: world.requirementSetId });

    expect(site.status).toBe(404);
    expect(set.status).toBe(404);
  });
});
