import { describe, expect, it } from "vitest";
import pg from "pg";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot, signIn } from "../support/browser.ts";
import { seriousAccessibilityProblems } from "../support/axe.ts";
import { writeCertificateFile } from "../support/certificate-file.ts";
import { DEMO_PASSWORD, demoSignIns } from "../../server/db/demo-scenario/index.ts";

const suite = useBrowserSuite();

const office = demoSignIns.find((s) => s.email === "office@kestrel-ridge.test")!;
const brokerEmail = "wren.halloway@brightwater-agency.test";

/** The link as queued in the outbox for the broker: the token exists nowhere else. */
async function linkMailedToBroker(databaseUrl: string): Promise<string> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    const { rows } = await client.query<{ text_body: string }>(
      "SELECT text_body FROM outbox_messages WHERE to_address = $1 ORDER BY id DESC LIMIT 1",
      [brokerEmail],
    );
    const link = /https?:\/\/\S+\/broker-upload\/[A-Za-z0-9_-]+/.exec(rows[0]?.text_body ?? "")?.[0];
    expect(link).toBeDefined();
    return link!;
  } finally {
    await client.end();
  }
}

describe("a broker uploads a certificate through the office's link", () => {
  it("records the broker, sends the link, takes one PDF without an account, and refuses the link after", async () => {
    const context = await suite.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    await signIn(page, suite.url, office.email, DEMO_PASSWORD);
    await page.goto(`${suite.url}/provider/documents`);
    const panel = page.getByRole("region", { name: "Certificates from your broker" });
    await panel.getByLabel("Agency").fill("Brightwater Insurance Agency");
    await panel.getByLabel("Contact").fill("Wren Halloway");
    await panel.getByLabel("E-mail").fill(brokerEmail);
    await panel.getByRole("button", { name: "Save broker" }).click();
    await panel.getByRole("status").filter({ hasText: "Saved." }).waitFor();
    await panel.getByLabel("Ask for a renewed certificate of").selectOption({ index: 1 });
    await panel.getByRole("button", { name: "Send the broker a link" }).click();
    await panel.getByText(/from Wren Halloway \(Brightwater Insurance Agency\).*waiting/).waitFor();
    expect(await seriousAccessibilityProblems(page)).toEqual([]);
    await screenshot(page, "broker-1-office-sent");
    await context.close();

    // The broker: a fresh browser with no session, only the link from the e-mail.
    const link = (await linkMailedToBroker(suite.server.databaseUrl)).replace(/^https?:\/\/[^/]+/, suite.url);
    const broker = await suite.newContext({ viewport: { width: 390, height: 844 } });
    const brokerPage = await broker.newPage();
    await brokerPage.goto(link);
    await brokerPage.getByRole("heading", { name: "Upload a certificate of insurance" }).waitFor();
    expect(await seriousAccessibilityProblems(brokerPage)).toEqual([]);
    const certificate = await writeCertificateFile(71, office.company);
    await brokerPage.getByLabel("Certificate (PDF)").setInputFiles(certificate.file);
    await brokerPage.getByRole("button", { name: "Send the certificate" }).click();
    await brokerPage.getByRole("heading", { name: "Certificate received" }).waitFor();
    await screenshot(brokerPage, "broker-2-received");

    await brokerPage.goto(link);
    await brokerPage.getByRole("heading", { name: "This link no longer works" }).waitFor();
    await expect(brokerPage.getByText("already used").count()).resolves.toBe(1);
    await broker.close();
  });
});
