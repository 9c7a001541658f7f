import { describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { seriousAccessibilityProblems } from "../support/axe.ts";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot } from "../support/browser.ts";

const BUYER = "buyer@marlow-precision.test";
const PROVIDER = "office@kestrel-ridge.test";
const TECHNICIAN = "Tobias Wren";
const CSRF = { "x-clearbench-csrf": "1" };

const suite = useBrowserSuite();

/** Axe finds nothing serious, at desktop width and at 390 px, where nothing may be wider than the screen. */
async function checkedAtBothWidths(page: Page, name: string) {
  await screenshot(page, name);
  await expect(seriousAccessibilityProblems(page), name).resolves.toEqual([]);
  await page.setViewportSize({ width: 390, height: 844 });
  await screenshot(page, `${name}-390`);
  const [scrollWidth, innerWidth] = await page.evaluate(() => [
    document.documentElement.scrollWidth,
    window.innerWidth,
  ]);
  expect(scrollWidth, name).toBeLessThanOrEqual(innerWidth!);
  await expect(seriousAccessibilityProblems(page), `${name} at 390 px`).resolves.toEqual([]);
  await page.setViewportSize({ width: 1280, height: 900 });
}

/** A calendar day some days ahead, as a date field takes it; far enough ahead to be future in every US zone. */
const dayAhead = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

async function raiseFromForm(buyer: Page, technicianId: number, siteId: number, problem: string) {
  await buyer.goto(`${suite.url}/work-orders/new?technicianId=${technicianId}&siteId=${siteId}`);
  await buyer.getByRole("heading", { level: 1, name: "Raise a work order" }).waitFor();
  await buyer.getByLabel("Technology").selectOption({ index: 1 });
  await buyer.getByLabel("What is wrong").fill(problem);
  return buyer;
}

