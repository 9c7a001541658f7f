import { describe, expect, it } from "vitest";
import ExcelJS from "exceljs";
import { AppError } from "../../../server/http/app-error.ts";
import {
  excelSerialToText,
  isXlsxBytes,
  readSpreadsheet,
  rowsToRecords,
} from "../../../server/imports/read-spreadsheet.ts";
import { storedZip } from "../../fixtures/tiny-zip.ts";

/** A real .xlsx written by exceljs, as a spreadsheet program would save it. */
async function workbookBytes(fill: (sheet: ExcelJS.Worksheet, book: ExcelJS.Workbook) => void) {
  const book = new ExcelJS.Workbook();
  const sheet = book.addWorksheet("Roster");
  fill(sheet, book);
  return Buffer.from(await book.xlsx.writeBuffer());
}

async function refusal(bytes: Buffer, limits = {}) {
  try {
    await readSpreadsheet(bytes, limits);
  } catch (err) {
    return err as AppError;
  }
  throw new Error("the file was read");
}

describe("Excel date serials", () => {
  it("counts the 1900 system from 1900-01-01 = 1, keeps its fictitious 1900-02-29 = 60, and 1900-03-01 = 61", () => {
    // ECMA-376 Part 1 §18.17.4.1 (1900 backward compatibility date system), with the Lotus 1-2-3 leap-year bug.
    expect(excelSerialToText(1)).toBe("1900-01-01");
    expect(excelSerialToText(59)).toBe("1900-02-28");
    expect(excelSerialToText(60)).toBe("1900-02-29");
    expect(excelSerialToText(61)).toBe("1900-03-01");
    // 1904-01-01 is serial 1462 in the 1900 system, the offset between the two systems (ECMA-376 §18.17.4.2).
    expect(excelSerialToText(1462)).toBe("1904-01-01");
    // 2024-01-01 is serial 45292 (common practice: Excel's DATE(2024,1,1)).
    expect(excelSerialToText(45292)).toBe("2024-01-01");
  });

  it("counts the 1904 system from 1904-01-01 = 0 and keeps a time of day", () => {
    // ECMA-376 Part 1 §18.17.4.2 (1904 date system).
    expect(excelSerialToText(0, true)).toBe("1904-01-01");
    expect(excelSerialToText(43830, true)).toBe("2024-01-01");
    // The fraction is the part of the day: 0.5 is noon (ECMA-376 Part 1 §18.17.4.1).
    expect(excelSerialToText(45292.5)).toBe("2024-01-01T12:00:00");
  });
});

