import { describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { signIn } from "../support/browser.ts";
import { seriousAccessibilityProblems } from "../support/axe.ts";
import { DEMO_PASSWORD } from "../../server/db/demo-scenario/index.ts";

const suite = useBrowserSuite();

// The main pages of each role, with a heading to wait for; the journeys cover the pages that need data first.
const pagesByRole: { who: string; email: string | null; pages: string[] }[] = [
  {
    who: "signed out",
    email: null,
    pages: [
      "/sign-in",
      "/sign-up",
      "/forgot-password",
      "/gate/check?token=1.abc.not-signed",
      "/broker-upload/no-such-link",
    ],
  },
  {
    who: "provider_admin",
    email: "office@kestrel-ridge.test",
    pages: [
      "/provider",
      "/provider/technicians",
      "/provider/technicians/new",
      "/provider/technicians/import",
      "/provider/documents",
      "/provider/work-orders",
      "/account",
      "/company",
      "/provider/gate-checks",
      "/provider/brokers",
    ],
  },
  {
    who: "technician",
    email: "tobias@kestrel-ridge.test",
    pages: ["/technician", "/technician/upload-card", "/badge"],
  },
  { who: "reviewer", email: "reviewer@clearbench.test", pages: ["/review"] },
  {
    who: "buyer",
    email: "buyer@marlow-precision.test",
    pages: [
      "/directory",
      "/roster",
      "/sites",
      "/requirement-sets",
      "/work-orders",
      "/company",
      "/machine-transfers",
      "/machines/import",
      "/machines",
      "/gate-checks",
    ],
  },
  { who: "buyer with a site", email: "buyer@tamsin-gear.test", pages: ["/sites/:firstSiteId/gate-sign"] },
  {
    who: "admin",
    email: "admin@clearbench.test",
    pages: [
      "/admin/users",
      "/admin/catalog",
      "/admin/outbox",
      "/admin/baseline",
      "/admin/job-runs",
      "/admin/reviews",
    ],
  },
];

// Pages of one record take the signed-in shop's first site, whatever id the seed gave it.
const firstSiteId = async (page: Page): Promise<number> => {
  const sites = await page.evaluate(async () => (await fetch("/api/sites")).json());
  const id = (sites as { id: number }[])[0]?.id;
  if (!id) throw new Error("The demo shop has no site to open");
  return id;
};

describe("accessibility of every main page (axe-core, WCAG 2 A and AA)", () => {
  it.each(pagesByRole)(
    "has no serious or critical violation on the $who pages",
    async ({ email, pages }) => {
      const context = await suite.newContext({ viewport: { width: 1280, height: 800 } });
      const page = await context.newPage();
      if (email) await signIn(page, suite.url, email, DEMO_PASSWORD);
      const problems: string[] = [];

      for (const pattern of pages) {
        const path = pattern.includes(":firstSiteId")
          ? pattern.replace(":firstSiteId", String(await firstSiteId(page)))
          : pattern;
        await page.goto(`${suite.url}${path}`);
        await page.getByRole("heading", { level: 1 }).first().waitFor();
        await page.waitForLoadState("networkidle");
        problems.push(...(await seriousAccessibilityProblems(page)).map((p) => `${path}: ${p}`));
      }
      await context.close();

      expect(problems).toEqual([]);
      // A role's page list grows with the product; many pages on a shared machine outlast the default 30 s.
    },
    120_000,
  );
});
