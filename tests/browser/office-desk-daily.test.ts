import { beforeAll, describe, expect, it } from "vitest";
import { Jimp } from "jimp";
import { writeFile } from "node:fs/promises";
import path from "node:path";
import { QueryTypes } from "sequelize";
import type { Page } from "playwright-core";
import { seriousAccessibilityProblems } from "../support/axe.ts";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot } from "../support/browser.ts";
import { buildSizedPdf } from "../fixtures/build-sized-pdf.ts";
import { db } from "../../server/db/sequelize.ts";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../shared/api/error-body.ts";
import { THUMBNAIL_MAX_PX } from "../../server/work-orders/attachment-thumbnail.ts";

const BUYER = "buyer@marlow-precision.test";
const OFFICE = "office@kestrel-ridge.test";
const REVIEWER = "reviewer@clearbench.test";
const TECHNICIAN = "Tobias Wren";
const TECHNICIAN_SIGN_IN = "tobias@kestrel-ridge.test";
const SAFETY = "Cleared is about documents, not safety or skill";
const CERTIFICATE = "About certificates of insurance";
// A desktop office screen and a 390 px phone (a common phone width: common practice).
const WIDTHS = [
  { name: "desktop", viewport: { width: 1280, height: 900 } },
  { name: "phone", viewport: { width: 390, height: 844 } },
] as const;

let facts: { technicianId: number; siteId: number; equipmentId: number; renewalId: number };

const one = async <T extends object>(sql: string, bind: unknown[] = []): Promise<T> => {
  const rows = await db().query<T>(sql, { bind, type: QueryTypes.SELECT });
  if (!rows[0]) throw new Error(`no row for ${sql}`);
  return rows[0];
};

const suite = useBrowserSuite();
beforeAll(async () => {
  const technician = await one<{ id: number }>("SELECT id FROM technicians WHERE name = $1", [TECHNICIAN]);
  const shop = await one<{ company_id: number }>("SELECT company_id FROM users WHERE email = $1", [BUYER]);
  const site = await one<{ id: number }>(
    `INSERT INTO sites (company_id, name, address_line, postal_code, time_zone, latitude, longitude)
     VALUES ($1, 'Desk check bay', '12 Gantry Lane', '61101', 'America/Chicago', 42.2711, -89.094) RETURNING id`,
    [shop.company_id],
  );
  const equipment = await one<{ id: number }>(
    `INSERT INTO equipment (site_id, builder, control_family, technology, model, serial_number)
     VALUES ($1, 'Corvane Machine Co.', 'Kestle 40', 'mill', 'Corvane V-560', 'CV560-7781') RETURNING id`,
    [site.id],
  );
  // The demo's Copperline general liability renewal waits for a reviewer while the lapsed policy is on file verified.
  const renewal = await one<{ id: number }>(
    `SELECT c.id FROM credentials c JOIN companies co ON co.id = c.company_id
      WHERE co.name LIKE 'Copperline%' AND c.type_code = 'general_liability' AND c.state = 'submitted'
      ORDER BY c.id LIMIT 1`,
  );
  facts = { technicianId: technician.id, siteId: site.id, equipmentId: equipment.id, renewalId: renewal.id };
}, 180_000);

const api = (page: Page) => ({
  post: (url: string, options: Parameters<Page["request"]["post"]>[1] = {}) =>
    page.request.post(`${suite.url}${url}`, {
      ...options,
      headers: { [CSRF_HEADER]: CSRF_HEADER_VALUE, ...(options.headers ?? {}) },
    }),
});

async function fitsAndIsClean(page: Page, viewport: { width: number }) {
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(viewport.width);
  expect(await seriousAccessibilityProblems(page)).toEqual([]);
}

const cautions = (page: Page, name: string) => page.getByRole("complementary", { name }).count();

