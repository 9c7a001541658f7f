import { describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot, signIn } from "../support/browser.ts";
import { seriousAccessibilityProblems } from "../support/axe.ts";
import { DEMO_PASSWORD } from "../../server/db/demo-scenario/index.ts";

const suite = useBrowserSuite();

const SELLER = "buyer@tamsin-gear.test";
const RECEIVER = "buyer@marlow-precision.test";
// A phone held upright (390 CSS px wide, common practice for current phones).
const PHONE = { width: 390, height: 844 };

/** A JSON call from inside the signed-in page, with the CSRF header the API asks of every write. */
const call = (page: Page, method: string, path: string, body?: unknown) =>
  page.evaluate(
    async ({ method, path, body }) => {
      const res = await fetch(path, {
        method,
        headers: { "content-type": "application/json", "x-clearbench-csrf": "1" },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      return { status: res.status, body: res.status === 204 ? null : await res.json() };
    },
    { method, path, body },
  );

/** A site of the signed-in shop, added when the demo shop has none. */
async function aSiteOf(page: Page, name: string): Promise<number> {
  const sites = (await call(page, "GET", "/api/sites")).body as { id: number }[];
  if (sites[0]) return sites[0].id;
  const added = await call(page, "POST", "/api/sites", {
    name,
    addressLine: "40 Quarry Road",
    postalCode: "60601",
  });
  return (added.body as { id: number }).id;
}

const hasNoSidewaysScroll = (page: Page) =>
  page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth);

describe("a shop sells a machine and the buying shop takes it over", () => {
  it("starts the transfer on a phone, and the receiver accepts it onto a site of its own", async () => {
    const sellerContext = await suite.newContext({ viewport: PHONE });
    const seller = await sellerContext.newPage();
    await signIn(seller, suite.url, SELLER, DEMO_PASSWORD);
    const siteId = await aSiteOf(seller, "Tamsin Gear Works");
    const serial = `BRW-${Date.now()}`;
    const machine = await call(seller, "POST", `/api/sites/${siteId}/equipment`, {
      builder: "Halden Axis Systems",
      controlFamily: "Halden HX-7",
      technology: "lathe",
      model: "HL-220",
      serialNumber: serial,
    });
    expect(machine.status).toBe(201);
    const machineId = (machine.body as { id: number }).id;

    await seller.goto(`${suite.url}/machines/${machineId}/transfer`);
    await seller.getByRole("heading", { name: "Transfer a machine" }).waitFor();
    await seller.getByLabel("E-mail of a buyer at the buying shop").fill(RECEIVER);
    await seller
      .getByLabel("Note to the buying shop (optional)")
      .fill("Sold with the tailstock and two chucks");
    await seller.getByRole("button", { name: "Start transfer" }).click();
    await seller.getByRole("heading", { name: "Waiting for the buying shop" }).waitFor();
    await expect(seller.getByText(`Sent to: ${RECEIVER}`).isVisible()).resolves.toBe(true);
    await expect(hasNoSidewaysScroll(seller)).resolves.toBe(true);
    await screenshot(seller, "machine-transfer-1-started");
    expect(await seriousAccessibilityProblems(seller)).toEqual([]);

    const receiverContext = await suite.newContext({ viewport: PHONE });
    const receiver = await receiverContext.newPage();
    await signIn(receiver, suite.url, RECEIVER, DEMO_PASSWORD);
    await aSiteOf(receiver, "Marlow Precision, Plant 1");
    await receiver.goto(`${suite.url}/machine-transfers`);
    await receiver.getByRole("heading", { name: "Machine transfers" }).waitFor();
    const card = receiver.getByRole("article", { name: "Halden Axis Systems HL-220" });
    await card.waitFor();
    await expect(card.getByText("Sold with the tailstock and two chucks").isVisible()).resolves.toBe(true);
    await expect(hasNoSidewaysScroll(receiver)).resolves.toBe(true);
    expect(await seriousAccessibilityProblems(receiver)).toEqual([]);
    await screenshot(receiver, "machine-transfer-2-incoming");

    const site = card.getByLabel("Your site for this machine");
    await site.selectOption({ index: 1 });
    await card.getByLabel("Bay (optional)").fill("Bay 3");
    await card.getByRole("button", { name: "Accept transfer" }).click();
    await card.getByText("Taken over").first().waitFor();
    await expect(card.getByRole("button", { name: "Accept transfer" }).count()).resolves.toBe(0);
    await screenshot(receiver, "machine-transfer-3-accepted");

    const mine = await call(receiver, "GET", `/api/machines/${machineId}`);
    expect(mine.status).toBe(200);
    expect(mine.body).toMatchObject({ serialNumber: serial, bay: "Bay 3" });
    expect((await call(seller, "GET", `/api/machines/${machineId}`)).status).toBe(404);
    const bell = await call(receiver, "GET", "/api/notifications");
    expect(JSON.stringify(bell.body)).toContain("is transferring a machine to you");
    await sellerContext.close();
    await receiverContext.close();
  }, 180_000);
});
