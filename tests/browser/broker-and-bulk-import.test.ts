import { describe, expect, it } from "vitest";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot, signIn } from "../support/browser.ts";
import { seriousAccessibilityProblems } from "../support/axe.ts";
import { DEMO_PASSWORD, demoSignIns } from "../../server/db/demo-scenario/index.ts";

const suite = useBrowserSuite();

const office = demoSignIns.find((s) => s.email === "office@kestrel-ridge.test")!;

// A spreadsheet export whose name column is headed differently from the template, so it must be matched by hand;
// quoted fields with commas as RFC 4180 §2 allows. 53202 and 60601 are real ZIP codes; 00000 is none.
const csv = [
  "Full name,E-mail,ZIP,Technologies,Service radius (miles),Hourly rate ($),Travel rate ($)",
  '"Thandiwe Okafor-Reyes",thandiwe.import@example.test,53202,"Mill;Lathe",120,145,95',
  "Birgit Halvorsen-Mba,,60601,Grinder,80,130,90",
  "Casimir Dunleavy-Oduya,,00000,Mill,50,120,80",
].join("\r\n");

describe("a service company's office imports technicians from a CSV", () => {
  it("matches the columns, previews each row's problems and imports the good rows", async () => {
    const context = await suite.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    await signIn(page, suite.url, office.email, DEMO_PASSWORD);
    await page.getByRole("heading", { name: "Dashboard" }).waitFor();

    await page.goto(`${suite.url}/provider/technicians`);
    await page.getByRole("link", { name: "Import from CSV" }).click();
    await page.getByRole("heading", { name: "Import technicians" }).waitFor();
    await page.getByLabel("Spreadsheet (.xlsx or CSV)").setInputFiles({
      name: "roster.csv",
      mimeType: "text/csv",
      buffer: Buffer.from(csv),
    });
    await page.getByRole("heading", { name: "Match the columns" }).waitFor();
    // "Full name" does not match the template's "Name", so it starts unmatched.
    await expect(page.getByLabel("Name", { exact: true }).inputValue()).resolves.toBe("");
    await expect(page.getByLabel("ZIP", { exact: true }).inputValue()).resolves.toBe("ZIP");
    await page.getByLabel("Name", { exact: true }).selectOption("Full name");
    await screenshot(page, "bulk-import-1-mapping");
    expect(await seriousAccessibilityProblems(page)).toEqual([]);

    await page.getByRole("button", { name: "Check rows" }).click();
    await page.getByRole("heading", { name: "Preview" }).waitFor();
    await expect(page.getByText("2 rows are ready to import").isVisible()).resolves.toBe(true);
    const problems = page.getByRole("table", { name: "Rows with problems" });
    await expect(problems.getByRole("row").count()).resolves.toBe(2);
    await expect(problems.getByText("ZIP: 00000 is not a known US ZIP code").isVisible()).resolves.toBe(true);
    await screenshot(page, "bulk-import-2-preview");
    expect(await seriousAccessibilityProblems(page)).toEqual([]);

    await page.getByRole("button", { name: "Import 2 technicians" }).click();
    await page.getByRole("heading", { name: "Import report" }).waitFor();
    await expect(page.getByText("Imported 2, invited 1 by e-mail, left out 1.").isVisible()).resolves.toBe(
      true,
    );
    await screenshot(page, "bulk-import-3-report");

    await page.getByRole("link", { name: "Back to technicians" }).click();
    await page.getByRole("heading", { name: "Technicians" }).waitFor();
    // The list refetches after the import; wait for the imported name rather than reading the first paint.
    await page.getByText("Thandiwe Okafor-Reyes").first().waitFor();
    await expect(page.getByText("Casimir Dunleavy-Oduya").count()).resolves.toBe(0);
    await context.close();
  }, 120_000);
});
