import { fieldSetSchemas, type FieldSet } from "../../shared/credentials/credential-fields.ts";
import type { CredentialTypeDefinition } from "../../shared/credentials/catalogue.ts";
import { credentialLapseInstant } from "../../shared/standing/lapse-instant.ts";
import { AppError } from "../http/app-error.ts";

/** Parses fields with the type's own schema; problems are reported under body.fields.<path>. */
export function parseFields(
  fieldSet: FieldSet,
  fields: unknown,
  prefix = "body.fields",
): Record<string, unknown> {
  const result = fieldSetSchemas[fieldSet].safeParse(fields);
  if (!result.success) {
    throw new AppError(
      "invalid_input",
      "Some fields need attention",
      result.error.issues.map((i) => ({
        path: [prefix, ...i.path.map(String)].join("."),
        message: i.message,
      })),
    );
  }
  // An end date before the start is a reviewer warning, not a refusal: the certificate itself may say so.
  return result.data as Record<string, unknown>;
}

export function lapseInstantFor(
  type: CredentialTypeDefinition,
  fields: Record<string, unknown>,
  timeZone: string,
): Date | null {
  return credentialLapseInstant(type, fields as never, timeZone);
}
