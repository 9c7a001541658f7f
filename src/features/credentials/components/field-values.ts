import type { ZodError } from "zod";
import { fieldSetSchemas, type FieldSet } from "@shared/credentials/credential-fields.ts";
import type { FieldDefinition } from "./field-definitions.ts";

/** What the inputs hold, by field path: text for text, dates and amounts; true/false for check boxes. */
export type FieldValues = Record<string, string | boolean>;

const valueAt = (fields: Record<string, unknown>, path: string): unknown =>
  path
    .split(".")
    .reduce<unknown>(
      (at, key) => (at && typeof at === "object" ? (at as Record<string, unknown>)[key] : undefined),
      fields,
    );

/** The inputs' starting values from fields (proposed by the extractor, or stored on a credential). */
export function toFieldValues(
  definitions: readonly FieldDefinition[],
  fields: Record<string, unknown>,
): FieldValues {
  const values: FieldValues = {};
  for (const definition of definitions) {
    const value = valueAt(fields, definition.path);
    if (definition.kind === "checkbox") values[definition.path] = value === true;
    else if (definition.kind === "dollars" && typeof value === "number")
      values[definition.path] = value.toLocaleString("en-US");
    else if (definition.kind === "names" && Array.isArray(value)) values[definition.path] = value.join("; ");
    else if (value !== undefined && value !== null) values[definition.path] = String(value);
    else values[definition.path] = "";
  }
  return values;
}

const setAt = (target: Record<string, unknown>, path: string, value: unknown) => {
  const keys = path.split(".");
  let at = target;
  for (const key of keys.slice(0, -1)) {
    at[key] ??= {};
    at = at[key] as Record<string, unknown>;
  }
  at[keys[keys.length - 1]!] = value;
};

const wholeDollars = (text: string): number | null => {
  const cleaned = text.replace(/[$,\s]/g, "");
  return /^\d+$/.test(cleaned) ? Number(cleaned) : null;
};

export type ParsedFields =
  | { ok: true; fields: Record<string, unknown> }
  | { ok: false; problems: Record<string, string>; zodError: ZodError | null };

/**
 * The fields object the API takes, checked with the same shared schema the server uses. Amounts that are
 * not whole dollars are caught here first, so the message says so instead of "expected number".
 */
export function parseFieldValues(
  fieldSet: FieldSet,
  definitions: readonly FieldDefinition[],
  values: FieldValues,
): ParsedFields {
  const fields: Record<string, unknown> = {};
  const problems: Record<string, string> = {};
  for (const definition of definitions) {
    const value = values[definition.path];
    if (definition.kind === "checkbox") {
      setAt(fields, definition.path, value === true);
      continue;
    }
    const text = typeof value === "string" ? value.trim() : "";
    if (text === "") continue;
    if (definition.kind === "dollars") {
      const amount = wholeDollars(text);
      if (amount === null) problems[definition.path] = "Enter whole dollars, e.g. 1,000,000";
      else setAt(fields, definition.path, amount);
    } else if (definition.kind === "level") setAt(fields, definition.path, Number(text));
    else if (definition.kind === "state") setAt(fields, definition.path, text.toUpperCase());
    else if (definition.kind === "names")
      setAt(
        fields,
        definition.path,
        text
          .split(/[;\n]/)
          .map((name) => name.trim())
          .filter((name) => name !== ""),
      );
    else setAt(fields, definition.path, text);
  }
  const parsed = fieldSetSchemas[fieldSet].safeParse(fields);
  if (parsed.success && Object.keys(problems).length === 0) return { ok: true, fields };
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const path = issue.path.map(String).join(".");
      const missing =
        issue.code === "invalid_type" || issue.code === "invalid_format" || issue.code === "too_small";
      const definition = definitions.find((d) => d.path === path);
      problems[path] ??=
        missing && definition && values[path] === ""
          ? `Enter the ${definition.label.toLowerCase()}`
          : issue.message;
    }
  }
  return { ok: false, problems, zodError: parsed.success ? null : parsed.error };
}
