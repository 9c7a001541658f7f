import { describe, expect, it } from "vitest";
import ExcelJS from "exceljs";
import { QueryTypes } from "sequelize";
import { sequelize, useTestApp } from "../../support/test-app.ts";
import { buildMachineShop, nextMachineSerial } from "../../fixtures/build-machine-shop.ts";
import { countStored } from "../../support/count-uploads.ts";

const t = useTestApp();

// The media type registered for Office Open XML workbooks (ECMA-376 Part 2, IANA media types).
const XLSX = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";

/** A machine list saved as .xlsx by exceljs: a year typed as a number, a date cell, a control read from a formula. */
async function machineWorkbook(tag: string) {
  const book = new ExcelJS.Workbook();
  const sheet = book.addWorksheet("Machines");
  sheet.addRow([
    "Site",
    "Builder",
    "Control",
    "Technology",
    "Model",
    "Serial number",
    "Year built",
    "In service since",
  ]);
  sheet.addRow([
    "Main Plant",
    "VMW",
    "K40",
    "Mill",
    "VM-450",
    `${tag}-X1`,
    2019,
    new Date(Date.UTC(2019, 5, 3)),
  ]);
  sheet.addRow([
    "Main Plant",
    "Strell",
    { formula: '"Spark "&"5"', result: "Spark 5" },
    "wire edm",
    "SW-3",
    `${tag}-X2`,
    "",
    "",
  ]);
  sheet.addRow(["Main Plant", "Unheard-of Builder", "K40", "Mill", "VM-1", `${tag}-X3`, "", ""]);
  return Buffer.from(await book.xlsx.writeBuffer());
}

const machinesOf = (companyId: number) =>
  sequelize().query<{
    builder: string;
    controlFamily: string;
    serialNumber: string;
    inServiceOn: string | null;
  }>(
    `SELECT e.builder, e.control_family AS "controlFamily", e.serial_number AS "serialNumber",
            e.technology, e.year_built AS "yearBuilt", e.in_service_on::text AS "inServiceOn"
       FROM equipment e JOIN sites s ON s.id = e.site_id WHERE s.company_id = $1 ORDER BY e.id`,
    { bind: [companyId], type: QueryTypes.SELECT },
  );

describe("machines import from an .xlsx workbook", () => {
  it("previews the workbook by its bytes, imports the good rows when asked, and keeps no file", async () => {
    const shop = await buildMachineShop(t.app, { machine: false, siteName: "Main Plant" });
    const tag = nextMachineSerial();
    const bytes = await machineWorkbook(tag);
    const before = (await countStored(t.config.UPLOADS_DIR)).incoming;

    const preview = await shop.agent
      .post("/api/machines/import/preview")
      .attach("file", bytes, { filename: "machines.xlsx", contentType: XLSX });
    const refused = await shop.agent
      .post("/api/machines/import")
      .attach("file", bytes, { filename: "machines.xlsx", contentType: XLSX });
    const commit = await shop.agent
      .post("/api/machines/import")
      .field("skipRowsWithProblems", "true")
      .attach("file", bytes, { filename: "machines.xlsx", contentType: XLSX });

    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ goodCount: 2, badCount: 1 });
    expect(preview.body.headers).toContain("Serial number");
    expect(preview.body.rows[2]).toMatchObject({ line: 4 });
    expect(preview.body.rows[2].problems[0]).toMatchObject({ field: "builder", column: "Builder" });
    expect(refused.status).toBe(422);
    expect(commit.status).toBe(201);
    expect(commit.body).toMatchObject({ imported: 2, skipped: [{ line: 4 }] });
    expect(await machinesOf(shop.company.id)).toEqual([
      expect.objectContaining({
        builder: "Vantor Machine Works",
        controlFamily: "Kestle 40",
        serialNumber: `${tag}-X1`,
        yearBuilt: 2019,
        inServiceOn: "2019-06-03",
      }),
      expect.objectContaining({ builder: "Strell Spark Systems", technology: "wire_edm", inServiceOn: null }),
    ]);
    expect((await countStored(t.config.UPLOADS_DIR)).incoming).toBe(before);
  });
});
