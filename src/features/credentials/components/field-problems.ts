import { ApiError } from "@/lib/api-client.ts";
import { fieldErrorsOf, fieldErrorsUnder } from "@/lib/field-errors.ts";
import type { FieldDefinition } from "./field-definitions.ts";

/**
 * The server reports a field of a credential as "body.fields.limits.eachOccurrence"; the inputs know it
 * as "limits.eachOccurrence". Other paths (typeCode, documentId) keep their names.
 */
export const credentialFieldErrorsOf = (error: unknown): Record<string, string> => ({
  ...fieldErrorsUnder(fieldErrorsOf(error), "fields."),
});

/** An error FormError can summarise, with each problem under the path its input carries. */
export const problemsAsError = (message: string, problems: Readonly<Record<string, string>>): ApiError =>
  new ApiError(
    422,
    "invalid_input",
    message,
    Object.entries(problems).map(([path, text]) => ({ path, message: text })),
  );

export const labelsOf = (definitions: readonly FieldDefinition[]): Record<string, string> =>
  Object.fromEntries(definitions.map((d) => [d.path, d.label]));
