import type { z } from "zod";
import { AppError } from "../http/app-error.ts";

/**
 * The column mapping an import form sends (JSON: field → header), checked against the file's own headers; none sent
 * means the guess from the headers. One reading for every import, so each refuses a bad mapping the same way.
 */
export function parseColumnMapping<T extends Partial<Record<string, string>>>(
  raw: string | undefined,
  headers: string[],
  schema: z.ZodType<T>,
  guess: (headers: string[]) => T,
): T {
  if (raw === undefined || raw === "") return guess(headers);
  let json: unknown;
  try {
    json = JSON.parse(raw);
  } catch {
    throw new AppError("bad_request", "The column mapping is not valid JSON", [
      { path: "body.mapping", message: "not JSON" },
    ]);
  }
  const parsed = schema.safeParse(json);
  if (!parsed.success)
    throw new AppError("invalid_input", "The column mapping names an unknown field", [
      { path: "body.mapping", message: parsed.error.issues[0]?.message ?? "invalid" },
    ]);
  for (const [key, header] of Object.entries(parsed.data))
    if (header !== undefined && !headers.includes(header))
      throw new AppError("invalid_input", `The column "${header}" is not in the file`, [
        { path: `body.mapping.${key}`, message: "no such column in the file" },
      ]);
  return parsed.data;
}
