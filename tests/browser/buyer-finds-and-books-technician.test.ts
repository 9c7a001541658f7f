import { describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { seriousAccessibilityProblems } from "../support/axe.ts";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot } from "../support/browser.ts";

const BUYER = "buyer@marlow-precision.test";
const PROVIDER = "office@kestrel-ridge.test";
// The demo's Chicago-area technician with verified arc-flash training, about 125 km from the shop's Rockford ZIP code.
const TECHNICIAN = "Tobias Wren";
const SITE_ZIP = "61101";

/** The same page at phone width (nothing wider than the screen), then back to the desktop width the journey runs at. */
async function atPhoneWidth(page: Page, name: string) {
  await page.setViewportSize({ width: 390, height: 844 });
  await screenshot(page, name);
  await expect(
    page.evaluate(() => document.documentElement.scrollWidth),
    name,
  ).resolves.toBeLessThanOrEqual(390);
  await page.setViewportSize({ width: 1280, height: 900 });
}

/** 8:30 tomorrow as a date-time field takes it; a day ahead is in the future in every US zone. */
function arrivalTomorrow(): string {
  const d = new Date(Date.now() + 36 * 3_600_000);
  return `${d.toISOString().slice(0, 10)}T08:30`;
}

const suite = useBrowserSuite();

