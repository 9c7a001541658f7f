import { describe, expect, it } from "vitest";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot, signIn } from "../support/browser.ts";
import { DEMO_PASSWORD } from "../../server/db/demo-scenario/index.ts";

const suite = useBrowserSuite();

// Each role sees only what it may use.
const journeys = [
  {
    role: "provider_admin",
    email: "office@kestrel-ridge.test",
    sees: ["Dashboard", "Technicians", "Credentials", "Work orders", "Service requests"],
    hidden: ["Verification queue", "Directory", "Users"],
  },
  {
    role: "technician",
    email: "tobias@kestrel-ridge.test",
    sees: ["My standing", "Upload a card"],
    hidden: ["Technicians", "Verification queue", "Directory", "Service requests"],
  },
  {
    role: "reviewer",
    email: "reviewer@clearbench.test",
    sees: ["Verification queue"],
    hidden: ["Technicians", "Directory", "Users"],
  },
  {
    role: "buyer",
    email: "buyer@marlow-precision.test",
    sees: ["Directory", "Roster", "Sites", "Requirement sets", "Work orders", "Service requests"],
    hidden: ["Verification queue", "Technicians", "Users"],
  },
  {
    role: "admin",
    email: "admin@clearbench.test",
    sees: ["Users", "Catalog", "Outbox", "Platform baseline", "Job runs", "Reported ratings", "Follow-up"],
    hidden: ["Verification queue", "Directory", "Technicians"],
  },
] as const;

describe("signing in as each demo role", () => {
  it.each(journeys)("shows $role only that role's navigation", async ({ role, email, sees, hidden }) => {
    const context = await suite.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();

    await signIn(page, suite.url, email, DEMO_PASSWORD);
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
