import { ZodError } from "zod";
import { isApiError } from "./api-client.ts";

/** Field path ("email", "address.postalCode") to the first message for it. */
export type FieldErrors = Readonly<Record<string, string>>;

/**
 * The server names where a problem sits in the request ("body.email", "query.page", "params.id");
 * a form knows its inputs by the part after that, so the leading segment goes for mapping only.
 */
export const formPathOf = (serverPath: string): string => serverPath.replace(/^(body|query|params)\./, "");

/**
 * Per-field messages from a zod failure (client-side) or from an API error's `fields` (server-side).
 * `plainWords` replaces zod's generic wording for a missing or empty value where the shared schema has no message of its own.
 */
export function fieldErrorsOf(error: unknown, plainWords: FieldErrors = {}): FieldErrors {
  const out: Record<string, string> = {};
  if (error instanceof ZodError) {
    for (const issue of error.issues) {
      const path = issue.path.map(String).join(".");
      const missing =
        issue.code === "too_small" || issue.code === "invalid_value" || issue.code === "invalid_type";
      out[path] ??= (missing ? plainWords[path] : undefined) ?? issue.message;
    }
  } else if (isApiError(error)) {
    for (const field of error.fields) out[formPathOf(field.path)] ??= field.message;
  }
  return out;
}

/** The sentence shown above a form: the server's message, or a nudge to fix the fields. */
export function formMessageOf(error: unknown): string | null {
  if (!error) return null;
  if (error instanceof ZodError) return "Check the fields marked below.";
  if (isApiError(error)) return error.message;
  return "Something went wrong. Try again.";
}

/** The errors below one prefix, with the prefix removed ("fields.limits.eachOccurrence" → "limits.eachOccurrence"). */
export function fieldErrorsUnder(errors: FieldErrors, prefix: string): FieldErrors {
  const out: Record<string, string> = {};
  for (const [path, message] of Object.entries(errors)) {
    if (path.startsWith(prefix)) out[path.slice(prefix.length)] ??= message;
    else out[path] ??= message;
  }
  return out;
}
