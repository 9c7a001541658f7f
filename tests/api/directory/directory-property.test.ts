import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { useTestApp } from "../../support/test-app.ts";
import {
  WORLD_BUILDERS,
  WORLD_CONTROL_FAMILIES,
  WORLD_TECHNOLOGIES,
} from "../../fixtures/build-directory-world.ts";
import { useDirectoryWorld } from "../../support/directory-suite.ts";
import { bruteForceDirectory, toQuery, type DrawnFilters } from "./brute-force-directory.ts";
import { readAllPages } from "./directory-pages.ts";

const t = useTestApp();
const { world, buyer } = useDirectoryWorld(t, { seed: 11, count: 30 });

const filterValues = {
  credentialTypes: fc.subarray(["arc_flash", "lockout_tagout", "general_liability", "auto_liability"], {
    minLength: 1,
    maxLength: 2,
  }),
  oemBuilder: fc.constantFrom(...WORLD_BUILDERS),
  controlFamily: fc.constantFrom(...WORLD_CONTROL_FAMILIES),
  minOemLevel: fc.integer({ min: 1, max: 3 }),
  technology: fc.constantFrom(...WORLD_TECHNOLOGIES),
  minEachOccurrence: fc.constantFrom(500_000, 1_000_000, 1_500_000, 2_000_000),
  minAggregate: fc.constantFrom(1_000_000, 2_000_000, 3_000_000),
  minAutoCsl: fc.constantFrom(500_000, 1_000_000),
  requirementSet: fc.constant(true),
  radiusMiles: fc.integer({ min: 12, max: 280 }),
  minRating: fc.double({ min: 1, max: 5, noNaN: true }).map((x) => Math.round(x * 10) / 10),
  q: fc.constantFrom("a", "el", "Field", "son", "zz"),
};
type FilterKey = keyof typeof filterValues;

// One to three filters at a time: with all twelve at once nearly every search would be empty and prove little.
const drawnFilters: fc.Arbitrary<DrawnFilters> = fc
  .subarray(Object.keys(filterValues) as FilterKey[], { minLength: 1, maxLength: 3 })
  .chain((keys) =>
    fc.record(
      Object.fromEntries(keys.map((k) => [k, filterValues[k]])) as Record<string, fc.Arbitrary<unknown>>,
    ),
  )
  .map((f) => f as DrawnFilters);

describe("directory search (property)", () => {
  it("returns, over all pages, exactly the technicians a plain filter over the same rows keeps", async () => {
    let nonEmpty = 0;

    await fc.assert(
      fc.asyncProperty(
        drawnFilters,
        fc.constantFrom("score", "hourlyRate", "soonestLapse"),
        fc.integer({ min: 1, max: 6 }),
        async (filters, sort, limit) => {
          const { rows } = await readAllPages(buyer, {
            ...toQuery(world, filters),
            sort,
            limit: String(limit),
          });

          const ids = rows.map((r) => r.technicianId);
          const inWorld = new Set(world.technicians.map((x) => x.id));
          expect(new Set(ids).size).toBe(ids.length);
          const expected = bruteForceDirectory(world, filters, new Date());
          if (expected.length > 0) nonEmpty += 1;
          expect(ids.filter((id) => inWorld.has(id)).sort((a, b) => a - b)).toEqual(expected);
        },
      ),
      { numRuns: 25, seed: 20261202 },
    );

    // Most draws must keep someone, or the comparison would mostly be of two empty lists.
    expect(nonEmpty).toBeGreaterThanOrEqual(12);
  });
});
