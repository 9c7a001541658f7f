import { describe, expect, it } from "vitest";
import type { BrowserContext, Page } from "playwright-core";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot, signIn } from "../support/browser.ts";
import { seriousAccessibilityProblems } from "../support/axe.ts";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../shared/api/error-body.ts";
import { DEMO_PASSWORD } from "../../server/db/demo-scenario/index.ts";

const suite = useBrowserSuite();

const OFFICE = "office@kestrel-ridge.test";
const TECHNICIAN = "tobias@kestrel-ridge.test";
const SHOP = "buyer@tamsin-gear.test";
const viewports = [
  { name: "desktop", width: 1280, height: 800 },
  { name: "phone", width: 390, height: 844 },
];
const writes = { headers: { [CSRF_HEADER]: CSRF_HEADER_VALUE } };

async function signedIn(
  email: string,
  viewport = viewports[0]!,
): Promise<{ context: BrowserContext; page: Page }> {
  const context = await suite.newContext({ viewport: { width: viewport.width, height: viewport.height } });
  const page = await context.newPage();
  await signIn(page, suite.url, email, DEMO_PASSWORD);
  return { context, page };
}

/** The page fits the screen (nothing scrolls sideways) and axe finds no serious WCAG 2 A/AA problem. */
async function expectFitsAndAccessible(page: Page) {
  const widths = await page.evaluate(() => ({
    scroll: document.documentElement.scrollWidth,
    inner: window.innerWidth,
  }));
  expect(widths.scroll).toBeLessThanOrEqual(widths.inner);
  expect(await seriousAccessibilityProblems(page)).toEqual([]);
}

describe("gate check log, shop certificate requests and the office's broker screen", () => {
  it("shows a scan at the shop's site to the office and to the shop, filtered by site, at desktop and phone width", async () => {
    // A real scan: the shop's sign code, the technician's badge, the public check.
    const shop = await signedIn(SHOP);
    const sites = (await (await shop.page.request.get(`${suite.url}/api/sites`)).json()) as {
      id: number;
      name: string;
    }[];
    const site = sites[0]!;
    const sign = await (await shop.page.request.get(`${suite.url}/api/sites/${site.id}/gate-sign`)).json();
    const tech = await signedIn(TECHNICIAN);
    const badge = await (
      await tech.page.request.get(`${suite.url}/api/badge?site=${encodeURIComponent(sign.code)}`)
    ).json();
    const checkUrl = new URL(badge.url);
    const check = await tech.page.request.get(`${suite.url}/api${checkUrl.pathname}${checkUrl.search}`);
    expect(check.status()).toBe(200);
    const technicianName = (await check.json()).technician.name as string;
    await tech.context.close();
    await shop.context.close();

    for (const viewport of viewports) {
      const office = await signedIn(OFFICE, viewport);
      await office.page.goto(`${suite.url}/provider/gate-checks`);
      await office.page.getByRole("heading", { level: 1, name: "Gate checks" }).waitFor();
      const officeTable = office.page.getByRole("table", { name: "Gate checks, newest first" });
      await officeTable.getByRole("cell", { name: technicianName }).first().waitFor();
      await expect(officeTable.getByRole("cell", { name: site.name }).count()).resolves.toBeGreaterThan(0);
      await expectFitsAndAccessible(office.page);
      await screenshot(office.page, `gate-log-office-${viewport.name}`);
      await office.context.close();

      const theShop = await signedIn(SHOP, viewport);
      await theShop.page.goto(`${suite.url}/gate-checks`);
      const shopTable = theShop.page.getByRole("table", { name: "Gate checks, newest first" });
      await shopTable.getByRole("cell", { name: technicianName }).first().waitFor();
      await theShop.page.getByLabel("Site").selectOption(String(site.id));
      await theShop.page.waitForURL((u) => u.searchParams.get("siteId") === String(site.id));
      await shopTable.getByRole("cell", { name: site.name }).first().waitFor();
      // A day long past holds no check: the day filter narrows the log.
      await theShop.page.getByLabel("From").fill("2020-01-01");
      await theShop.page.getByLabel("To").fill("2020-01-02");
      await theShop.page.getByText("No gate checks").waitFor();
      await expectFitsAndAccessible(theShop.page);
      await screenshot(theShop.page, `gate-log-shop-${viewport.name}`);
      await theShop.context.close();
    }
  }, 120_000);

  it("lets the office record a coverage's broker, the shop ask it for a certificate, and both follow the request", async () => {
    const office = await signedIn(OFFICE);
    const company = await (await office.page.request.get(`${suite.url}/api/company`)).json();
    const shop = await signedIn(SHOP);
    const rostered = await shop.page.request.post(`${suite.url}/api/roster`, {
      ...writes,
      data: { serviceCompanyId: company.id },
    });
    expect(rostered.status()).toBeLessThan(300);

    await office.page.goto(`${suite.url}/provider/brokers`);
    const liability = office.page.getByRole("region", { name: "Commercial general liability" });
    await liability.getByRole("button", { name: /broker for this coverage|this coverage's broker/ }).click();
    await liability.getByLabel("Agency").fill("Bellwether Row Insurance Agency");
    await liability.getByLabel("Contact").fill("Marguerite Oyelaran");
    await liability.getByLabel("E-mail").fill("marguerite@bellwether-row.example.test");
    await liability.getByRole("button", { name: "Save this coverage's broker" }).click();
    await liability.getByText(/Marguerite Oyelaran, Bellwether Row Insurance Agency/).waitFor();

    await shop.page.goto(`${suite.url}/certificate-requests`);
    await shop.page.getByRole("heading", { level: 1, name: "Certificates from brokers" }).waitFor();
    await shop.page.getByLabel("Service company").selectOption(String(company.id));
    await shop.page.getByLabel("Coverage", { exact: true }).selectOption("general_liability");
    await shop.page.getByRole("radio", { name: /Certificate holder and additional insured/ }).check();
    await shop.page.getByRole("button", { name: "Send the request" }).click();
    await shop.page
      .getByRole("status")
      .getByText(/Sent to .*'s broker/)
      .waitFor();
    const asked = shop.page.getByRole("table", { name: "Certificates you asked for" });
    await asked.getByRole("cell", { name: /Sent to the broker, link open until/ }).waitFor();

    await office.page.reload();
    await liability
      .getByText(/Sent, link open/)
      .first()
      .waitFor();
    await liability
      .getByText(/asked Marguerite Oyelaran \(Bellwether Row Insurance Agency\) for a certificate, naming/)
      .waitFor();
    await office.context.close();
    await shop.context.close();

    for (const viewport of viewports) {
      const o = await signedIn(OFFICE, viewport);
      await o.page.goto(`${suite.url}/provider/brokers`);
      await o.page
        .getByRole("region", { name: "Commercial general liability" })
        .getByText("Timeline")
        .waitFor();
      await expectFitsAndAccessible(o.page);
      await screenshot(o.page, `brokers-office-${viewport.name}`);
      await o.context.close();

      const s = await signedIn(SHOP, viewport);
      await s.page.goto(`${suite.url}/certificate-requests`);
      await s.page
        .getByRole("table", { name: "Certificates you asked for" })
        .getByRole("row")
        .nth(1)
        .waitFor();
      await expectFitsAndAccessible(s.page);
      await screenshot(s.page, `certificate-requests-shop-${viewport.name}`);
      await s.context.close();
    }
  }, 120_000);
});
