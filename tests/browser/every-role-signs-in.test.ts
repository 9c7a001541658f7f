import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { startBrowserServer } from "../support/browser-server.ts";
import { launchChromium, screenshot, signIn } from "../support/browser.ts";
import { DEMO_PASSWORD } from "../../server/db/demo-scenario/index.ts";

let server: Awaited<ReturnType<typeof startBrowserServer>>;
let browser: Browser;
beforeAll(async () => {
  server = await startBrowserServer();
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

// Each role sees only what it may use.
const journeys = [
  {
    role: "provider_admin",
    email: "office@kestrel-ridge.test",
    sees: ["Dashboard", "Technicians", "Documents", "Work orders"],
    hidden: ["Queue", "Directory", "Users"],
  },
  {
    role: "technician",
    email: "tobias@kestrel-ridge.test",
    sees: ["My standing", "Upload a card"],
    hidden: ["Technicians", "Queue", "Directory"],
  },
  {
    role: "reviewer",
    email: "reviewer@clearbench.test",
    sees: ["Queue"],
    hidden: ["Technicians", "Directory", "Users"],
  },
  {
    role: "buyer",
    email: "buyer@marlow-precision.test",
    sees: ["Directory", "Roster", "Sites", "Requirement sets", "Work orders"],
    hidden: ["Queue", "Technicians", "Users"],
  },
  {
    role: "admin",
    email: "admin@clearbench.test",
    sees: ["Users", "Catalogue", "Outbox", "Baseline", "Job runs", "Reported reviews"],
    hidden: ["Queue", "Directory", "Technicians"],
  },
] as const;

describe("signing in as each demo role", () => {
  it.each(journeys)("shows $role only that role's navigation", async ({ role, email, sees, hidden }) => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();

    await signIn(page, server.url, email, DEMO_PASSWORD);
    const nav = page.getByRole("navigation", { name: /main/i });
    await nav.getByRole("link").first().waitFor();
    await screenshot(page, `sign-in-${role}`);

    for (const name of sees)
      await expect(nav.getByRole("link", { name, exact: true }).count()).resolves.toBe(1);
    for (const name of hidden)
      await expect(nav.getByRole("link", { name, exact: true }).count()).resolves.toBe(0);
    await context.close();
  });
});
