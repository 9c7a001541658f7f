import { describe, expect, it } from "vitest";
import { useTestApp } from "../../support/test-app.ts";
import { useDirectoryWorld } from "../../support/directory-suite.ts";
import { readAllPages } from "./directory-pages.ts";

const t = useTestApp();
const { world, buyer } = useDirectoryWorld(t, { seed: 23 });

const passes = (s: string | null) => s === "cleared" || s === "lapsing";

// Common practice: a shop judges a contractor against its own site rules, not only the platform's minimum.
describe("directory: the chosen site's requirement set is the default", () => {
  it("judges by the site's set when a site is chosen and no set was asked for, and says so", async () => {
    const { rows, pages } = await readAllPages(buyer, {
      siteId: String(world.site.id),
      radiusMiles: "500",
      limit: "50",
    });
    expect(pages[0]!.judgedAgainst).toMatchObject({
      kind: "requirement_set",
      requirementSetId: world.requirementSetId,
      fromSite: true,
    });
    const listed = new Set(rows.map((r) => r.technicianId));
    // Someone who passes the baseline but not the site's set is no longer listed.
    const baselineOnly = world.technicians.filter(
      (x) => x.active && passes(x.baseline) && !passes(x.setStanding),
    );
    expect(baselineOnly.length).toBeGreaterThan(0);
    for (const x of baselineOnly) expect(listed.has(x.id)).toBe(false);
    // Every row carries the set's standing, which is what the badge shows.
    for (const r of rows) {
      const tech = world.technicians.find((x) => x.id === r.technicianId)!;
      expect(r.standing).toBe(tech.setStanding);
    }
  });

  it("says baseline only when neither a site with a set nor a set was chosen", async () => {
    const res = await buyer.get("/api/directory").query({ limit: "5" }).expect(200);
    expect(res.body.judgedAgainst).toEqual({ kind: "baseline" });
  });

  it("an explicitly asked set is named and not marked as the site's", async () => {
    const res = await buyer
      .get("/api/directory")
      .query({ requirementSetId: String(world.requirementSetId), limit: "5" })
      .expect(200);
    expect(res.body.judgedAgainst).toMatchObject({ kind: "requirement_set", fromSite: false });
  });
});
