import { describe, expect, it } from "vitest";
import ExcelJS from "exceljs";
import { useTestApp } from "../../support/test-app.ts";
import { buildProvider } from "../../support/build-provider.ts";
import { agentFor } from "../../support/test-app.ts";
import { Technician } from "../../../server/technicians/model.ts";
import { countStored } from "../../support/count-uploads.ts";

const t = useTestApp();

const XLSX = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";
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

/** A roster saved as .xlsx by exceljs, with ZIPs and rates typed as numbers the way a spreadsheet keeps them. */
async function rosterWorkbook(tag: string) {
  const book = new ExcelJS.Workbook();
  const sheet = book.addWorksheet("Technicians");
  sheet.addRow(header);
  // Real ZIP codes from the zipcodes data set (Boston 02134 keeps its leading zero only through the "00000" format).
  sheet.addRow([
    `Linnea Sorbet ${tag}`,
    `linnea-${tag}@example.test`,
    "555-0100",
    2134,
    "Mill;Lathe",
    60,
    145,
    95,
  ]);
  sheet.getCell("D2").numFmt = "00000";
  sheet.addRow([`Casimir Oduya ${tag}`, "", "", 60601, "Wire EDM", 120, "$1,150.00", 90]);
  sheet.addRow([`Bettina Ruhl ${tag}`, "", "", 53202, { formula: '"Mi"&"ll"', result: "Mill" }, 40, 130, 80]);
  sheet.addRow([`Orrin Vale ${tag}`, "", "", 45402, "Plasma cutter", 40, 130, 80]);
  return Buffer.from(await book.xlsx.writeBuffer());
}

const upload = (agent: ReturnType<typeof agentFor>, path: string, bytes: Buffer, name = "roster.xlsx") =>
  agent.post(path).attach("file", bytes, { filename: name, contentType: XLSX });

describe("a service company imports its technicians from an .xlsx workbook", () => {
  it("previews, imports the good rows, reports the bad one, and adds no one on a re-import", async () => {
    const provider = await buildProvider(t.app);
    const bytes = await rosterWorkbook(String(provider.company.id));
    const uploadsBefore = (await countStored(t.config.UPLOADS_DIR)).incoming;

    const preview = await upload(provider.admin, "/api/technicians/import/preview", bytes);
    const first = await upload(provider.admin, "/api/technicians/import", bytes);
    const again = await upload(provider.admin, "/api/technicians/import", bytes);

    expect(preview.status).toBe(200);
    expect(preview.body.headers).toEqual(header);
    expect(preview.body.goodCount).toBe(3);
    expect(preview.body.rows[3].problems).toEqual(['Technologies: unknown technology "Plasma cutter"']);
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({ imported: 3, invited: 1, skipped: [{ line: 5 }] });
    const boston = await Technician.findOne({
      where: { email: `linnea-${provider.company.id}@example.test` },
    });
    expect(boston?.postalCode).toBe("02134");
    expect(boston?.technologies).toEqual(["mill", "lathe"]);
    expect(boston?.hourlyRateCents).toBe(14_500);
    const formula = await Technician.findOne({ where: { name: `Bettina Ruhl ${provider.company.id}` } });
    expect(formula?.technologies).toEqual(["mill"]);
    expect(again.body.imported).toBe(0);
    expect(await Technician.count({ where: { companyId: provider.company.id } })).toBe(1 + 3);
    expect((await countStored(t.config.UPLOADS_DIR)).incoming).toBe(uploadsBefore);
  });

  it("goes by the bytes, not the name: a workbook named .csv is read, a PDF named .xlsx is refused with 415", async () => {
    const provider = await buildProvider(t.app);
    const bytes = await rosterWorkbook(`n${provider.company.id}`);
    // A PDF starts with "%PDF-" and usually a binary comment line (ISO 32000-1 §7.5.2).
    const pdf = Buffer.concat([
      Buffer.from("%PDF-1.7\n%"),
      Buffer.from([0xe2, 0xe3, 0xcf, 0xd3]),
      Buffer.from("\n"),
    ]);

    const named = await upload(provider.admin, "/api/technicians/import/preview", bytes, "roster.csv");
    const refused = await upload(provider.admin, "/api/technicians/import", pdf);

    expect(named.status).toBe(200);
    expect(named.body.goodCount).toBe(3);
    expect(refused.status).toBe(415);
    expect(refused.body.error.fields[0].path).toBe("file");
    expect(await Technician.count({ where: { companyId: provider.company.id } })).toBe(1);
  });
});
