import { describe, expect, it } from "vitest";
import request from "supertest";
import { useTestApp } from "../../support/test-app.ts";
import { buildCompany } from "../../support/build-company.ts";
import { buildClearedProvider, buildProvider } from "../../fixtures/build-credential-row.ts";
import { runLapseJob } from "../../../jobs/lapse.ts";
import { JOB_DEPS } from "../../jobs/job-support.ts";
import { Site } from "../../../server/sites/model.ts";
import { RequirementSet } from "../../../server/standing/model.ts";
import type { Requirement } from "../../../shared/standing/requirements.ts";
import { gateSecret } from "../../../server/config.ts";
import { issueBadgeToken } from "../../../server/gate/token.ts";
import { signIn } from "../standing/sign-in-as.ts";
import { readQr } from "../../support/read-qr.ts";

const t = useTestApp();

function pathOf(url: string): string {
  const u = new URL(url);
  return `/api${u.pathname}${u.search}`;
}

describe("gate check", () => {
  it("decodes the badge QR to a check that shows cleared before the lapse and not cleared after the job runs past it", async () => {
    const p = await buildClearedProvider({ glExpires: "2099-07-15", wcExpires: "2099-07-15" });
    const technician = await signIn(t.app, p.technicianUser.email);

    const badge = await technician.get("/api/badge");
    expect(badge.status).toBe(200);
    const url = await readQr(badge.body.qrPng);
    expect(url).toBe(badge.body.url);

    const before = await request(t.app).get(pathOf(url));
    expect(before.status).toBe(200);
    expect(before.body).toMatchObject({
      state: "cleared",
      technician: { name: p.technician.name, company: p.company.name },
      against: "Platform baseline",
    });
    expect(before.body.lines.length).toBeGreaterThan(0);
    expect(before.body.lines.every((l: { status: string }) => l.status === "met")).toBe(true);
    expect(Date.parse(before.body.checkedAt)).toBeGreaterThan(Date.now() - 60_000);

    // The lapse job stores standings as of a run past the policies' end.
    await runLapseJob({ asOf: new Date("2099-08-01T12:00:00Z") }, JOB_DEPS);

    const after = await request(t.app).get(pathOf(url));
    expect(after.status).toBe(200);
    expect(after.body.state).toBe("not_cleared");
    expect(after.body.lines.some((l: { status: string }) => l.status !== "met")).toBe(true);
  });

  it("answers expired for a code older than its lifetime and invalid for a forged one", async () => {
    const p = await buildClearedProvider({ glExpires: "2099-07-15", wcExpires: "2099-07-15" });
    const secret = gateSecret(t.config);
    const yesterday = issueBadgeToken(secret, p.technician.id, new Date(Date.now() - 24 * 3_600_000));
    const forged = issueBadgeToken("not-the-server-secret-at-all-000000", p.technician.id);

    const old = await request(t.app).get("/api/gate/check").query({ token: yesterday });
    const fake = await request(t.app).get("/api/gate/check").query({ token: forged });

    expect(old.status).toBe(200);
    expect(old.body).toEqual({ state: "expired", checkedAt: expect.any(String) });
    expect(fake.body).toEqual({ state: "invalid", checkedAt: expect.any(String) });
  });

  it("reveals only name, company and standing lines, nothing about other shops or contact details", async () => {
    const p = await buildClearedProvider({ glExpires: "2099-07-15", wcExpires: "2099-07-15" });
    const badge = await (await signIn(t.app, p.technicianUser.email)).get("/api/badge");

    const res = await request(t.app).get(pathOf(badge.body.url));

    expect(Object.keys(res.body).sort()).toEqual(
      ["against", "checkedAt", "lines", "site", "state", "technician", "workOrder"].sort(),
    );
    expect(Object.keys(res.body.technician).sort()).toEqual(["company", "name"]);
    expect(res.body.lines.every((l: object) => Object.keys(l).sort().join() === "requirement,status")).toBe(
      true,
    );
  });

  it("records each check for the technician's company and the site's shop, not for another shop", async () => {
    const p = await buildClearedProvider({ glExpires: "2099-07-15", wcExpires: "2099-07-15" });
    const shop = await buildCompany("shop", ["buyer"]);
    const otherShop = await buildCompany("shop", ["buyer"]);
    const site = await Site.create({
      companyId: shop.company.id,
      name: "South dock",
      addressLine: "200 Sample Way",
      postalCode: "60601",
      timeZone: "America/Chicago",
      latitude: 41.8858,
      longitude: -87.6181,
    });
    const sign = await (await signIn(t.app, shop.users.buyer!.email)).get(`/api/sites/${site.id}/gate-sign`);
    const badge = await (
      await signIn(t.app, p.technicianUser.email)
    )
      .get("/api/badge")
      .query({ site: sign.body.code });
    await request(t.app).get(pathOf(badge.body.url)).expect(200);

    const office = await (await signIn(t.app, p.admin.email)).get("/api/gate/checks");
    const theShop = await (await signIn(t.app, shop.users.buyer!.email)).get("/api/gate/checks");
    const another = await (await signIn(t.app, otherShop.users.buyer!.email)).get("/api/gate/checks");

    const expected = { technicianName: p.technician.name, siteName: "South dock", state: "cleared" };
    expect(office.body.checks).toEqual([expect.objectContaining(expected)]);
    expect(theShop.body.checks).toEqual([expect.objectContaining(expected)]);
    expect(another.body.checks).toEqual([]);
  });

  it("ties a scan to a site only through the code on that site's gate sign", async () => {
    const p = await buildClearedProvider({ glExpires: "2099-07-15", wcExpires: "2099-07-15" });
    const shop = await buildCompany("shop", ["buyer"]);
    const otherShop = await buildCompany("shop", ["buyer"]);
    const site = await Site.create({
      companyId: shop.company.id,
      name: "North bay",
      addressLine: "100 Sample Way",
      postalCode: "60601",
      timeZone: "America/Chicago",
      latitude: 41.8858,
      longitude: -87.6181,
    });

    const sign = await (await signIn(t.app, shop.users.buyer!.email)).get(`/api/sites/${site.id}/gate-sign`);
    const foreign = await (
      await signIn(t.app, otherShop.users.buyer!.email)
    ).get(`/api/sites/${site.id}/gate-sign`);
    expect(sign.status).toBe(200);
    expect(foreign.status).toBe(404);
    expect(await readQr(sign.body.qrPng)).toBe(sign.body.badgeUrl);

    const badge = await (
      await signIn(t.app, p.technicianUser.email)
    )
      .get("/api/badge")
      .query({ site: sign.body.code });
    const res = await request(t.app).get(pathOf(badge.body.url));
    expect(res.body.site).toEqual({ name: "North bay" });

    const madeUp = `${site.id}-AAAAAAAAAA`;
    const guessed = await request(t.app)
      .get("/api/gate/check")
      .query({ token: new URL(badge.body.url).searchParams.get("token"), site: madeUp });
    expect(guessed.body.site).toBeNull();
  });

  it("checks against the site's own set, computing it when no standing is stored for it yet", async () => {
    const p = await buildClearedProvider({ glExpires: "2099-07-15", wcExpires: "2099-07-15" });
    const shop = await buildCompany("shop", ["buyer"]);
    const site = await Site.create({
      companyId: shop.company.id,
      name: "Press line",
      addressLine: "300 Sample Way",
      postalCode: "60601",
      timeZone: "America/Chicago",
      latitude: 41.8858,
      longitude: -87.6181,
    });
    // Written straight to the table, so no refresh has stored a standing against it: the check must compute one.
    await RequirementSet.create({
      companyId: shop.company.id,
      siteId: site.id,
      name: "Press line entry",
      requirements: [{ label: "Arc-flash training", typeCodes: ["arc_flash"] }] as unknown as Requirement[],
    });
    const buyerAgent = await signIn(t.app, shop.users.buyer!.email);
    const sign = await buyerAgent.get(`/api/sites/${site.id}/gate-sign`);
    const badge = await (
      await signIn(t.app, p.technicianUser.email)
    )
      .get("/api/badge")
      .query({ site: sign.body.code });

    const atSite = await request(t.app).get(pathOf(badge.body.url));
    const token = new URL(badge.body.url).searchParams.get("token");
    const noSite = await request(t.app).get("/api/gate/check").query({ token });

    // Cleared for the baseline, but without the arc-flash card the site's own set is not met (common practice: a requirement with no credential on file is unmet).
    expect(atSite.body).toMatchObject({
      state: "not_cleared",
      against: "Press line entry",
      site: { name: "Press line" },
    });
    expect(atSite.body.lines).toEqual([
      { requirement: "Arc-flash training", status: expect.not.stringMatching(/^met$/) },
    ]);
    expect(noSite.body).toMatchObject({ state: "cleared", against: "Platform baseline", site: null });
    const log = await buyerAgent.get("/api/gate/checks");
    expect(log.body.checks).toEqual([
      expect.objectContaining({ siteName: "Press line", state: "not_cleared" }),
    ]);
  });

  it("shows the badge to the technician only", async () => {
    const p = await buildProvider();

    const admin = await (await signIn(t.app, p.admin.email)).get("/api/badge");
    const anonymous = await request(t.app).get("/api/badge");

    expect(admin.status).toBe(403);
    expect(anonymous.status).toBe(401);
  });
});
