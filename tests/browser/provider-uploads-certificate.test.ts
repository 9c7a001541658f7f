import { describe, expect, it } from "vitest";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot, signIn } from "../support/browser.ts";
import { seriousAccessibilityProblems } from "../support/axe.ts";
import { writeCertificateFile } from "../support/certificate-file.ts";
import { DEMO_PASSWORD, demoSignIns } from "../../server/db/demo-scenario/index.ts";

const suite = useBrowserSuite();

const office = demoSignIns.find((s) => s.email === "office@kestrel-ridge.test")!;
const dollars = (amount: number | undefined) => (amount ?? 0).toLocaleString("en-US");

// A desktop office screen and a 390 px phone (a common phone width: common practice).
const widths = [
  { name: "desktop", seed: 41, viewport: { width: 1280, height: 800 } },
  { name: "phone", seed: 42, viewport: { width: 390, height: 844 } },
] as const;

describe("a service company's office uploads a certificate of insurance", () => {
  it.each(widths)(
    "pre-fills every coverage the PDF lists and sends them together ($name)",
    async ({ name, seed, viewport }) => {
      const certificate = await writeCertificateFile(seed, office.company);
      const context = await suite.newContext({ viewport });
      const page = await context.newPage();
      await signIn(page, suite.url, office.email, DEMO_PASSWORD);
      await page.getByRole("heading", { name: "Dashboard" }).waitFor();
      await screenshot(page, `provider-upload-${name}-1-dashboard`);
      expect(await seriousAccessibilityProblems(page)).toEqual([]);

      await page.goto(`${suite.url}/provider/documents/new`);
      await page.getByLabel("Type of document").selectOption({ label: "Commercial general liability" });
      await screenshot(page, `provider-upload-${name}-2-choose`);
      expect(await seriousAccessibilityProblems(page)).toEqual([]);
      await page.getByLabel("Choose a file").setInputFiles(certificate.file);
      const form = page.getByRole("form", { name: "Check the coverages" });
      await form.waitFor();
      // The certificate prints four coverages; each is proposed on the same form.
      const gl = form.getByRole("region", { name: "Commercial general liability" });
      await screenshot(page, `provider-upload-${name}-3-fields`);

      const written = certificate.generalLiability;
      await expect(gl.getByLabel("Policy number", { exact: true }).inputValue()).resolves.toBe(
        written.policyNumber,
      );
      await expect(gl.getByLabel("Effective date", { exact: true }).inputValue()).resolves.toBe(
        written.effectiveDate,
      );
      await expect(gl.getByLabel("Expiration date", { exact: true }).inputValue()).resolves.toBe(
        written.expirationDate,
      );
      await expect(gl.getByLabel("Each occurrence").inputValue()).resolves.toBe(
        dollars(written.limits.eachOccurrence),
      );
      await expect(gl.getByLabel("General aggregate").inputValue()).resolves.toBe(
        dollars(written.limits.generalAggregate),
      );
      expect(await seriousAccessibilityProblems(page)).toEqual([]);

      await form.getByRole("button", { name: "Send 4 coverages for verification" }).click();
      await page.waitForURL((url) => url.pathname === "/provider/documents");
      const sent = page.getByRole("status").filter({ hasText: "were sent for verification" });
      await sent.waitFor();
      await screenshot(page, `provider-upload-${name}-4-documents`);

      await expect(sent.innerText()).resolves.toContain("Commercial general liability");
      await expect(sent.innerText()).resolves.toContain("Automobile liability");
      const waiting = page
        .getByRole("row")
        .filter({ hasText: "Commercial general liability" })
        .filter({ hasText: "Awaiting verification" });
      await expect(waiting.count()).resolves.toBeGreaterThanOrEqual(1);
      expect(await seriousAccessibilityProblems(page)).toEqual([]);
      await context.close();
    },
  );
});
