import { describe, expect, it } from "vitest";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot } from "../support/browser.ts";

const suite = useBrowserSuite();

// A policy period runs on standard time at the insured's mailing address (ISO CG DS 01 wording, from memory).
describe("signing up", () => {
  it("shows the zone the ZIP code gives before the account is made, and that only the address changes it", async () => {
    const context = await suite.newContext({ viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    await page.goto(`${suite.url}/sign-up`);
    await page.getByLabel("ZIP code").fill("85004");
    const note = page.getByRole("status").filter({ hasText: "America/Phoenix" });
    await note.waitFor();
    await screenshot(page, "sign-up-zone-390");

    await expect(note.innerText()).resolves.toMatch(/AZ: policy periods .* run on .*America\/Phoenix/);
    await expect(note.innerText()).resolves.toContain("changes only when you change the company's address");
    await expect(page.evaluate(() => document.documentElement.scrollWidth)).resolves.toBeLessThanOrEqual(390);
    await context.close();
  });
});
