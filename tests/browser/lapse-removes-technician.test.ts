import { describe, expect, it } from "vitest";
import { DateTime } from "luxon";
import { QueryTypes } from "sequelize";
import request from "supertest";
import type { Page } from "playwright-core";
import { seriousAccessibilityProblems } from "../support/axe.ts";
import { useBrowserSuite } from "../support/browser-suite.ts";
import { screenshot } from "../support/browser.ts";
import { useMailCatcher } from "../support/mail-catcher.ts";
import { certificateFields } from "../support/submit-credential.ts";
import { buildCertificatePdf, type CoverageCode } from "../fixtures/build-certificate-pdf.ts";
import { runLapseJob } from "../../jobs/lapse.ts";
import { db } from "../../server/db/sequelize.ts";

const BUYER = "buyer@marlow-precision.test";
const PROVIDER = "office@kestrel-ridge.test";
const TECHNICIAN_USER = "tobias@kestrel-ridge.test";
const REVIEWER = "reviewer@clearbench.test";
const TECHNICIAN = "Tobias Wren";
// Downtown Chicago: Kestrel Ridge's technicians are based within about 37 miles of it (demo scenario).
const SITE_ZIP = "60601";
const RADIUS_MILES = "62";
// America/Chicago's standard offset (CST, UTC-6), used all year for the policy cut-off (standard time all year, ISO CG DS 01 wording, from memory).
const CHICAGO_STANDARD_TIME = "UTC-6";

const suite = useBrowserSuite();
const catcher = useMailCatcher();

async function rows<T extends object>(sql: string, bind: unknown[] = []): Promise<T[]> {
  return db().query<T>(sql, { bind, type: QueryTypes.SELECT });
}

/** Uploads a certificate naming Kestrel Ridge whose one coverage line runs over the given dates, and submits it. */
async function submitRenewal(
  agent: ReturnType<typeof request.agent>,
  code: CoverageCode,
  insuredName: string,
  dates: { effectiveDate: string; expirationDate: string },
  seed: number,
) {
  const generated = await buildCertificatePdf({ seed });
  const coverage = { ...generated.values.coverages[code]!, ...dates };
  const { bytes, values } = await buildCertificatePdf({
    seed,
    insured: { ...generated.values.insured, name: insuredName },
    coverages: { [code]: coverage },
  });
  const upload = await agent
    .post("/api/documents")
    .field("typeCode", code)
    .attach("file", Buffer.from(bytes), `renewal-${code}.pdf`)
    .expect(201);
  const submitted = await agent
    .post("/api/credentials")
    .send({ documentId: upload.body.document.id, typeCode: code, fields: certificateFields(values, code) })
    .expect(201);
  return submitted.body as { id: number };
}

async function searchDirectory(buyer: Page, siteName: string) {
  await buyer.goto(`${suite.url}/directory`);
  await buyer.getByLabel("Site", { exact: true }).selectOption({ label: siteName });
  await buyer.getByLabel("Radius (miles)").fill(RADIUS_MILES);
  await buyer.getByRole("button", { name: "Search" }).click();
  await buyer.waitForURL(/radiusMiles=62/);
  // Either the result count or the empty state, once the search has answered.
  await buyer
    .getByText(/Showing \d+ cleared|No cleared technician matches these filters/)
    .first()
    .waitFor();
}

const technicianRow = (page: Page) => page.getByRole("row", { name: new RegExp(TECHNICIAN) });

