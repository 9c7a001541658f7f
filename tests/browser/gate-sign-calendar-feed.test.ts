import { describe, expect, it } from "vitest";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot, signIn } from "../support/browser.ts";
import { Jimp } from "jimp";
import { readQr } from "../support/read-qr.ts";
import { DEMO_PASSWORD } from "../../server/db/demo-scenario/index.ts";

const suite = useBrowserSuite();

// The test server's public address is a placeholder; the feed's path is what a calendar program would fetch.
const onServer = (url: string) => `${suite.url}${new URL(url).pathname}`;

describe("a shop's gate sign and lapse calendar screens", () => {
  it("prints a site's sign whose QR opens the badge page tied to that site", async () => {
    const context = await suite.newContext();
    const page = await context.newPage();
    await signIn(page, suite.url, "buyer@tamsin-gear.test", DEMO_PASSWORD);
    await page.goto(`${suite.url}/sites`);
    const firstSite = page.getByRole("link", { name: /^Print the gate sign for / }).first();
    const label = (await firstSite.getAttribute("aria-label"))!;
    const siteName = label.replace("Print the gate sign for ", "");
    await firstSite.click();
    await page.getByRole("heading", { level: 1, name: siteName }).waitFor();
    const src = await page.getByRole("img", { name: `Gate sign code for ${siteName}` }).getAttribute("src");
    // Decoded by a reader independent of the encoder (ISO/IEC 18004 symbols).
    const url = new URL(await readQr(src!));
    expect(url.pathname).toBe("/badge");
    expect(url.searchParams.get("site")).toMatch(/^[0-9]+-[A-Za-z0-9_-]{10}$/);

    // The printed sheet is the sign alone: the app's header is left off paper (CSS Paged Media, @media print).
    await page.emulateMedia({ media: "print" });
    expect(await page.locator("header").first().isVisible()).toBe(false);
    expect(await page.getByRole("button", { name: "Print this sign" }).isVisible()).toBe(false);
    expect(await page.getByRole("heading", { level: 1, name: siteName }).isVisible()).toBe(true);
    await screenshot(page, "gate-sign-print");
    await context.close();
  });

  it("shows the roster's calendar address once, and a new address stops the old one", async () => {
    const context = await suite.newContext();
    const page = await context.newPage();
    await signIn(page, suite.url, "buyer@marlow-precision.test", DEMO_PASSWORD);
    await page.goto(`${suite.url}/roster`);
    await page.getByRole("button", { name: "Make a subscription address" }).click();
    const field = page.getByLabel(/^Subscription address/);
    await field.waitFor();
    const first = await field.inputValue();
    const feed = await page.request.get(onServer(first));
    expect(feed.status()).toBe(200);
    // An iCalendar object begins with BEGIN:VCALENDAR (RFC 5545 §3.4).
    expect((await feed.text()).startsWith("BEGIN:VCALENDAR")).toBe(true);

    await page.reload();
    await page.getByText(/^Subscription on since /).waitFor();
    expect(await page.getByLabel(/^Subscription address/).count()).toBe(0);

    await page.getByRole("button", { name: "Make a new address" }).click();
    const second = await page.getByLabel(/^Subscription address/).inputValue();
    expect(second).not.toBe(first);
    expect((await page.request.get(onServer(first))).status()).toBe(404);
    expect((await page.request.get(onServer(second))).status()).toBe(200);

    await page.getByRole("button", { name: "Stop the calendar" }).click();
    await page.getByText("No subscription address yet.").waitFor();
    expect((await page.request.get(onServer(second))).status()).toBe(404);
    await context.close();
  });
});

describe("the technician's photo at the gate", () => {
  it("is added on the badge page and shown to the front desk after a scan", async () => {
    const techContext = await suite.newContext({ viewport: { width: 390, height: 844 } });
    const tech = await techContext.newPage();
    await signIn(tech, suite.url, "tobias@kestrel-ridge.test", DEMO_PASSWORD);
    await tech.goto(`${suite.url}/badge`);
    const png = await new Jimp({ width: 900, height: 900, color: 0x884422ff }).getBuffer("image/png");
    await tech
      .getByLabel(/photo \(JPEG or PNG\)/)
      .setInputFiles({ name: "me.png", mimeType: "image/png", buffer: png });
    await tech.getByRole("button", { name: "Save photo" }).click();
    await tech.getByRole("img", { name: "Your photo" }).waitFor();
    const src = await tech.getByRole("img", { name: "Gate badge code to scan" }).getAttribute("src");
    const url = new URL(await readQr(src!));
    await techContext.close();

    const deskContext = await suite.newContext();
    const desk = await deskContext.newPage();
    await desk.goto(`${suite.url}${url.pathname}${url.search}`);
    const photo = desk.getByRole("img", { name: /^Photo of / });
    await photo.waitFor();
    // The desk gets the stored JPEG, not the PNG that was sent (JPEG SOI marker, ISO/IEC 10918-1).
    expect(await photo.getAttribute("src")).toMatch(/^data:image\/jpeg;base64,\/9j\//);
    await screenshot(desk, "gate-check-photo");
    await deskContext.close();
  });
});
