import { describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { seriousAccessibilityProblems } from "../support/axe.ts";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot } from "../support/browser.ts";

// The demo shop whose Joliet mill carries a service history.
const BUYER = "buyer@tamsin-gear.test";
const MILL = "Vantor Machine Works VM-40 vertical mill";

const suite = useBrowserSuite();

const overflow = (page: Page) =>
  page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);

describe("a maintenance manager reads a machine's service history", () => {
  it(
    "goes from the machines list to the machine page, reads the history and downloads it (desktop)",
    { timeout: 90_000 },
    async () => {
      const page = await suite.signedInPage(BUYER);

      await page.getByRole("link", { name: "Machines", exact: true }).click();
      await page.getByRole("heading", { level: 1, name: "Machines" }).waitFor();
      await page.getByLabel("State").selectOption("down");
      await page.getByText("No machine matches these filters").waitFor();
      await page.getByRole("button", { name: "Clear the filters" }).click();
      await page.getByLabel("Builder").fill("vantor");
      await page.getByRole("button", { name: "Apply" }).click();
      await page.waitForURL(/builder=vantor/);
      await expect(seriousAccessibilityProblems(page)).resolves.toEqual([]);
      await screenshot(page, "machine-history-1-list");
      await page.getByRole("link", { name: MILL }).click();
      await page.getByRole("heading", { level: 1, name: MILL }).waitFor();
      const history = page.getByRole("region", { name: "Service history" });
      await history.getByText("Recorded by the shop", { exact: true }).waitFor();
      const csvHref = await page.getByRole("link", { name: "Download CSV" }).getAttribute("href");
      const printHref = await page.getByRole("link", { name: "Printable page" }).getAttribute("href");
      const csv = await page.context().request.get(`${suite.url}${csvHref}`);
      const printable = await page.context().request.get(`${suite.url}${printHref}`);

      await expect(history.getByText("Work order on Clearbench", { exact: true }).count()).resolves.toBe(1);
      await expect(history.getByText(/Repeat fault:/).count()).resolves.toBe(1);
      await expect(history.getByText("Angular contact bearing pair", { exact: false }).count()).resolves.toBe(
        1,
      );
      await expect(page.getByRole("link", { name: "Maintenance plans" }).count()).resolves.toBe(1);
      expect(csv.status()).toBe(200);
      expect(csv.headers()["content-type"]).toContain("text/csv");
      const text = await csv.text();
      expect(text.split("\r\n")[0]).toMatch(/^Date,Source,Work order,Kind of work/);
      expect(text).toContain("Recorded by the shop");
      expect(text).toContain("Quillfield Spindle Service");
      expect(printable.status()).toBe(200);
      await expect(printable.text()).resolves.toContain("Service history: Vantor Machine Works");
      await expect(seriousAccessibilityProblems(page)).resolves.toEqual([]);
      await screenshot(page, "machine-history-2-machine");
    },
  );

  it(
    "records outside work from the machine page and shows it marked as the shop's own",
    { timeout: 90_000 },
    async () => {
      const page = await suite.signedInPage(BUYER);
      await page.goto(`${suite.url}/machines`);
      await page.getByRole("link", { name: MILL }).click();
      await page.getByRole("heading", { level: 1, name: MILL }).waitFor();

      await page.getByRole("button", { name: "Record outside work" }).click();
      const form = page.getByRole("form", { name: "Record outside work" });
      await form.getByRole("button", { name: "Save record" }).click();
      await form.getByText("What was done").first().waitFor();
      await form.getByLabel("Date of the work").fill("2026-06-02");
      await form.getByLabel("Kind of work").selectOption("preventive_maintenance");
      await form.getByLabel("Service company").fill("Brindle Hollow Machine Care");
      await form.getByLabel("What was done").fill("Way lube pump serviced and backlash checked on all axes.");
      await form.getByLabel("Parts used").fill("2 × Way wiper, WW-220");
      await expect(seriousAccessibilityProblems(page)).resolves.toEqual([]);
      await form.getByRole("button", { name: "Save record" }).click();
      const entry = page.locator("li", { hasText: "Brindle Hollow Machine Care" });
      await entry.waitFor();

      await expect(entry.getByText("Recorded by the shop", { exact: true }).count()).resolves.toBe(1);
      await expect(entry.getByText("2 × Way wiper (WW-220)").count()).resolves.toBe(1);
    },
  );

  it(
    "fits a 390 px phone without sideways scrolling on the list and the machine page",
    { timeout: 90_000 },
    async () => {
      const phone = await suite.signedInPage(BUYER, { viewport: { width: 390, height: 900 } });

      await phone.goto(`${suite.url}/machines`);
      await phone.getByRole("link", { name: MILL }).waitFor();
      const listOverflow = await overflow(phone);
      await screenshot(phone, "machine-history-3-list-390");
      await expect(seriousAccessibilityProblems(phone)).resolves.toEqual([]);
      await phone.getByRole("link", { name: MILL }).click();
      await phone
        .getByRole("region", { name: "Service history" })
        .getByText("Recorded by the shop")
        .first()
        .waitFor();
      const pageOverflow = await overflow(phone);
      await screenshot(phone, "machine-history-4-machine-390");

      expect(listOverflow).toBeLessThanOrEqual(0);
      expect(pageOverflow).toBeLessThanOrEqual(0);
      await expect(seriousAccessibilityProblems(phone)).resolves.toEqual([]);
    },
  );
  it(
    "reads the mill's year of downtime, marks it down from the page and running again",
    { timeout: 90_000 },
    async () => {
      const page = await suite.signedInPage(BUYER);
      await page.goto(`${suite.url}/machines`);
      await page.getByRole("link", { name: MILL }).click();
      const panel = page.getByRole("region", { name: "Downtime, last 12 months" });
      await panel.getByText("Running now.").waitFor();
      const bars = await panel.locator("rect[data-month]").count();
      const monthsWithStops = await panel.locator("rect[data-month][height]:not([height='0'])").count();
      const companies = await panel.getByRole("row").allInnerTexts();
      await screenshot(page, "machine-history-5-downtime");

      await panel.getByRole("button", { name: "Mark down" }).click();
      await panel.getByText(/^Down since /).waitFor();
      const stateWhileDown = await page
        .getByRole("region", { name: "Record" })
        .getByText("Down", { exact: true })
        .count();
      await expect(seriousAccessibilityProblems(page)).resolves.toEqual([]);
      await screenshot(page, "machine-history-6-marked-down");
      await panel.getByRole("button", { name: "Running again" }).click();
      await panel.getByText("Running now.").waitFor();

      // The demo mill stood down three times this year (seven months, 100 days and 42 days ago).
      expect(bars).toBe(12);
      expect(monthsWithStops).toBe(3);
      expect(companies.some((row) => row.includes("Kestrel Ridge Machine Service LLC"))).toBe(true);
      expect(stateWhileDown).toBe(1);
      await expect(panel.getByText("Stoppages (4)").count()).resolves.toBe(1);
    },
  );
});
