import { describe, expect, it } from "vitest";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot, signIn } from "../support/browser.ts";
import { readQr } from "../support/read-qr.ts";
import { DEMO_PASSWORD } from "../../server/db/demo-scenario/index.ts";

const suite = useBrowserSuite();

describe("gate badge", () => {
  it("shows a QR on the technician's badge page that a front desk opens without signing in", async () => {
    const techContext = await suite.newContext({ viewport: { width: 390, height: 844 } });
    const tech = await techContext.newPage();
    await signIn(tech, suite.url, "tobias@kestrel-ridge.test", DEMO_PASSWORD);
    await tech.goto(`${suite.url}/badge`);
    const image = tech.getByRole("img", { name: "Gate badge code to scan" });
    await image.waitFor();
    const src = await image.getAttribute("src");
    await screenshot(tech, "gate-badge");
    const url = new URL(await readQr(src!));
    await techContext.close();

    expect(url.pathname).toBe("/gate/check");
    const deskContext = await suite.newContext();
    const desk = await deskContext.newPage();
    await desk.goto(`${suite.url}${url.pathname}${url.search}`);
    const verdict = desk.locator("[data-state]");
    await verdict.waitFor();
    await screenshot(desk, "gate-check");

    expect(["cleared", "not_cleared"]).toContain(await verdict.getAttribute("data-state"));
    await expect(desk.getByText("Kestrel Ridge", { exact: false }).count()).resolves.toBeGreaterThan(0);
    await expect(desk.getByText(/^Checked /).count()).resolves.toBe(1);
    await deskContext.close();
  });

  it("answers a forged code as not a badge", async () => {
    const context = await suite.newContext();
    const page = await context.newPage();
    await page.goto(`${suite.url}/gate/check?token=1.abc.not-signed`);
    const verdict = page.locator("[data-state]");
    await verdict.waitFor();

    expect(await verdict.getAttribute("data-state")).toBe("invalid");
    await context.close();
  });
});
