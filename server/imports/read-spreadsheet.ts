import { readFile, rm } from "node:fs/promises";
import type ExcelJS from "exceljs";
import Papa from "papaparse";
import { AppError } from "../http/app-error.ts";
import { ZIP_LOCAL_HEADER, zipParts } from "./xlsx-bytes.ts";

export { isXlsxBytes } from "./xlsx-bytes.ts";

/** A roster or machine list as people keep it fits well under this; bigger files are refused before they are read. */
export const MAX_SPREADSHEET_BYTES = 5 * 1024 * 1024;
/** The parts of a workbook once unpacked; a small file that unpacks past this is a zip bomb, not a roster. */
export const MAX_UNPACKED_XLSX_BYTES = 100 * 1024 * 1024;
export const DEFAULT_MAX_SPREADSHEET_ROWS = 5_000;

export interface SpreadsheetLimits {
  /** Rows after the header row. */
  maxRows?: number;
  maxBytes?: number;
}

export interface SpreadsheetRows {
  format: "csv" | "xlsx";
  /** Every non-blank row, the header row first, each cell as text. */
  rows: string[][];
}

const refuse = (message: string, reason: string) =>
  new AppError("unsupported_type", message, [{ path: "file", message: reason }]);
const tooLarge = (message: string, reason: string) =>
  new AppError("too_large", message, [{ path: "file", message: reason }]);

const DAY_MS = 24 * 60 * 60 * 1000;
const pad = (n: number, width = 2) => String(n).padStart(width, "0");

/**
 * An Excel date serial as the calendar date (and time, when it has one) a person saw in the cell. In the 1900 date
 * system serial 1 is 1900-01-01 and serial 60 is 1900-02-29, a day that never was, kept for compatibility with
 * Lotus 1-2-3; from serial 61 (1900-03-01) on, days count from 1899-12-30. In the 1904 system serial 0 is 1904-01-01
 * (ECMA-376 Part 1 §18.17.4.1 and §18.17.4.2). Dates carry no zone: they are read and printed in UTC on purpose.
 */
export function excelSerialToText(serial: number, date1904 = false): string {
  const wholeDays = Math.floor(serial);
  const seconds = Math.round((serial - wholeDays) * 86_400);
  let day: string;
  if (!date1904 && wholeDays === 60) day = "1900-02-29";
  else {
    const epoch = date1904 ? Date.UTC(1904, 0, 1) : Date.UTC(1899, 11, wholeDays < 60 ? 31 : 30);
    const d = new Date(epoch + wholeDays * DAY_MS);
    day = `${pad(d.getUTCFullYear(), 4)}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())}`;
  }
  if (seconds === 0) return day;
  const s = Math.min(seconds, 86_399);
  return `${day}T${pad(Math.floor(s / 3600))}:${pad(Math.floor((s % 3600) / 60))}:${pad(s % 60)}`;
}

/**
 * exceljs turns a date cell's serial into a Date with its own 1900 rule (right only from 1900-03-01); the serial is
 * recovered from that Date by exceljs's own inverse, then read by the rule above.
 */
function dateCellText(value: Date, date1904: boolean): string {
  const serial = value.getTime() / DAY_MS + 25569 - (date1904 ? 1462 : 0);
  return excelSerialToText(Math.round(serial * 86_400) / 86_400, date1904);
}

type CellValue = ExcelJS.CellValue;

function cellText(value: CellValue, numFmt: string | undefined, date1904: boolean): string {
  if (value === null || value === undefined) return "";
  if (value instanceof Date) return dateCellText(value, date1904);
  if (typeof value === "number") {
    // A ZIP typed as a number loses its leading zero unless the sheet pads it ("00000", a common cell format).
    if (numFmt && /^0+$/.test(numFmt)) return String(value).padStart(numFmt.length, "0");
    return String(value);
  }
  if (typeof value === "string") return value;
  if (typeof value === "boolean") return value ? "TRUE" : "FALSE";
  if ("richText" in value) return value.richText.map((r) => r.text).join("");
  if ("error" in value) return "";
  // A formula gives what the spreadsheet last computed, never the formula itself: nothing is evaluated here.
  if ("formula" in value || "sharedFormula" in value)
    return cellText((value as ExcelJS.CellFormulaValue).result as CellValue, numFmt, date1904);
  if ("hyperlink" in value) return String(value.text ?? "");
  return "";
}

