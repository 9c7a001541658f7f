import { describe, expect, it } from "vitest";
import Papa from "papaparse";
import { agentFor, useTestApp, signedInAs } from "../../support/test-app.ts";
import { buildProvider } from "../../support/build-provider.ts";
import { buildCompany } from "../../support/build-company.ts";
import { useMailCatcher } from "../../support/mail-catcher.ts";
import { Technician } from "../../../server/technicians/model.ts";
import { User } from "../../../server/accounts/model.ts";
import { countStored } from "../../support/count-uploads.ts";

const t = useTestApp();
const mail = useMailCatcher();

const header = [
  "Name",
  "E-mail",
  "Phone",
  "ZIP",
  "Technologies",
  "Service radius (miles)",
  "Hourly rate ($)",
  "Travel rate ($)",
];
// Real ZIP codes from the zipcodes data set (Milwaukee, Chicago, Dayton, Grand Rapids).
const zips = ["53202", "60601", "45402", "49503"];

/** 1,000 rows, 30 of them bad in three ways (10 each), written by papaparse as RFC 4180 CSV. */
function thousandRows(tag: string) {
  const rows: string[][] = [];
  for (let i = 0; i < 1000; i++) {
    const email = i % 2 === 0 ? `tech${i}-${tag}@example.test` : "";
    rows.push([
      `Person ${i} ${tag}`,
      email,
      "555-0100",
      zips[i % 4]!,
      "Mill;Wire EDM",
      "120",
      "$1,150.00",
      "95",
    ]);
  }
  // Bad ZIP: five digits no ZIP has.
  for (let i = 0; i < 10; i++) rows[3 + i * 7]![3] = "00000";
  // Unknown technology.
  for (let i = 0; i < 10; i++) rows[500 + i * 11]![4] = "Mill;Plasma cutter";
  // Duplicate e-mail within the file: an odd row (no e-mail) given an earlier even row's address.
  for (let i = 0; i < 10; i++) rows[201 + i * 20]![1] = `tech${200 + i * 20}-${tag}@example.test`;
  return Papa.unparse([header, ...rows], { newline: "\r\n" });
}

const upload = (
  agent: ReturnType<typeof agentFor>,
  path: string,
  csv: string | Buffer,
  name = "roster.csv",
  type = "text/csv",
) => agent.post(path).attach("file", Buffer.from(csv), { filename: name, contentType: type });

