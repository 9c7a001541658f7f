import path from "node:path";
import { fileTypeFromBuffer } from "file-type";
import { sniffUpload } from "../credentials/index.ts";
import { AppError } from "../http/app-error.ts";
import { isXlsxBytes } from "../imports/xlsx-bytes.ts";

export const XLSX_MIME = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";
export const CSV_MIME = "text/csv";
/** A maintenance log as text is small; anything bigger is almost certainly not one, and is refused before storing. */
export const MAX_CSV_BYTES = 2 * 1024 * 1024;

const refuse = (message: string, reason: string) =>
  new AppError("unsupported_type", message, [{ path: "file", message: reason }]);

/**
 * Service-request files: the photo and PDF types of credential documents, plus a maintenance-history spreadsheet
 * (.xlsx read from its bytes) or a .csv (text that must be valid UTF-8 without NUL bytes). The name must agree with
 * the content, as for documents.
 */
export async function sniffRequestAttachment(bytes: Buffer, originalName: string): Promise<string> {
  const ext = path.extname(originalName).toLowerCase();
  if (ext === ".csv") {
    if (bytes.length > MAX_CSV_BYTES)
      throw new AppError("too_large", "A .csv file may be at most 2 MB", [
        { path: "file", message: "over 2 MB" },
      ]);
    if (bytes.includes(0)) throw refuse("The .csv file holds binary data, not text", "not text");
    try {
      new TextDecoder("utf-8", { fatal: true }).decode(bytes);
    } catch {
      throw refuse("The .csv file is not UTF-8 text; save it as CSV UTF-8 and try again", "not UTF-8 text");
    }
    return CSV_MIME;
  }
  if (ext === ".xlsx") {
    const detected = await fileTypeFromBuffer(bytes);
    if (detected?.mime !== XLSX_MIME || !isXlsxBytes(bytes))
      throw refuse(
        "The file's name says .xlsx but its content is not an Excel workbook; re-save it from the spreadsheet",
        "not an .xlsx workbook",
      );
    return XLSX_MIME;
  }
  try {
    return await sniffUpload(bytes, originalName);
  } catch (err) {
    if (err instanceof AppError && err.code === "unsupported_type" && !/name says/.test(err.message))
      throw refuse(
        "Only PDF, PNG, JPEG, .xlsx or .csv files are accepted (checked from the file's content)",
        "not a PDF, PNG, JPEG, .xlsx or .csv",
      );
    throw err;
  }
}
