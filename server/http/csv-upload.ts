import { readFile, rm } from "node:fs/promises";
import { AppError } from "./app-error.ts";

export interface UploadedFile {
  path: string;
  originalname: string;
  mimetype: string;
}

const csvMimes = new Set([
  "text/csv",
  "text/plain",
  "application/csv",
  "application/vnd.ms-excel",
  "application/octet-stream",
]);

/** The file's text when it is a CSV, judged from its name, declared type and bytes (a spreadsheet's binary is not). */
export async function readCsvText(file: UploadedFile | undefined): Promise<string> {
  if (!file)
    throw new AppError("invalid_input", "Choose a CSV file", [{ path: "file", message: "required" }]);
  // The file is only read, never kept: it leaves the incoming folder whatever the outcome.
  const bytes = await readFile(file.path).finally(() => rm(file.path, { force: true }));
  const looksBinary = bytes.includes(0) || (bytes[0] === 0x50 && bytes[1] === 0x4b);
  if (!/\.csv$/i.test(file.originalname) || !csvMimes.has(file.mimetype) || looksBinary)
    throw new AppError(
      "unsupported_type",
      "Only CSV files can be imported; save the spreadsheet as CSV (comma-separated) first",
      [{ path: "file", message: "not a CSV file" }],
    );
  const text = bytes.toString("utf8");
  if (text.includes("\uFFFD"))
    throw new AppError("unsupported_type", "The file is not UTF-8 text", [
      { path: "file", message: "not UTF-8 text" },
    ]);
  return text.replace(/^\uFEFF/, "");
}