describe("a service company imports its technicians from a CSV", () => {
  it("imports 970 of 1,000 rows, reports the 30 bad with reasons, and a re-import adds no one", async () => {
    const provider = await buildProvider(t.app);
    const csv = thousandRows(provider.company.id.toString());
    const uploadsBefore = (await countStored(t.config.UPLOADS_DIR)).incoming;

    const preview = await upload(provider.admin, "/api/technicians/import/preview", csv);
    const countAfterPreview = await Technician.count({ where: { companyId: provider.company.id } });
    const first = await upload(provider.admin, "/api/technicians/import", csv);
    const again = await upload(provider.admin, "/api/technicians/import", csv);
    const total = await Technician.count({ where: { companyId: provider.company.id } });
    const invitedUsers = await User.count({ where: { companyId: provider.company.id, passwordHash: null } });

    expect(preview.status).toBe(200);
    expect(preview.body.goodCount).toBe(970);
    expect(preview.body.badCount).toBe(30);
    expect(countAfterPreview).toBe(1);
    expect(first.status).toBe(201);
    expect(first.body.imported).toBe(970);
    expect(first.body.skipped).toHaveLength(30);
    const reasons = first.body.skipped.map((s: { problems: string[] }) => s.problems.join(" "));
    expect(reasons.filter((r: string) => r.includes("not a known US ZIP code"))).toHaveLength(10);
    expect(reasons.filter((r: string) => r.includes('unknown technology "Plasma cutter"'))).toHaveLength(10);
    expect(reasons.filter((r: string) => /also on line \d+ of this file/.test(r))).toHaveLength(10);
    // Line numbers as a spreadsheet shows them: header on line 1, so data row index 3 is line 5.
    expect(first.body.skipped[0].line).toBe(5);
    // 500 even rows carry e-mail, less the 10 bad-ZIP and unknown-technology rows among them.
    const evenBad = [...Array(10).keys()]
      .flatMap((i) => [3 + i * 7, 500 + i * 11])
      .filter((n) => n % 2 === 0).length;
    expect(first.body.invited).toBe(500 - evenBad);
    expect(invitedUsers).toBe(500 - evenBad);
    expect(again.status).toBe(201);
    expect(again.body.imported).toBe(0);
    expect(again.body.skipped).toHaveLength(1000);
    expect(total).toBe(1 + 970);
    expect((await countStored(t.config.UPLOADS_DIR)).incoming).toBe(uploadsBefore);
  }, 120_000);

  it("sends each invited technician a set-password link through the outbox", async () => {
    const provider = await buildProvider(t.app);
    const email = `onboard-${provider.company.id}@example.test`;
    const csv = Papa.unparse([
      header,
      ["Marisol Vantongeren", email, "", "53202", "lathe", "50", "140", "90"],
    ]);

    const res = await upload(provider.admin, "/api/technicians/import", csv);
    await mail.deliver();

    expect(res.status).toBe(201);
    expect(res.body.invited).toBe(1);
    expect(mail.to(email)).toHaveLength(1);
    expect(mail.to(email)[0]!.text).toMatch(/set-password\?token=/);
  });

  it("reads the file through a chosen column mapping and refuses a mapping to a column the file lacks", async () => {
    const provider = await buildProvider(t.app);
    const csv = Papa.unparse([
      ["Full name", "Postal", "Radius", "Rate", "Travel", "Skills"],
      ['Okonkwo "Oak" Lindqvist', "60601", "25", "150", "100", "Grinder"],
    ]);
    const mapping = {
      name: "Full name",
      postalCode: "Postal",
      serviceRadiusMiles: "Radius",
      hourlyRate: "Rate",
      travelRate: "Travel",
      technologies: "Skills",
    };

    const ok = await upload(provider.admin, "/api/technicians/import", csv).field(
      "mapping",
      JSON.stringify(mapping),
    );
    const wrong = await upload(provider.admin, "/api/technicians/import/preview", csv).field(
      "mapping",
      JSON.stringify({ ...mapping, name: "Nombre" }),
    );
    const unmapped = await upload(provider.admin, "/api/technicians/import/preview", csv);
    const created = await Technician.findOne({
      where: { companyId: provider.company.id, name: 'Okonkwo "Oak" Lindqvist' },
    });

    expect(ok.status).toBe(201);
    expect(created?.technologies).toEqual(["grinder"]);
    // 25 statute miles = 40.2 km (1 mi = 1.609344 km, international yard and pound agreement, 1959).
    expect(created?.serviceRadiusKm).toBe(40);
    expect(created?.hourlyRateCents).toBe(15_000);
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.fields[0].path).toBe("body.mapping.name");
    expect(unmapped.status).toBe(422);
    expect(unmapped.body.error.fields.map((f: { path: string }) => f.path)).toContain("body.mapping.name");
  });

  it("refuses a zip that is not a workbook with 415 and a file over 10 MB with 413, keeping nothing", async () => {
    const provider = await buildProvider(t.app);
    const uploadsBefore = (await countStored(t.config.UPLOADS_DIR)).incoming;
    // An .xlsx is a ZIP container: local file header signature PK\x03\x04 (PKWARE APPNOTE.TXT §4.3.7).
    const xlsx = Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x06, 0x00]);
    const big = Buffer.alloc(10 * 1024 * 1024 + 10, "a");

    const binary = await upload(
      provider.admin,
      "/api/technicians/import",
      xlsx,
      "roster.xlsx",
      "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
    );
    const disguised = await upload(provider.admin, "/api/technicians/import", xlsx, "roster.csv", "text/csv");
    const oversized = await upload(provider.admin, "/api/technicians/import", big);

    expect(binary.status).toBe(415);
    expect(binary.body.error.fields[0].path).toBe("file");
    expect(disguised.status).toBe(415);
    expect(oversized.status).toBe(413);
    expect(await Technician.count({ where: { companyId: provider.company.id } })).toBe(1);
    expect((await countStored(t.config.UPLOADS_DIR)).incoming).toBe(uploadsBefore);
  });

  it("lets only a service company's admin import; a shop or a technician is refused", async () => {
    const provider = await buildProvider(t.app);
    const { users } = await buildCompany("shop", ["buyer"]);
    const shop = await signedInAs(t.app, users.buyer!.email);
    const csv = Papa.unparse([header, ["Anyone Here", "", "", "53202", "", "10", "1", "1"]]);

    const byShop = await upload(shop, "/api/technicians/import", csv);
    const byTech = await upload(provider.tech, "/api/technicians/import", csv);
    const template = await provider.admin.get("/api/technicians/import/template");

    expect(byShop.status).toBe(403);
    expect(byTech.status).toBe(403);
    expect(template.status).toBe(200);
    expect(template.headers["content-type"]).toMatch(/text\/csv/);
    expect(Papa.parse<string[]>(template.text.trim()).data[0]).toEqual(header);
  });
});
