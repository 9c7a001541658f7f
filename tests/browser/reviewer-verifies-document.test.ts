import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import type { BrowserContext } from "playwright-core";
import pg from "pg";
import { CSRF_HEADER, CSRF_HEADER_VALUE } from "../../shared/api/error-body.ts";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot, signIn } from "../support/browser.ts";
import { seriousAccessibilityProblems } from "../support/axe.ts";
import { writeCertificateFile } from "../support/certificate-file.ts";
import { DEMO_PASSWORD, demoSignIns } from "../../server/db/demo-scenario/index.ts";

const suite = useBrowserSuite();

const office = demoSignIns.find((s) => s.email === "office@kestrel-ridge.test")!;
const reviewer = demoSignIns.find((s) => s.role === "reviewer")!;
const technician = demoSignIns.find((s) => s.email === "tobias@kestrel-ridge.test")!;

/** The office's own upload, through the API with the office's session: this journey starts at the queue. */
async function submitCertificate(context: BrowserContext, seed: number) {
  const certificate = await writeCertificateFile(seed, office.company);
  const headers = { [CSRF_HEADER]: CSRF_HEADER_VALUE };
  const uploaded = await context.request.post(`${suite.url}/api/documents`, {
    headers,
    multipart: {
      typeCode: "general_liability",
      file: {
        name: "general-liability.pdf",
        mimeType: "application/pdf",
        buffer: readFileSync(certificate.file),
      },
    },
  });
  expect(uploaded.status()).toBe(201);
  const { document, extraction } = (await uploaded.json()) as {
    document: { id: number };
    extraction: { fields: Record<string, unknown> };
  };
  const submitted = await context.request.post(`${suite.url}/api/credentials`, {
    headers,
    data: { documentId: document.id, typeCode: "general_liability", fields: extraction.fields },
  });
  expect(submitted.status()).toBe(201);
  return {
    id: ((await submitted.json()) as { id: number }).id,
    expirationDate: certificate.generalLiability.expirationDate,
  };
}

// The policy ends at 12:01 a.m. on its expiration date in the insured's zone (standard policy wording), which is
// still that calendar date in UTC, the headless browser's zone.
const shownDate = (isoDate: string) =>
  new Intl.DateTimeFormat("en-US", {
    month: "short",
    day: "numeric",
    year: "numeric",
    timeZone: "UTC",
  }).format(new Date(`${isoDate}T12:00:00Z`));

async function mailsTo(address: string, subjectStart: string): Promise<number> {
  const client = new pg.Client({ connectionString: suite.server.databaseUrl });
  await client.connect();
  try {
    const { rows } = await client.query<{ n: number }>(
      `SELECT (SELECT count(*) FROM outbox_messages WHERE to_address = $1 AND subject LIKE $2)::int
            + (SELECT count(*) FROM caught_mails WHERE to_address LIKE '%' || $1 || '%' AND subject LIKE $2)::int AS n`,
      [address, `${subjectStart}%`],
    );
    return rows[0]?.n ?? 0;
  } finally {
    await client.end();
  }
}

describe("a compliance reviewer verifies a submitted certificate", () => {
  it("shows the page beside its fields; the office then sees it verified and is told by e-mail, and the technician's standing counts it", async () => {
    const officeContext = await suite.newContext({ viewport: { width: 1280, height: 800 } });
    const officePage = await officeContext.newPage();
    await signIn(officePage, suite.url, office.email, DEMO_PASSWORD);
    const { id: credentialId, expirationDate } = await submitCertificate(officeContext, 77);
    const reviewerContext = await suite.newContext({ viewport: { width: 1440, height: 900 } });
    const page = await reviewerContext.newPage();

    await signIn(page, suite.url, reviewer.email, DEMO_PASSWORD);
    await page.getByRole("heading", { name: "Verification queue" }).waitFor();
    const row = page.getByRole("row").filter({ has: page.locator(`a[href="/review/${credentialId}"]`) });
    await row.waitFor();
    await screenshot(page, "reviewer-verify-1-queue");
    expect(await seriousAccessibilityProblems(page)).toEqual([]);
    await row.getByRole("link", { name: "Commercial general liability" }).click();
    await page.waitForURL((url) => url.pathname === `/review/${credentialId}`);
    const pageImage = page.getByRole("img", { name: /^Page 1 of / });
    await pageImage.waitFor();
    await page.waitForFunction(() =>
      Array.from(document.images).some((img) => img.alt.startsWith("Page 1") && img.naturalWidth > 0),
    );
    await screenshot(page, "reviewer-verify-2-side-by-side");

    await expect(page.getByLabel("Policy number").inputValue()).resolves.not.toBe("");
    await expect(page.getByLabel("Expiration date").inputValue()).resolves.toMatch(/^\d{4}-\d{2}-\d{2}$/);
    expect(await seriousAccessibilityProblems(page)).toEqual([]);
    await page.locator("body").click({ position: { x: 5, y: 5 } });
    await page.keyboard.press("v");
    await page.waitForURL((url) => url.pathname !== `/review/${credentialId}`);
    await screenshot(page, "reviewer-verify-3-next");

    await officePage.goto(`${suite.url}/provider/documents`);
    await officePage.getByRole("heading", { name: "Credentials" }).waitFor();
    await screenshot(officePage, "reviewer-verify-4-office-documents");
    const verifiedState = await officeContext.request.get(`${suite.url}/api/credentials/${credentialId}`);
    expect(((await verifiedState.json()) as { state: string }).state).toBe("verified");
    const newPolicy = officePage
      .getByRole("row")
      .filter({ hasText: "Commercial general liability" })
      .filter({ hasText: shownDate(expirationDate) });
    await expect(newPolicy.getByText("Verified", { exact: true }).count()).resolves.toBe(1);
    expect(await mailsTo(office.email, "Verified: Commercial general liability")).toBeGreaterThanOrEqual(1);
    await officeContext.close();
    await reviewerContext.close();

    const phone = await suite.newContext({ viewport: { width: 390, height: 844 } });
    const technicianPage = await phone.newPage();
    await signIn(technicianPage, suite.url, technician.email, DEMO_PASSWORD);
    const liability = technicianPage.getByRole("listitem").filter({ hasText: "General liability in force" });
    await liability.waitFor();
    await screenshot(technicianPage, "reviewer-verify-5-technician-standing-390");
    await expect(liability.innerText()).resolves.toContain(shownDate(expirationDate));
    await expect(
      technicianPage.evaluate(() => document.documentElement.scrollWidth),
    ).resolves.toBeLessThanOrEqual(390);
    expect(await seriousAccessibilityProblems(technicianPage)).toEqual([]);
    await phone.close();
  });
});