async function readXlsx(bytes: Buffer, maxRows: number): Promise<string[][]> {
  if (zipParts(bytes).unpackedBytes > MAX_UNPACKED_XLSX_BYTES)
    throw tooLarge("The workbook unpacks to more than a roster could hold", "unpacks too large");
  // Loaded on the first spreadsheet import, not at start-up: most server processes never read one.
  const { default: Excel } = await import("exceljs");
  const workbook = new Excel.Workbook();
  try {
    // exceljs's declared Buffer type predates Node's generic Buffer.
    await workbook.xlsx.load(bytes as unknown as ExcelJS.Buffer);
  } catch {
    throw refuse("The workbook could not be read; open it and save it again as .xlsx", "unreadable workbook");
  }
  const sheet = workbook.worksheets.find((w) => w.state === "visible") ?? workbook.worksheets[0];
  if (!sheet) return [];
  if (sheet.actualRowCount > maxRows + 1) throw tooManyRows(maxRows);
  const date1904 = Boolean(workbook.properties?.date1904);
  const rows: string[][] = [];
  const width = sheet.actualColumnCount > 0 ? sheet.columnCount : 0;
  sheet.eachRow({ includeEmpty: false }, (row) => {
    const cells: string[] = [];
    for (let c = 1; c <= width; c++) {
      const cell = row.getCell(c);
      cells.push(cellText(cell.value, cell.numFmt, date1904));
    }
    while (cells.length > 0 && cells[cells.length - 1] === "") cells.pop();
    if (cells.some((s) => s.trim() !== "")) rows.push(cells);
  });
  return rows;
}

function readCsv(bytes: Buffer, maxRows: number): string[][] {
  if (bytes.includes(0))
    throw refuse("The file holds binary data, not a CSV or an .xlsx workbook", "not text");
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw refuse(
      "The file is not UTF-8 text; save it as CSV UTF-8 or as .xlsx and try again",
      "not UTF-8 text",
    );
  }
  // RFC 4180 reading (quoted fields, embedded commas and line breaks) by papaparse; a BOM is not part of a header.
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ""), {
    header: false,
    skipEmptyLines: "greedy",
  });
  if (parsed.data.length > maxRows + 1) throw tooManyRows(maxRows);
  return parsed.data;
}

const tooManyRows = (maxRows: number) =>
  tooLarge(`At most ${maxRows.toLocaleString("en-US")} rows per import`, `more than ${maxRows} rows`);

/**
 * An uploaded table as rows of text, whatever the spreadsheet program saved: an .xlsx workbook (its first visible
 * sheet), recognised from its bytes, or a UTF-8 CSV. The file's name and declared type are not trusted.
 */
export async function readSpreadsheet(
  bytes: Buffer,
  limits: SpreadsheetLimits = {},
): Promise<SpreadsheetRows> {
  const maxBytes = limits.maxBytes ?? MAX_SPREADSHEET_BYTES;
  const maxRows = limits.maxRows ?? DEFAULT_MAX_SPREADSHEET_ROWS;
  if (bytes.length > maxBytes)
    throw tooLarge(
      `A spreadsheet may be at most ${Math.floor(maxBytes / 1024 / 1024)} MB`,
      `over ${maxBytes} bytes`,
    );
  if (bytes.subarray(0, 4).equals(ZIP_LOCAL_HEADER)) {
    if (!zipParts(bytes).namesWorkbook)
      throw refuse("The file is a zip archive but not an .xlsx workbook", "not an .xlsx workbook");
    return { format: "xlsx", rows: await readXlsx(bytes, maxRows) };
  }
  return { format: "csv", rows: readCsv(bytes, maxRows) };
}

export interface UploadedSpreadsheet {
  path: string;
}

/** The upload read and then removed from the incoming folder, whatever the outcome: an import never keeps the file. */
export async function readUploadedSpreadsheet(
  file: UploadedSpreadsheet | undefined,
  limits: SpreadsheetLimits = {},
): Promise<SpreadsheetRows> {
  if (!file)
    throw new AppError("invalid_input", "Choose a CSV or .xlsx file", [
      { path: "file", message: "required" },
    ]);
  const bytes = await readFile(file.path).finally(() => rm(file.path, { force: true }));
  return readSpreadsheet(bytes, limits);
}

/** Rows under a header row as records keyed by header; blank headers are dropped, duplicates keep the first. */
export function rowsToRecords(rows: string[][]): { headers: string[]; records: Record<string, string>[] } {
  const [head = [], ...body] = rows;
  const columns = head
    .map((h, i) => ({ header: h.trim(), i }))
    .filter((c, k, all) => c.header !== "" && all.findIndex((o) => o.header === c.header) === k);
  const records = body.map((cells) => Object.fromEntries(columns.map((c) => [c.header, cells[c.i] ?? ""])));
  return { headers: columns.map((c) => c.header), records };
}