describe("reading an uploaded spreadsheet", () => {
  it("reads a real .xlsx: dates as calendar days, formula-looking text as text, formulas as their result", async () => {
    const bytes = await workbookBytes((sheet) => {
      sheet.addRow(["Name", "ZIP", "Hired", "Note", "Rate"]);
      sheet.addRow([
        "Ines Varga",
        2134,
        new Date(Date.UTC(2024, 0, 15)),
        '=HYPERLINK("http://x.test")',
        145.5,
      ]);
      sheet.getCell("B2").numFmt = "00000";
      sheet.getCell("C2").numFmt = "yyyy-mm-dd";
      sheet.addRow([
        { richText: [{ text: "Rolf " }, { text: "Amberly" }] },
        "53202",
        null,
        "",
        { formula: "E2*2", result: 291 },
      ]);
      sheet.addRow([]);
      sheet.addRow(["Tove Quill", "60601", 45292, true]);
      sheet.getCell("C5").numFmt = "m/d/yyyy";
    });

    const read = await readSpreadsheet(bytes);

    expect(isXlsxBytes(bytes)).toBe(true);
    expect(read.format).toBe("xlsx");
    expect(read.rows).toEqual([
      ["Name", "ZIP", "Hired", "Note", "Rate"],
      ["Ines Varga", "02134", "2024-01-15", '=HYPERLINK("http://x.test")', "145.5"],
      ["Rolf Amberly", "53202", "", "", "291"],
      ["Tove Quill", "60601", "2024-01-01", "TRUE"],
    ]);
  });

  it("reads date cells before 1900-03-01 and in a 1904 workbook by their own date system", async () => {
    const serials = [1, 59, 61];
    const old = await workbookBytes((sheet) => {
      sheet.addRow(["Serial"]);
      for (const s of serials) sheet.addRow([s]).getCell(1).numFmt = "yyyy-mm-dd";
    });
    const mac = await workbookBytes((sheet, book) => {
      book.properties.date1904 = true;
      sheet.addRow(["Serial"]);
      sheet.addRow([0]).getCell(1).numFmt = "yyyy-mm-dd";
    });

    const read = await readSpreadsheet(old);
    const read1904 = await readSpreadsheet(mac);

    // ECMA-376 Part 1 §18.17.4.1 and §18.17.4.2.
    expect(read.rows.slice(1)).toEqual([["1900-01-01"], ["1900-02-28"], ["1900-03-01"]]);
    expect(read1904.rows.slice(1)).toEqual([["1904-01-01"]]);
  });

  it("reads a UTF-8 CSV the same way, without its byte order mark, keeping formula-looking text", async () => {
    const csv = Buffer.from('\uFEFFName,ZIP,Note\r\n"Vargas, Ines",02134,=1+1\r\n\r\n');

    const read = await readSpreadsheet(csv);

    expect(read.format).toBe("csv");
    expect(rowsToRecords(read.rows)).toEqual({
      headers: ["Name", "ZIP", "Note"],
      records: [{ Name: "Vargas, Ines", ZIP: "02134", Note: "=1+1" }],
    });
  });

  it("refuses more rows than allowed and a file over the size limit with 413", async () => {
    const many = await workbookBytes((sheet) => {
      sheet.addRow(["Name"]);
      for (let i = 0; i < 4; i++) sheet.addRow([`Person ${i}`]);
    });

    const rows = await refusal(many, { maxRows: 3 });
    const csvRows = await refusal(Buffer.from("Name\na\nb\nc\nd\n"), { maxRows: 3 });
    const size = await refusal(Buffer.alloc(2_000, "a"), { maxBytes: 1_000 });

    expect(rows.status).toBe(413);
    expect(rows.fields?.[0]?.message).toBe("more than 3 rows");
    expect(csvRows.status).toBe(413);
    expect(size.status).toBe(413);
    expect(size.fields?.[0]?.path).toBe("file");
  });

  it("refuses by its bytes a zip that is no workbook, a PNG, and text that is not UTF-8, with 415", async () => {
    // A zip holding one other part; local and central headers per PKWARE APPNOTE.TXT §4.3.7 and §4.3.12.
    const zip = storedZip([{ name: "word/document.xml", body: "<w/>" }]);
    // PNG signature (ISO/IEC 15948 §5.2), which holds NUL bytes.
    const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
    // "Café" in Windows-1252: 0xE9 alone is not UTF-8 (RFC 3629 §3).
    const latin1 = Buffer.from([0x4e, 0x61, 0x6d, 0x65, 0x0a, 0x43, 0x61, 0x66, 0xe9, 0x0a]);

    for (const bytes of [zip, png, latin1]) {
      const err = await refusal(bytes);
      expect(err.status).toBe(415);
      expect(err.fields?.[0]?.path).toBe("file");
    }
  });

  it("refuses a workbook whose parts unpack to more than the limit before unpacking it", async () => {
    const bomb = storedZip([{ name: "xl/workbook.xml", body: "<workbook/>" }]);
    // The central directory's uncompressed size (PKWARE APPNOTE.TXT §4.3.12, offset 24) claims 4 GB less 16 bytes.
    bomb.writeUInt32LE(0xfffffff0, bomb.indexOf(Buffer.from([0x50, 0x4b, 0x01, 0x02])) + 24);

    const err = await refusal(bomb);

    expect(err.status).toBe(413);
  });
});
