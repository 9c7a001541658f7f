import { afterAll, beforeAll, describe, expect, it } from "vitest";
import pg from "pg";
import type { Page } from "playwright-core";
import { seriousAccessibilityProblems } from "../support/axe.ts";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot } from "../support/browser.ts";
import { addCalendarDays } from "../../shared/standing/iso-date.ts";
import { tinyPng } from "../fixtures/build-service-request-world.ts";

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
async function addSiteWithMill() {
  const { rows } = await client.query<{ company_id: number }>(
    "SELECT company_id FROM users WHERE email = $1",
    [BUYER],
  );
  const site = await client.query<{ id: number }>(
    `INSERT INTO sites (company_id, name, address_line, postal_code, time_zone, latitude, longitude)
     VALUES ($1, 'Marlow east bay', '18 Quarry Lane', '60601', 'America/Chicago', 41.8858, -87.6181) RETURNING id`,
    [rows[0]!.company_id],
  );
  await client.query(
    `INSERT INTO equipment (site_id, builder, control_family, technology, model, serial_number)
     VALUES ($1, 'Vantor Machine Works', 'Kestle 40', 'mill', 'VM-40 vertical mill', 'VM40-7781')`,
    [site.rows[0]!.id],
  );
}

/** The office admin of each invited company, and a technician of it who is cleared for the baseline and serves mills. */
async function invitedCompanies(requestId: number) {
  const { rows } = await client.query<{
    company_id: number;
    company: string;
    email: string;
    technician: string;
  }>(
    `SELECT i.company_id, c.name AS company, min(u.email) AS email, min(t.name) AS technician
       FROM service_request_invitations i JOIN companies c ON c.id = i.company_id
       JOIN users u ON u.company_id = i.company_id AND u.role = 'provider_admin' AND u.active
       JOIN technicians t ON t.company_id = i.company_id AND t.active AND t.technologies @> ARRAY['mill']::varchar[]
       JOIN technician_standings s ON s.technician_id = t.id AND s.requirement_set_id IS NULL AND s.standing IN ('cleared','lapsing')
      WHERE i.request_id = $1 GROUP BY i.company_id, c.name ORDER BY i.company_id`,
    [requestId],
  );
  return rows;
}

async function sendEstimate(page: Page, technician: string, hours: string) {
  await page.getByLabel("Technician").selectOption({ label: technician });
  await page.getByLabel("Hours on site").fill(hours);
  await page
    .getByLabel("Earliest arrival")
    .fill(`${addCalendarDays(new Date().toISOString().slice(0, 10), 1)}T09:30`);
  await page.getByLabel("Part to bring or order").fill("Spindle drive fuse kit");
  await page.getByLabel("Part price ($, if known)").fill("42.00");
  await page
    .getByLabel("Valid until", { exact: true })
    .fill(addCalendarDays(new Date().toISOString().slice(0, 10), 14));
}

describe("a buyer with a machine down asks every cleared company at once", () => {
  it("raises the request with a photo, gets two estimates (one revised), compares and accepts one", async () => {
    await addSiteWithMill();
    const buyer = await suite.signedInPage(BUYER);

    await buyer.goto(`${suite.url}/buyer/service-requests/new`);
    await buyer.getByLabel("Site", { exact: true }).selectOption({ label: "Marlow east bay" });
    await buyer
      .getByLabel("Machine", { exact: true })
      .selectOption({ label: "Vantor Machine Works VM-40 vertical mill (Kestle 40)" });
    await buyer.getByLabel("Machine state").selectOption("down");
    await buyer.getByLabel("What is wrong").fill("won't power on");
    await buyer
      .getByLabel("Photos or documents")
      .setInputFiles({ name: "panel.png", mimeType: "image/png", buffer: tinyPng() });
    await buyer.getByRole("button", { name: "Check who it reaches" }).click();
    const reach = await buyer.getByTestId("reach-count").textContent();
    await screenshot(buyer, "service-request-1-new");
    await buyer.getByRole("button", { name: "Send request" }).click();
    await buyer.waitForURL(/\/buyer\/service-requests\/\d+$/);
    const requestId = Number(new URL(buyer.url()).pathname.split("/").pop());

    expect(reach).toMatch(/It will reach [2-9]\d* companies/);
    await buyer.getByRole("img", { name: "panel.png" }).waitFor();
    const [first, second] = await invitedCompanies(requestId);
    expect(first).toBeDefined();
    expect(second).toBeDefined();

    // The first company answers from a phone, then revises.
    const phone = await suite.signedInPage(first!.email, { viewport: { width: 390, height: 900 } });
    await phone.goto(`${suite.url}/provider/service-requests/${requestId}`);
    await phone.getByText("Chicago, IL 60601").first().waitFor();
    await expect(phone.getByText("18 Quarry Lane").count()).resolves.toBe(0);
    await sendEstimate(phone, first!.technician, "2");
    await phone.getByRole("button", { name: "Send estimate" }).click();
    await phone.getByText(/Revision 1:/).waitFor();
    const overflow = await phone.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    await screenshot(phone, "service-request-2-estimate-390");
    expect(overflow).toBeLessThanOrEqual(0);
    await expect(seriousAccessibilityProblems(phone)).resolves.toEqual([]);
    await phone.getByLabel("Hours on site").fill("3");
    await phone.getByRole("button", { name: "Send revision" }).click();
    await phone.getByText(/Revision 2:/).waitFor();

    const other = await suite.signedInPage(second!.email);
    await other.goto(`${suite.url}/provider/service-requests/${requestId}`);
    await sendEstimate(other, second!.technician, "2");
    await other.getByRole("button", { name: "Send estimate" }).click();
    await other.getByText(/Revision 1:/).waitFor();

    await buyer.reload();
    const table = buyer.getByRole("table");
    await table.getByRole("row").nth(2).waitFor();
    await expect(table.getByText(first!.company, { exact: true }).count()).resolves.toBe(1);
    await expect(table.getByText(second!.company, { exact: true }).count()).resolves.toBe(1);
    await screenshot(buyer, "service-request-3-compare");
    await expect(seriousAccessibilityProblems(buyer)).resolves.toEqual([]);
    await table.getByRole("button", { name: `Accept ${first!.company}` }).click();
    await buyer.getByRole("link", { name: /work order #\d+/ }).waitFor();

    await phone.reload();
    await phone.getByRole("link", { name: /work order #\d+/ }).click();
    await phone.waitForURL(/\/work-orders\/\d+$/);
    await other.reload();
    await other.getByText("The shop chose another estimate this time.").waitFor();
    await expect(other.getByRole("link", { name: /work order #\d+/ }).count()).resolves.toBe(0);
  }, 240_000);
});
