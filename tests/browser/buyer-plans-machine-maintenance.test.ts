import { afterAll, beforeAll, describe, expect, it } from "vitest";
import pg from "pg";
import { seriousAccessibilityProblems } from "../support/axe.ts";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot, signIn } from "../support/browser.ts";
import { DEMO_PASSWORD } from "../../server/db/demo-scenario/index.ts";
import { calendarDateIn } from "../../shared/dates/local-time.ts";
import { addCalendarDays } from "../../shared/standing/iso-date.ts";
import { addCalendarMonths } from "../../shared/standing/training-validity.ts";

const BUYER = "buyer@marlow-precision.test";

let client: pg.Client;
const suite = useBrowserSuite();
beforeAll(async () => {
  client = new pg.Client({ connectionString: suite.server.databaseUrl });
  await client.connect();
}, 180_000);
afterAll(async () => {
  await client?.end();
});

/** A Chicago site with one mill for the demo shop, as the sites page would store it. */
async function millAtChicagoSite(): Promise<number> {
  const { rows } = await client.query<{ company_id: number }>(
    "SELECT company_id FROM users WHERE email = $1",
    [BUYER],
  );
  const site = await client.query<{ id: number }>(
    `INSERT INTO sites (company_id, name, address_line, postal_code, time_zone, latitude, longitude)
     VALUES ($1, 'Marlow north bay', '22 Quarry Lane', '60601', 'America/Chicago', 41.8858, -87.6181) RETURNING id`,
    [rows[0]!.company_id],
  );
  const machine = await client.query<{ id: number }>(
    `INSERT INTO equipment (site_id, builder, control_family, technology, model, serial_number)
     VALUES ($1, 'Vantor Machine Works', 'Kestle 40', 'mill', 'VM-55 vertical mill', 'VM55-3310') RETURNING id`,
    [site.rows[0]!.id],
  );
  return machine.rows[0]!.id;
}

describe("maintenance plans page", () => {
  it("adds a plan on a phone, shows when it falls due, and raises the planned service in one click", async () => {
    const machineId = await millAtChicagoSite();
    const today = calendarDateIn(new Date(), "America/Chicago");
    // Done eleven months and ten days ago, so the annual inspection falls due in about three weeks.
    const lastDoneOn = addCalendarDays(addCalendarMonths(today, -11), -10);
    const dueOn = addCalendarMonths(lastDoneOn, 12);
    const context = await suite.newContext({ viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    await signIn(page, suite.url, BUYER, DEMO_PASSWORD);

    await page.goto(`${suite.url}/machines/${machineId}/maintenance`);
    await page.getByRole("heading", { name: "Maintenance plans", level: 1 }).waitFor();
    await page.getByRole("button", { name: "Add a plan" }).click();
    const form = page.getByRole("form", { name: "Add a maintenance plan" });
    await form.getByLabel("What is done").fill("Annual inspection");
    await form.getByLabel("Every (months)").fill("12");
    await form.getByLabel("Last done on").fill(lastDoneOn);
    await form.getByRole("button", { name: "Add plan" }).click();
    const card = page.getByRole("listitem", { name: "Annual inspection" });
    await card.waitFor();
    const dueText = await card.getByTestId("next-due").innerText();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    const problems = await seriousAccessibilityProblems(page);
    await screenshot(page, "buyer-maintenance-plans-phone");
    await card.getByRole("button", { name: "Request this service" }).click();
    await page.waitForURL(/\/buyer\/service-requests\/\d+$/);
    const requestId = Number(new URL(page.url()).pathname.split("/").pop());
    const stored = await client.query<{
      kind: string;
      machine_state: string;
      window_end: string;
      equipment_id: number;
    }>("SELECT kind, machine_state, window_end::text, equipment_id FROM service_requests WHERE id = $1", [
      requestId,
    ]);
    await context.close();

    const [year, month, day] = dueOn.split("-").map(Number);
    const dueWords = new Date(Date.UTC(year!, month! - 1, day!)).toLocaleDateString("en-US", {
      month: "short",
      day: "numeric",
      year: "numeric",
      timeZone: "UTC",
    });
    expect(dueText).toContain(dueWords);
    expect(dueText).toMatch(/^Due in \d+ days/);
    expect(overflow).toBeLessThanOrEqual(0);
    expect(problems).toEqual([]);
    expect(stored.rows[0]).toEqual({
      kind: "preventive_maintenance",
      machine_state: "planned",
      window_end: dueOn,
      equipment_id: machineId,
    });
  }, 120_000);
});
