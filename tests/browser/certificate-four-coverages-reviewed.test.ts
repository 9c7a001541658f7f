import { describe, expect, it } from "vitest";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot, signIn } from "../support/browser.ts";
import { writeCertificateFile } from "../support/certificate-file.ts";
import { DEMO_PASSWORD, demoSignIns } from "../../server/db/demo-scenario/index.ts";

const suite = useBrowserSuite();

const office = demoSignIns.find((s) => s.email === "office@kestrel-ridge.test")!;
const reviewer = demoSignIns.find((s) => s.role === "reviewer")!;
const buyer = demoSignIns.find((s) => s.role === "buyer")!;
const coverageCodes = ["general_liability", "auto_liability", "umbrella_liability", "workers_comp"] as const;
const coverageNames = [
  "Commercial general liability",
  "Automobile liability",
  "Umbrella / excess liability",
  "Workers' compensation and employer's liability",
];

describe("one certificate with four coverages, from upload to decisions", () => {
  it("is sent as four coverages; the reviewer verifies three and returns one, each on its own", async () => {
    // Every coverage in force today, so a verified one is listed to buyers and only the returned one is missing.
    const certificate = await writeCertificateFile(51, office.company, new Date(), {
      everyCoverageInForce: true,
    });
    const officeContext = await suite.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await officeContext.newPage();
    await signIn(page, suite.url, office.email, DEMO_PASSWORD);
    await page.goto(`${suite.url}/provider/documents/new`);
    await page.getByLabel("Type of document").selectOption({ label: "Commercial general liability" });
    await page.getByLabel("Choose a file").setInputFiles(certificate.file);
    const form = page.getByRole("form", { name: "Check the coverages" });
    await form.waitFor();

    const sections = coverageNames.map((name) => form.getByRole("region", { name }));
    for (const section of sections) {
      await expect(section.getByLabel("Policy number", { exact: true }).inputValue()).resolves.not.toBe("");
    }
    await screenshot(page, "four-coverages-1-form");
    await form.getByRole("button", { name: "Send 4 coverages for verification" }).click();
    await page.getByRole("status").filter({ hasText: "were sent for verification" }).waitFor();
    await officeContext.close();

    const reviewerContext = await suite.newContext({ viewport: { width: 1280, height: 900 } });
    const review = await reviewerContext.newPage();
    await signIn(review, suite.url, reviewer.email, DEMO_PASSWORD);
    const queue = await reviewerContext.request.get(
      `${suite.url}/api/review/queue?pageSize=100&sort=submittedAt&dir=desc`,
    );
    const rows = (
      (await queue.json()) as { rows: { id: number; typeName: string; companyName: string }[] }
    ).rows
      .filter((row) => row.companyName === office.company)
      .slice(0, 4);
    const idOf = (name: string) => rows.find((row) => row.typeName === name)!.id;

    await review.goto(`${suite.url}/review/${idOf(coverageNames[0]!)}`);
    const siblings = review.getByRole("navigation", { name: "Coverages on this document" });
    await siblings.waitFor();
    await expect(siblings.getByRole("listitem").count()).resolves.toBe(4);
    // Focusing a field shows where on the page its value was read.
    await review.getByLabel("Policy number", { exact: true }).focus();
    await review.getByTestId("read-here").waitFor();
    await screenshot(review, "four-coverages-2-review");
    for (const name of coverageNames.slice(0, 3)) {
      await review.goto(`${suite.url}/review/${idOf(name)}`);
      await review.getByRole("button", { name: "Verify", exact: true }).click();
      await review.waitForURL((url) => !url.pathname.endsWith(`/review/${idOf(name)}`));
    }
    await review.goto(`${suite.url}/review/${idOf(coverageNames[3]!)}`);
    await review
      .getByLabel("Reason for returning")
      .fill("The employer's liability limits are cut off; send the full page.");
    await review.getByRole("button", { name: "Return to uploader" }).click();
    await review.waitForURL((url) => !url.pathname.endsWith(`/review/${idOf(coverageNames[3]!)}`));

    await review.goto(`${suite.url}/review/${idOf(coverageNames[0]!)}`);
    const decided = review.getByRole("navigation", { name: "Coverages on this document" });
    await decided.waitFor();
    await screenshot(review, "four-coverages-3-decided");
    await expect(decided.locator('[data-status="verified"]').count()).resolves.toBe(3);
    await expect(decided.locator('[data-status="returned"]').count()).resolves.toBe(1);
    await reviewerContext.close();

    // A buyer sees the company's three verified coverages on its technician's page; the returned one is absent.
    const buyerContext = await suite.newContext({ viewport: { width: 1280, height: 900 } });
    const shop = await buyerContext.newPage();
    await signIn(shop, suite.url, buyer.email, DEMO_PASSWORD);
    const found = await buyerContext.request.get(
      `${suite.url}/api/directory?limit=50&q=${encodeURIComponent(office.company)}`,
    );
    const listed = ((await found.json()) as { rows: { technicianId: number; companyName: string }[] }).rows;
    const technicianId = listed.find((row) => row.companyName === office.company)!.technicianId;
    await shop.goto(`${suite.url}/directory/technicians/${technicianId}`);
    const onFile = shop.getByRole("region", { name: "Verified credentials" });
    await onFile.waitFor();
    const policies = coverageCodes.map((code) => certificate.coverages[code]!.policyNumber);
    for (const policy of policies.slice(0, 3))
      await expect(onFile.getByText(policy, { exact: true }).count()).resolves.toBe(1);
    await expect(onFile.getByText(policies[3]!, { exact: true }).count()).resolves.toBe(0);
    await screenshot(shop, "four-coverages-4-directory");
    await buyerContext.close();
  }, 120_000);
});
