import { afterAll, beforeAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import { QueryTypes } from "sequelize";
import { buildTestApp, sequelize, type TestApp } from "../../support/test-app.ts";
import { buildCompany } from "../../support/build-company.ts";
import { Technician } from "../../../server/technicians/model.ts";
import { routeRequest, type RoutingCriteria } from "../../../server/service-requests/index.ts";
import { bruteForceRouting, clearedNow, loadFacts } from "./brute-force-routing.ts";

let t: TestApp;
let setId: number;
beforeAll(async () => {
  t = buildTestApp();
  const shop = await buildCompany("shop", []);
  const [row] = await sequelize().query<{ id: number }>(
    "INSERT INTO requirement_sets (company_id, name, requirements) VALUES ($1, 'Plant 4 contractor rules', '[]') RETURNING id",
    { bind: [shop.company.id], type: QueryTypes.SELECT },
  );
  setId = row!.id;
});
afterAll(() => t.close());

// A region of its own (central Montana), away from the Chicago rows other tests create.
const CENTER = { latitude: 46.9, longitude: -110.4 };
const TECHNOLOGIES = ["mill", "lathe", "grinder"] as const;
const FAMILIES = ["K7", "S30", "QX"] as const;
const STANDINGS = ["cleared", "lapsing", "not_cleared", "missing"] as const;
const NOW = new Date();
const HOUR = 3_600_000;

const standingArb = fc.record({
  standing: fc.constantFrom(...STANDINGS),
  // Past lapse: stored before a lapse that has since happened (the daily job has not run yet).
  earliestLapse: fc.constantFrom(null, -2 * HOUR, 30 * 24 * HOUR),
});
const technicianArb = fc.record({
  active: fc.integer({ min: 0, max: 9 }).map((n) => n > 0),
  dLat: fc.double({ min: -2, max: 2, noNaN: true }),
  dLon: fc.double({ min: -2.5, max: 2.5, noNaN: true }),
  radiusKm: fc.integer({ min: 20, max: 400 }),
  technologies: fc.subarray([...TECHNOLOGIES], { minLength: 1 }),
  families: fc.subarray([...FAMILIES]),
  baseline: standingArb,
  set: standingArb,
});
const worldArb = fc.record({
  companies: fc.array(fc.array(technicianArb, { minLength: 1, maxLength: 3 }), {
    minLength: 1,
    maxLength: 5,
  }),
  site: fc.record({
    dLat: fc.double({ min: -1, max: 1, noNaN: true }),
    dLon: fc.double({ min: -1, max: 1, noNaN: true }),
  }),
  technology: fc.constantFrom(...TECHNOLOGIES),
  family: fc.option(fc.constantFrom(...FAMILIES, "k7"), { nil: null }),
  useSet: fc.boolean(),
  radiusKm: fc.option(fc.integer({ min: 30, max: 500 }), { nil: undefined }),
});

async function storeStanding(
  technicianId: number,
  set: number | null,
  s: { standing: string; earliestLapse: number | null },
) {
  if (s.standing === "missing") return;
  await sequelize().query(
    `INSERT INTO technician_standings (technician_id, requirement_set_id, standing, earliest_lapse, results, computed_at)
     VALUES ($1, $2, $3, $4, '[]'::jsonb, $5)`,
    {
      bind: [
        technicianId,
        set,
        s.standing,
        s.earliestLapse === null ? null : new Date(NOW.getTime() + s.earliestLapse),
        NOW,
      ],
    },
  );
}

describe("routing a service request", () => {
  it("invites exactly the companies a brute-force filter finds, never one without a cleared technician", async () => {
    await fc.assert(
      fc.asyncProperty(worldArb, async (world) => {
        for (const technicians of world.companies) {
          const { company } = await buildCompany("service", []);
          for (const spec of technicians) {
            const technician = await Technician.create({
              companyId: company.id,
              name: "Ilse Marrow",
              email: null,
              phone: null,
              technologies: spec.technologies,
              controlFamilies: spec.families,
              postalCode: "59457",
              latitude: CENTER.latitude + spec.dLat,
              longitude: CENTER.longitude + spec.dLon,
              serviceRadiusKm: spec.radiusKm,
              hourlyRateCents: 13_000,
              travelRateCents: 9_000,
              active: spec.active,
            });
            await storeStanding(technician.id, null, spec.baseline);
            await storeStanding(technician.id, setId, spec.set);
          }
        }
        const criteria: RoutingCriteria = {
          asOf: NOW,
          site: {
            latitude: CENTER.latitude + world.site.dLat,
            longitude: CENTER.longitude + world.site.dLon,
          },
          technology: world.technology,
          requirementSetId: world.useSet ? setId : null,
          controlFamily: world.family,
          radiusKm: world.radiusKm,
        };

        const routed = await routeRequest(criteria);
        const facts = await loadFacts();

        const invited = new Set(routed.map((c) => c.companyId));
        expect([...invited].sort((a, b) => a - b)).toEqual(
          [...bruteForceRouting(facts, criteria)].sort((a, b) => a - b),
        );
        for (const companyId of invited) {
          const cleared = facts.technicians.filter(
            (tech) =>
              tech.company_id === companyId && clearedNow(facts, tech, criteria.requirementSetId, NOW),
          );
          expect(cleared.length).toBeGreaterThan(0);
        }
      }),
      { numRuns: 30, seed: 20261203 },
    );
  }, 120_000);
});