describe("the daily lapse job takes a technician out of the buyer's directory", () => {
  it("hides the technician from 12:01 a.m. standard time on the liability policy's expiration date, mails the office once, and a verified renewal brings them back", async () => {
    // Instants used below. Steps 1-2 and the renewal's verification (step 5) run at the real clock ("now"); the lapse
    // job (steps 3 and 6) runs at `asOf`, eight months ahead, and stores the standings it recomputes at that instant.
    const [kestrel] = await rows<{ id: number; name: string }>(
      "SELECT id, name FROM companies WHERE name LIKE 'Kestrel Ridge%'",
    );
    const [policy] = await rows<{ id: number; expiration_date: string; lapses_at: Date; type_name: string }>(
      `SELECT c.id, c.fields->>'expirationDate' AS expiration_date, c.lapses_at, ct.name AS type_name
         FROM credentials c JOIN credential_types ct ON ct.code = c.type_code
        WHERE c.company_id = $1 AND c.technician_id IS NULL AND c.type_code = 'general_liability' AND c.state = 'verified'`,
      [kestrel!.id],
    );
    const cutOff = DateTime.fromISO(`${policy!.expiration_date}T00:01`, { zone: CHICAGO_STANDARD_TIME });
    const asOf = cutOff.plus({ minutes: 1 }).toJSDate();
    const buyer = await suite.signedInPage(BUYER);

    // The stored lapse instant is 12:01 a.m. standard time at the insured's address on the expiration date
    // (the CGL declarations' standard time, ISO CG DS 01 wording, from memory).
    expect(new Date(policy!.lapses_at).getTime()).toBe(cutOff.toMillis());

    // Step 1 (now): a Chicago site, and the technician is listed within the radius.
    await buyer.goto(`${suite.url}/sites`);
    await buyer.getByRole("button", { name: "Add a site" }).first().click();
    await buyer.getByLabel("Site name").fill("Chicago river works");
    await buyer.getByLabel("Street address").fill("12 Wharfside Lane");
    await buyer.getByLabel("ZIP code").fill(SITE_ZIP);
    await buyer
      .getByText(/Chicago, IL/)
      .first()
      .waitFor();
    await buyer.getByRole("button", { name: "Add site", exact: true }).click();
    await buyer.getByRole("heading", { name: "Chicago river works" }).waitFor();
    await searchDirectory(buyer, "Chicago river works");
    await technicianRow(buyer).waitFor();
    await screenshot(buyer, "lapse-1-listed");

    await expect(technicianRow(buyer).getByText("Company insurance in force").count()).resolves.toBe(1);

    // Step 2 (now): the buyer keeps the technician on the roster, to hear when they stop clearing.
    await technicianRow(buyer).getByRole("link", { name: TECHNICIAN }).click();
    await buyer.getByRole("heading", { level: 1, name: TECHNICIAN }).waitFor();
    await buyer.getByRole("button", { name: "Add to roster" }).click();
    await buyer.getByText("Added to your roster.").waitFor();
    await screenshot(buyer, "lapse-2-rostered");

    // Step 3 (asOf): the job lapses the policy and recomputes Kestrel Ridge's standings at asOf.
    const lapseRun = await runLapseJob({ asOf });
    await catcher.deliver();
    await searchDirectory(buyer, "Chicago river works");
    await screenshot(buyer, "lapse-3-gone");

    expect(lapseRun.skipped).toBe(false);
    await expect(technicianRow(buyer).count()).resolves.toBe(0);
    // An empty page never blames a filter that removed nobody.
    await expect(buyer.getByText(/\(0 technicians\)/).count()).resolves.toBe(0);
    await expect(seriousAccessibilityProblems(buyer)).resolves.toEqual([]);
    const [lapsed] = await rows<{ state: string }>("SELECT state FROM credentials WHERE id = $1", [
      policy!.id,
    ]);
    expect(lapsed!.state).toBe("lapsed");
    const aboutPolicy = (address: string) =>
      catcher.to(address).filter((m) => m.subject.includes(`${policy!.type_name} for ${kestrel!.name}`));
    // Company-held insurance: the job writes to the company's provider_admin only, not to its technicians.
    expect(aboutPolicy(PROVIDER).map((m) => m.subject)).toEqual([
      `Lapsed: ${policy!.type_name} for ${kestrel!.name}`,
    ]);
    expect(aboutPolicy(TECHNICIAN_USER)).toHaveLength(0);
    const rosterAlerts = () =>
      rows<{ title: string }>(
        `SELECT n.title FROM notifications n JOIN users u ON u.id = n.user_id
          WHERE u.email = $1 AND n.kind = 'roster_stopped_clearing' AND n.title LIKE $2`,
        [BUYER, `${TECHNICIAN}%`],
      );
    await expect(rosterAlerts()).resolves.toHaveLength(1);

    // Step 4: the provider sees the lapsed policy and the technician's standing.
    const provider = await suite.signedInPage(PROVIDER);
    // The dashboard lists what lapsed and has no renewal yet (the dashboard shows it lapsed).
    await provider.goto(`${suite.url}/provider`);
    const lapsedSection = provider.getByRole("region", { name: /^Lapsed/ });
    await lapsedSection.getByText(policy!.type_name).first().waitFor();
    await screenshot(provider, "lapse-4-provider-dashboard");
    await provider.goto(`${suite.url}/provider/documents`);
    const policyRow = provider.getByRole("row", { name: new RegExp(`${policy!.type_name}.*Lapsed`) });
    await policyRow.first().waitFor();
    await screenshot(provider, "lapse-4-provider-documents");
    const lapsedRows = await policyRow.count();
    await provider.goto(`${suite.url}/provider/technicians`);
    await provider.getByRole("link", { name: TECHNICIAN }).first().click();
    await provider.getByRole("heading", { level: 1, name: TECHNICIAN }).waitFor();
    await provider.getByText("Not cleared").first().waitFor();
    await screenshot(provider, "lapse-4-provider-technician");

    expect(lapsedRows).toBeGreaterThan(0);
    await expect(provider.getByText("Not cleared").count()).resolves.toBeGreaterThan(0);

    // Step 5 (now): renewals of both baseline policies (general liability and workers' compensation, which lapsed at
    // the same instant), in force since yesterday in Chicago, so they count both now, when the reviewer's verify
    // recomputes the standing, and at asOf; they end 45 days after asOf, inside the 60-day lapsing window at asOf only.
    const effectiveDate = DateTime.now().setZone("America/Chicago").minus({ days: 1 }).toISODate()!;
    const expirationDate = DateTime.fromISO(policy!.expiration_date).plus({ days: 45 }).toISODate()!;
    const office = await suite.signedInAgent(PROVIDER);
    const reviewer = await suite.signedInAgent(REVIEWER);
    for (const [code, seed] of [
      ["general_liability", 801],
      ["workers_comp", 802],
    ] as const) {
      const renewal = await submitRenewal(
        office,
        code,
        kestrel!.name,
        { effectiveDate, expirationDate },
        seed,
      );
      await reviewer.post(`/api/credentials/${renewal.id}/verify`).send({}).expect(200);
    }
    await searchDirectory(buyer, "Chicago river works");
    await technicianRow(buyer).waitFor();
    await screenshot(buyer, "lapse-5-renewed-now");

    await expect(technicianRow(buyer).getByText("Company insurance in force").count()).resolves.toBe(1);

    // Step 6 (asOf): the job again. The renewals now lapse within 60 days of asOf, so it warns about them and
    // recomputes Kestrel Ridge at asOf: still listed, and "lapsing" proves the standing was judged at asOf, not now.
    const renewedRun = await runLapseJob({ asOf });
    await searchDirectory(buyer, "Chicago river works");
    await technicianRow(buyer).waitFor();
    await screenshot(buyer, "lapse-6-renewed-as-of");

    expect(renewedRun.skipped).toBe(false);
    await expect(
      technicianRow(buyer)
        .getByText(/Lapsing/)
        .count(),
    ).resolves.toBe(1);
    const [stored] = await rows<{ standing: string; computed_at: Date }>(
      `SELECT s.standing, s.computed_at FROM technician_standings s JOIN technicians t ON t.id = s.technician_id
        WHERE t.name = $1 AND s.requirement_set_id IS NULL`,
      [TECHNICIAN],
    );
    expect(stored).toEqual({ standing: "lapsing", computed_at: asOf });
    await expect(rosterAlerts()).resolves.toHaveLength(1);
  }, 180_000);
});