describe("a buyer and a service office decide a work order together", () => {
  it("raise → accept with arrival → complete → dispute → complete again → confirm, and cancel, and take a proposed date", async () => {
    const buyer = await suite.signedInPage(BUYER, { timezoneId: "America/Chicago" });
    const site = await buyer.request.post(`${suite.url}/api/sites`, {
      headers: CSRF,
      data: {
        name: "Rockford east plant",
        addressLine: "1180 Millrace Avenue",
        postalCode: "61101",
        contactName: "Wilhelmina Osei",
        contactPhone: "(815) 555-0137",
        safetyInductionNote: "Sign in at the east gate; hearing protection past the press line.",
      },
    });
    expect(site.status()).toBe(201);
    const siteId = ((await site.json()) as { id: number }).id;
    const found = await buyer.request.get(
      `${suite.url}/api/directory?siteId=${siteId}&q=${encodeURIComponent(TECHNICIAN)}`,
    );
    const row = ((await found.json()) as { rows: { technicianId: number; name: string }[] }).rows.find(
      (r) => r.name === TECHNICIAN,
    );
    expect(row).toBeDefined();

    // Raise: the contact and induction start from the site; PO and not-to-exceed are the buyer's.
    await raiseFromForm(
      buyer,
      row!.technicianId,
      siteId,
      "Spindle overload alarm after ten minutes of cutting.",
    );
    await expect(buyer.getByLabel("On-site contact").inputValue()).resolves.toBe("Wilhelmina Osei");
    await buyer.getByLabel("PO number").fill("PO-55120");
    await buyer.getByLabel("Not to exceed (dollars)").fill("2,450");
    await buyer.getByRole("button", { name: "Send work order" }).click();
    await buyer.waitForURL(/\/work-orders\/\d+$/);
    const workOrderUrl = buyer.url();
    await buyer.getByRole("heading", { name: "On site" }).waitFor();
    await expect(buyer.getByText("$2,450.00", { exact: false }).count()).resolves.toBe(1);

    // The service side sees no address, contact or PO until it accepts.
    // The office reads times in its own zone, an hour ahead of the Chicago-zone site.
    const provider = await suite.signedInPage(PROVIDER, { timezoneId: "America/New_York" });
    await provider.goto(workOrderUrl);
    await provider.getByText(/arrive here once you accept/).waitFor();
    await expect(provider.getByText("1180 Millrace Avenue", { exact: false }).count()).resolves.toBe(0);
    await expect(provider.getByText("PO-55120").count()).resolves.toBe(0);
    await checkedAtBothWidths(provider, "decisions-1-provider-requested");

    await provider.getByRole("button", { name: "Accept…" }).click();
    await provider.getByLabel("Arrival at the site").fill(`${dayAhead(2)}T07:45`);
    await provider.getByRole("button", { name: "Accept with this arrival" }).click();
    await provider.getByRole("heading", { name: "On site" }).waitFor();
    await expect(provider.getByText(/1180 Millrace Avenue, Rockford, IL 61101/).count()).resolves.toBe(1);
    await expect(provider.getByText("Wilhelmina Osei, (815) 555-0137").count()).resolves.toBe(1);
    await expect(provider.getByText("PO-55120").count()).resolves.toBe(1);
    // Entered as 7:45 at the site (Central time), read as 8:45 Eastern (IANA tz database America/Chicago, America/New_York).
    await expect(provider.getByText(/8:45 AM E[SD]T/).count()).resolves.toBeGreaterThan(0);
    // The work-safety caution stays where the work is decided.
    await expect(provider.getByText("29 CFR 1910.147", { exact: false }).count()).resolves.toBeGreaterThan(0);
    await checkedAtBothWidths(provider, "decisions-2-provider-accepted");

    await provider.getByRole("button", { name: "Mark completed…" }).click();
    await provider.getByLabel("Hours worked on site").fill("3.5");
    await provider.getByLabel("Travel hours, both ways").fill("2.25");
    await provider.getByLabel("Note for the shop").fill("Replaced the spindle drive fan.");
    await provider.getByRole("button", { name: "Record completion" }).click();
    await provider.getByText("Completed", { exact: true }).first().waitFor();

    // Before any click the buyer reads the hours and the note.
    await buyer.reload();
    const summary = buyer.getByTestId("completion-summary");
    await summary.waitFor();
    await expect(summary.textContent()).resolves.toMatch(
      /On site\s*3\.5 h.*Travel\s*2\.25 h.*Replaced the spindle drive fan\./s,
    );
    await checkedAtBothWidths(buyer, "decisions-3-buyer-completed");

    await buyer.getByRole("button", { name: "Dispute…" }).click();
    await buyer.getByLabel("What is still open").fill("The fan still rattles at high spindle speed.");
    await buyer.getByRole("button", { name: "Send the dispute" }).click();
    await buyer.getByText("Disputed", { exact: true }).first().waitFor();
    await buyer.reload();
    await buyer.getByText("Disputed the completion: The fan still rattles at high spindle speed.").waitFor();
    await expect(buyer.getByRole("heading", { name: "Rating" }).count()).resolves.toBe(0);
    await checkedAtBothWidths(buyer, "decisions-4-buyer-disputed");

    await provider.reload();
    await provider.getByRole("button", { name: "Record the completion again…" }).click();
    await provider.getByLabel("Hours worked on site").fill("4");
    await provider.getByLabel("Travel hours, both ways").fill("2.25");
    await provider.getByRole("button", { name: "Record completion" }).click();
    await provider.getByText("Completed", { exact: true }).first().waitFor();

    await buyer.reload();
    await expect(buyer.getByTestId("completion-summary").textContent()).resolves.toMatch(/On site\s*4 h/);
    await buyer.getByRole("button", { name: "Confirm the work is done" }).click();
    await buyer.getByRole("heading", { name: "Rating" }).waitFor();

    // Cancel: a second work order, called off with a reason; the office hears of it in its bell.
    await raiseFromForm(buyer, row!.technicianId, siteId, "Coolant pump trips its breaker on start-up.");
    await buyer.getByRole("button", { name: "Send work order" }).click();
    await buyer.waitForURL(/\/work-orders\/\d+$/);
    await buyer.getByRole("button", { name: "Cancel the work order…" }).click();
    await buyer.getByLabel("Reason for cancelling").fill("The pump was a loose connector; fixed in house.");
    await buyer.getByRole("button", { name: "Cancel the work order" }).click();
    await buyer.getByText("Cancelled", { exact: true }).first().waitFor();
    await expect(buyer.getByText(/fixed in house/).count()).resolves.toBeGreaterThan(0);
    await checkedAtBothWidths(buyer, "decisions-5-buyer-cancelled");
    const bell = await provider.request.get(`${suite.url}/api/notifications`);
    expect(JSON.stringify(await bell.json())).toContain("cancelled by the shop");

    // Decline with a proposed date; the buyer takes it with one click and lands on the copy.
    await raiseFromForm(buyer, row!.technicianId, siteId, "Tool changer arm stops halfway on every change.");
    await buyer.getByRole("button", { name: "Send work order" }).click();
    await buyer.waitForURL(/\/work-orders\/\d+$/);
    const declinedUrl = buyer.url();
    await provider.goto(declinedUrl);
    await provider.getByRole("button", { name: "Decline…" }).click();
    await provider.getByLabel("Reason for declining").fill("No one free this week");
    await provider.getByLabel("A date you could come instead").fill(dayAhead(9));
    await provider.getByRole("button", { name: "Decline", exact: true }).click();
    await provider.getByText("Declined", { exact: true }).first().waitFor();

    await buyer.reload();
    await buyer.getByRole("heading", { name: "Send the job on" }).waitFor();
    await checkedAtBothWidths(buyer, "decisions-6-buyer-declined");
    await buyer.getByRole("button", { name: /^Take / }).click();
    await buyer.waitForURL((url) => url.href !== declinedUrl && /\/work-orders\/\d+$/.test(url.pathname));
    await buyer.getByText(/Copied from/).waitFor();
    await expect(buyer.getByText("Requested", { exact: true }).count()).resolves.toBeGreaterThan(0);
  }, 240_000);
});
