import { mkdtemp, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot, signIn } from "../support/browser.ts";
import { buildTrainingCardPdf } from "../fixtures/build-training-card.ts";
import { DEMO_PASSWORD } from "../../server/db/demo-scenario/index.ts";

const suite = useBrowserSuite();

const OFFICE = "office@kestrel-ridge.test";

describe("a service company's office uploads a workers' compensation exemption", () => {
  it(
    "shows the exemption's caution and sends the technicians ticked as the persons it names",
    { timeout: 90_000 },
    async () => {
      const context = await suite.newContext({ viewport: { width: 390, height: 844 } });
      const page = await context.newPage();
      await signIn(page, suite.url, OFFICE, DEMO_PASSWORD);
      const listed = await context.request.get(`${suite.url}/api/technicians`);
      const technicians = (await listed.json()) as { id: number; name: string; active: boolean }[];
      const named = technicians.find((x) => x.active)!;

      await page.goto(`${suite.url}/provider/documents/new`);
      await page.getByLabel("Type of document").selectOption({ label: "Workers' compensation exemption" });
      const caution = page.getByRole("complementary", { name: "Caution: Workers' compensation exemption" });
      await expect(caution.innerText()).resolves.toContain("only the persons it names");
      await page
        .getByLabel("Type of document")
        .selectOption({ label: "Electrical safety (arc flash) training" });
      await expect(
        page.getByRole("complementary", { name: /^Caution: Electrical safety/ }).innerText(),
      ).resolves.toContain("NFPA 70E 110.6");
      await page.getByLabel("Type of document").selectOption({ label: "Workers' compensation exemption" });

      const folder = await mkdtemp(path.join(tmpdir(), "exemption-"));
      const file = path.join(folder, "exemption.pdf");
      await writeFile(file, (await buildTrainingCardPdf({})).bytes);
      await page.getByLabel("Choose a file").setInputFiles(file);
      const form = page.getByRole("form", { name: "Check the fields" });
      await form.waitFor();
      await form.getByLabel("Name on the exemption").fill("Kestrel Ridge owner");
      await form.getByLabel("State").fill("TX");
      await form.getByLabel("Certificate number").fill("EX-20417");
      await form.getByLabel("Issue date").fill("2026-06-01");
      // The sample PDF is a training card; whatever expiry was read from it is not this exemption's.
      await form.getByLabel("Expiry date").fill("");
      const checklist = form.getByRole("group", { name: "Technicians the exemption names" });
      await checklist.getByLabel(named.name, { exact: true }).check();
      await screenshot(page, "provider-exemption-390");
      await expect(page.evaluate(() => document.documentElement.scrollWidth)).resolves.toBeLessThanOrEqual(
        390,
      );

      const sent = page.waitForRequest((r) => r.method() === "POST" && /\/api\/credentials$/.test(r.url()));
      await form.getByRole("button", { name: "Send for verification" }).click();
      const body = (await sent).postDataJSON() as { fields: { technicianIds: number[] } };
      expect(body.fields.technicianIds).toEqual([named.id]);
      await page.waitForURL((url) => url.pathname === "/provider/documents");
      await context.close();
    },
  );
});