describe("the service office's daily desk", () => {
  for (const { name, viewport } of WIDTHS) {
    it(`lists a new work order on the dashboard and in the bell, with a thumbnail in its thread (${name})`, async () => {
      const buyer = await suite.signedInPage(BUYER, { viewport: viewport });
      const raised = await api(buyer).post("/api/work-orders", {
        data: {
          technicianId: facts.technicianId,
          siteId: facts.siteId,
          equipmentId: facts.equipmentId,
          problem: `Way covers jam at the end of X travel (${name}).`,
          urgency: "high",
          preferredDates: [new Date(Date.now() + 3 * 86_400_000).toISOString().slice(0, 10)],
        },
      });
      expect(raised.status()).toBe(201);
      const workOrderId = ((await raised.json()) as { id: number }).id;
      const photo = await new Jimp({ width: 900, height: 600, color: 0x557799ff }).getBuffer("image/png");
      const posted = await api(buyer).post(`/api/work-orders/${workOrderId}/messages`, {
        multipart: {
          body: "The jammed way cover",
          file: { name: "way-cover.png", mimeType: "image/png", buffer: photo },
        },
      });
      expect(posted.status()).toBe(201);

      const office = await suite.signedInPage(OFFICE, { viewport: viewport });
      await office.goto(`${suite.url}/provider`);
      const toAnswer = office.getByRole("region", { name: /Work orders to answer/ });
      await toAnswer.getByRole("link", { name: `Work order #${workOrderId}` }).waitFor();
      expect(await cautions(office, CERTIFICATE)).toBe(0);
      await screenshot(office, `office-desk-${name}-1-dashboard`);
      await fitsAndIsClean(office, viewport);

      const bell = office.getByRole("button", { name: /^Notifications, \d+ unread$/ });
      expect(Number(/(\d+) unread/.exec((await bell.getAttribute("aria-label")) ?? "")?.[1])).toBeGreaterThan(
        0,
      );
      await bell.click();
      await office
        .getByRole("link", { name: new RegExp(`Work order #${workOrderId}: `) })
        .first()
        .waitFor();
      await screenshot(office, `office-desk-${name}-2-bell`);
      await bell.click();

      await office.goto(`${suite.url}/work-orders/${workOrderId}`);
      const thumbnail = office.locator(
        `img[src$="/messages/${((await posted.json()) as { id: number }).id}/thumbnail"]`,
      );
      await thumbnail.waitFor();
      await office.waitForFunction(
        (src) => (document.querySelector(`img[src$="${src}"]`) as HTMLImageElement | null)?.complete === true,
        `/thumbnail`,
      );
      const natural = await thumbnail.evaluate((img: HTMLImageElement) => [
        img.naturalWidth,
        img.naturalHeight,
      ]);
      expect(Math.max(...natural)).toBeLessThanOrEqual(THUMBNAIL_MAX_PX);
      expect(natural[0]).toBeGreaterThan(0);
      await office.getByRole("link", { name: /way-cover\.png \(Image, \d+(\.\d)? KB\)/ }).waitFor();
      // The safety caution stands where the work is answered, folded to two lines until opened.
      expect(await cautions(office, SAFETY)).toBe(1);
      const safety = office.getByRole("complementary", { name: SAFETY });
      await expect(safety.getByText("29 CFR 1910.147", { exact: false }).isVisible()).resolves.toBe(false);
      await safety.getByText("The safety rules it never replaces").click();
      await expect(safety.getByText("29 CFR 1910.147", { exact: false }).isVisible()).resolves.toBe(true);
      await screenshot(office, `office-desk-${name}-3-thread`);
      await fitsAndIsClean(office, viewport);

      await office.goto(`${suite.url}/provider/documents`);
      await office.getByRole("heading", { level: 1 }).first().waitFor();
      expect(await cautions(office, CERTIFICATE)).toBe(0);
    }, 240_000);

    it(`previews a card beside its fields and keeps the technician as holder (${name})`, async () => {
      const card = path.join(process.env.TMPDIR ?? "/tmp", `blank-card-${name}.pdf`);
      // A page with no name on it: the holder name then starts from the chosen technician's record.
      await writeFile(card, await buildSizedPdf([[612, 792]]));
      const office = await suite.signedInPage(OFFICE, { viewport: viewport });

      await office.goto(`${suite.url}/provider/documents/new?technicianId=${facts.technicianId}`);
      await office.getByLabel("Type of document").selectOption({ label: "First aid / CPR / AED" });
      await expect(office.getByLabel("Whose card is it?").inputValue()).resolves.toBe(
        String(facts.technicianId),
      );
      await office.getByLabel("Choose a file").setInputFiles(card);
      await office.getByRole("form", { name: "Check the fields" }).waitFor();

      await expect(office.getByTestId("upload-holder").textContent()).resolves.toBe(`Held by ${TECHNICIAN}`);
      await expect(office.getByLabel("Name on the card").inputValue()).resolves.toBe(TECHNICIAN);
      const preview = office.getByRole("img", { name: /^Page 1 of blank-card/ });
      await preview.waitFor();
      await office.waitForFunction(() =>
        [...document.querySelectorAll("img")].some(
          (i) => i.alt.startsWith("Page 1 of") && i.naturalWidth > 0,
        ),
      );
      expect(await office.getByRole("img", { name: /^Page 2 of/ }).count()).toBe(0);
      await screenshot(office, `office-desk-${name}-4-upload-preview`);
      await fitsAndIsClean(office, viewport);
    }, 240_000);

    it(`keeps a technician's own card in their name, with the name on the card started from it (${name})`, async () => {
      const card = path.join(process.env.TMPDIR ?? "/tmp", `own-card-${name}.pdf`);
      await writeFile(card, await buildSizedPdf([[612, 792]]));
      const technician = await suite.signedInPage(TECHNICIAN_SIGN_IN, { viewport: viewport });

      await technician.goto(`${suite.url}/technician/upload-card`);
      await technician.getByLabel("Type of document").selectOption({ label: "First aid / CPR / AED" });
      await technician.getByLabel("Choose a file").setInputFiles(card);
      await technician.getByRole("form", { name: "Check the fields" }).waitFor();

      await expect(technician.getByTestId("upload-holder").textContent()).resolves.toBe(
        `Held by ${TECHNICIAN}`,
      );
      await expect(technician.getByLabel("Name on the card").inputValue()).resolves.toBe(TECHNICIAN);
      await technician.getByRole("img", { name: /^Page 1 of own-card/ }).waitFor();
      await screenshot(technician, `office-desk-${name}-6-own-card`);
      await fitsAndIsClean(technician, viewport);
    }, 240_000);

    it(`offers ready-made return reasons and shows what changed since the verified policy (${name})`, async () => {
      const reviewer = await suite.signedInPage(REVIEWER, { viewport: viewport });

      await reviewer.goto(`${suite.url}/review/${facts.renewalId}`);
      const comparison = reviewer.getByRole("region", { name: "Compared with the last verified version" });
      await comparison.waitFor();
      await comparison.getByRole("rowheader", { name: "Expiration date" }).waitFor();
      expect(await cautions(reviewer, CERTIFICATE)).toBe(1);
      expect(await cautions(reviewer, SAFETY)).toBe(0);

      const ready = reviewer.getByLabel("Start from a ready-made reason");
      const firstReason = (await ready.locator("option").nth(1).textContent())!;
      await ready.selectOption({ index: 1 });
      const box = reviewer.getByLabel("Reason for returning");
      await expect(box.inputValue()).resolves.toBe(firstReason);
      await box.fill(`${firstReason} The policy number is cut off as well.`);
      await expect(box.inputValue()).resolves.toContain("cut off as well");
      await screenshot(reviewer, `office-desk-${name}-5-review`);
      await fitsAndIsClean(reviewer, viewport);
    }, 240_000);
  }
});