describe("a buyer finds a cleared technician and books the job", () => {
  it("goes from a site and a credential filter to a confirmed, rated work order", async () => {
    const buyer = await suite.signedInPage(BUYER);

    // The shop's site, found by its ZIP code, and one machine at it.
    await buyer.goto(`${suite.url}/sites`);
    await buyer.getByRole("button", { name: "Add a site" }).first().click();
    await buyer.getByLabel("Site name").fill("Rockford main plant");
    await buyer.getByLabel("Street address").fill("400 Millrace Avenue");
    await buyer.getByLabel("ZIP code").fill(SITE_ZIP);
    await buyer
      .getByRole("region", { name: "New site" })
      .getByText(/Rockford, IL/)
      .waitFor();
    await buyer.getByRole("button", { name: "Add site", exact: true }).click();
    await buyer.getByRole("heading", { name: "Rockford main plant" }).waitFor();
    // The demo shop has a plant already; the machine goes to the new site's own form. The builder is typed by its
    // short name, which the catalog turns into its full name.
    const machines = buyer.getByRole("region", { name: "Machines at Rockford main plant" });
    await machines.getByLabel("Machine builder").fill("vantor");
    await machines.getByLabel("Control family").fill("Kestle 40");
    await machines.getByLabel("Technology").selectOption("mill");
    await machines.getByLabel("Model").fill("VM-40 vertical mill");
    await machines.getByRole("button", { name: "Add machine" }).click();
    await buyer.getByText("Vantor Machine Works VM-40 vertical mill").waitFor();
    await screenshot(buyer, "buyer-books-1-site");

    await buyer.goto(`${suite.url}/directory`);
    await buyer.getByLabel("Site", { exact: true }).selectOption({ label: "Rockford main plant" });
    await buyer.getByLabel("Electrical safety (arc flash) training").check();
    await buyer.getByText("Machine builder training, insurance limits and estimate").click();
    await buyer.getByLabel("Expected hours on site").fill("4");
    await buyer.getByRole("button", { name: "Search" }).click();
    await buyer.waitForURL(/credentialTypes=arc_flash/);
    const row = buyer.getByRole("row", { name: new RegExp(TECHNICIAN) });
    await row.waitFor();
    await screenshot(buyer, "buyer-books-2-directory");
    await atPhoneWidth(buyer, "buyer-books-2-directory-390");

    expect(new URL(buyer.url()).searchParams.get("siteId")).not.toBeNull();
    await expect(row.getByText("Company insurance in force").count()).resolves.toBe(1);
    await expect(row.getByText("straight line").count()).resolves.toBe(1);
    // Distances read in miles, never kilometres.
    await expect(row.getByText(/\d miles?\b/).count()).resolves.toBeGreaterThan(0);
    await expect(buyer.getByText(/\bkm\b/).count()).resolves.toBe(0);
    await expect(
      buyer
        .getByText("Cleared means the required documents are verified and in force today", { exact: false })
        .count(),
    ).resolves.toBeGreaterThan(0);
    await expect(buyer.getByTestId("status-key").count()).resolves.toBe(1);
    await expect(row.getByText("estimate before tax", { exact: true }).count()).resolves.toBe(1);
    await expect(row.getByText("4 h on site, from Rockford main plant").count()).resolves.toBe(1);
    const rowEstimate = await row
      .getByTestId("estimate-inputs")
      .locator("xpath=..")
      .locator("span")
      .first()
      .textContent();
    await expect(row.getByTestId("on-roster-marker").count()).resolves.toBe(0);
    await expect(seriousAccessibilityProblems(buyer)).resolves.toEqual([]);

    await row.getByRole("link", { name: TECHNICIAN }).click();
    await buyer.getByRole("heading", { level: 1, name: TECHNICIAN }).waitFor();
    await screenshot(buyer, "buyer-books-3-technician");
    await atPhoneWidth(buyer, "buyer-books-3-technician-390");
    // The safety caution stands where work is decided (raising the work order), not on every page that shows a badge.
    await expect(
      buyer.getByRole("complementary", { name: "Cleared is about documents, not safety or skill" }).count(),
    ).resolves.toBe(0);

    await expect(buyer.getByText("Rockford main plant").count()).resolves.toBeGreaterThan(0);
    await expect(
      buyer.getByRole("complementary", { name: "About certificates of insurance" }).count(),
    ).resolves.toBe(1);
    await expect(seriousAccessibilityProblems(buyer)).resolves.toEqual([]);

    // The hours and the site came along from the directory, so the page's estimate for that site is the row's.
    expect(new URL(buyer.url()).searchParams.get("onSiteHours")).toBe("4");
    const chosen = buyer.getByRole("listitem").filter({ hasText: "the site you searched from" });
    await expect(chosen.getByText("4 h on site, from Rockford main plant").count()).resolves.toBe(1);
    await expect(
      chosen.getByTestId("estimate-inputs").locator("xpath=..").locator("span").first().textContent(),
    ).resolves.toBe(rowEstimate);

    await buyer.getByRole("button", { name: "Add to roster" }).click();
    await buyer.getByText("Added to your roster.").waitFor();
    await buyer.reload();
    await buyer.getByRole("heading", { level: 1, name: TECHNICIAN }).waitFor();
    await buyer.getByTestId("roster-state").waitFor();
    await expect(buyer.getByRole("button", { name: "Add to roster" }).count()).resolves.toBe(0);
    await buyer.goBack();
    await row.getByTestId("on-roster-marker").waitFor();
    await buyer.goForward();
    await buyer.getByRole("heading", { level: 1, name: TECHNICIAN }).waitFor();

    await buyer.getByRole("link", { name: "Raise a work order" }).click();
    await buyer.getByRole("heading", { level: 1, name: "Raise a work order" }).waitFor();
    for (const caution of [
      "Cleared is about documents, not safety or skill",
      "About certificates of insurance",
    ])
      await expect(buyer.getByRole("complementary", { name: caution }).count()).resolves.toBe(1);
    await buyer.getByLabel("Machine", { exact: true }).selectOption({ index: 1 });
    await buyer
      .getByLabel("What is wrong")
      .fill("Spindle drive faults with an overload alarm after ten minutes of heavy cutting.");
    await buyer.getByRole("button", { name: "Send work order" }).click();
    await buyer.waitForURL(/\/work-orders\/\d+$/);
    const workOrderUrl = buyer.url();
    await buyer.getByText("Requested").first().waitFor();
    await screenshot(buyer, "buyer-books-4-requested");
    await atPhoneWidth(buyer, "buyer-books-4-requested-390");
    await buyer.getByRole("heading", { level: 1, name: /^Work order #\d+$/ }).waitFor();
    await expect(buyer.getByText("29 CFR 1910.147", { exact: false }).count()).resolves.toBeGreaterThan(0);

    await expect(seriousAccessibilityProblems(buyer)).resolves.toEqual([]);

    const provider = await suite.signedInPage(PROVIDER);
    await provider.goto(workOrderUrl);
    await provider.getByRole("button", { name: "Accept…" }).click();
    await provider.getByLabel("Arrival at the site").fill(arrivalTomorrow());
    await provider.getByRole("button", { name: "Accept with this arrival" }).click();
    await provider.getByRole("button", { name: "Mark completed…" }).click();
    await provider.getByLabel("Hours worked on site").fill("3.5");
    await provider.getByLabel("Travel hours, both ways").fill("3");
    await provider.getByRole("button", { name: "Record completion" }).click();
    await provider.getByRole("link", { name: /Print proof of standing \(when completed\)/ }).waitFor();
    await screenshot(provider, "buyer-books-5-completed");

    await expect(provider.getByText("Completed", { exact: true }).count()).resolves.toBeGreaterThan(0);
    await expect(
      provider.getByRole("link", { name: /Print proof of standing \(when accepted\)/ }).count(),
    ).resolves.toBe(1);

    await buyer.reload();
    await buyer.getByRole("button", { name: "Confirm the work is done" }).click();
    await buyer.getByRole("heading", { name: "Rating" }).waitFor();
    await buyer.getByLabel(/5 stars, Excellent/).check();
    await buyer
      .getByLabel("What went well, and what did not")
      .fill("Found the worn drive belt quickly and left the machine cutting again.");
    await buyer.getByRole("button", { name: "Send rating" }).click();
    await buyer.getByText("5 out of 5").waitFor();
    await screenshot(buyer, "buyer-books-6-rated");

    await expect(buyer.getByText("Confirmed", { exact: true }).count()).resolves.toBeGreaterThan(0);
    await expect(seriousAccessibilityProblems(buyer)).resolves.toEqual([]);
  }, 120_000);
});
