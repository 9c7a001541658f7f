import type { z } from "zod";
import { AppError } from "../http/app-error.ts";
import { parseColumnMapping } from "./column-mapping.ts";
import { readUploadedSpreadsheet, rowsToRecords, type UploadedSpreadsheet } from "./read-spreadsheet.ts";

export interface ImportField<K extends string> {
  key: K;
  header: string;
  required: boolean;
}

export interface ImportTableSpec<K extends string, M extends Partial<Record<K, string>>> {
  maxRows: number;
  fields: readonly ImportField<K>[];
  mappingSchema: z.ZodType<M>;
  guess: (headers: string[]) => M;
}

/**
 * An import's upload as records under a checked mapping: the bytes decide CSV or .xlsx, the row limit is checked
 * before any row is judged, and a mapping that leaves a required field without a column is refused naming each.
 * Every import reads its file this way, so each refuses a bad file or mapping with the same answer.
 */
export async function readImportTable<K extends string, M extends Partial<Record<K, string>>>(
  file: UploadedSpreadsheet | undefined,
  mappingRaw: string | undefined,
  spec: ImportTableSpec<K, M>,
): Promise<{ headers: string[]; records: Record<string, string>[]; mapping: M }> {
  const { rows } = await readUploadedSpreadsheet(file, { maxRows: spec.maxRows });
  const { headers, records } = rowsToRecords(rows);
  if (headers.length === 0)
    throw new AppError("invalid_input", "The file has no header row", [
      { path: "file", message: "no header row" },
    ]);
  const mapping = parseColumnMapping(mappingRaw, headers, spec.mappingSchema, spec.guess);
  const missing = spec.fields.filter((f) => f.required && mapping[f.key] === undefined);
  if (missing.length > 0)
    throw new AppError(
      "invalid_input",
      `Choose a column for ${missing.map((f) => f.header).join(", ")}`,
      missing.map((f) => ({ path: `body.mapping.${f.key}`, message: "no column chosen" })),
    );
  return { headers, records, mapping };
}
