import { fieldSetSchemas, type FieldSet } from "../../shared/credentials/credential-fields.ts";
import type { CredentialTypeDefinition } from "../../shared/credentials/catalogue.ts";
import { documentDateProblems } from "../../shared/credentials/document-dates.ts";
import { credentialLapseInstant } from "../../shared/standing/lapse-instant.ts";
import { AppError } from "../http/app-error.ts";
import { Technician } from "../db/models.ts";

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
  const data = result.data as Record<string, unknown>;
  // Impossible dates are refused here rather than stored: the lapse instant computed from them would mean nothing.
  const problems = documentDateProblems(data);
  if (problems.length > 0) {
    throw new AppError(
      "invalid_input",
      problems[0]!.message,
      problems.map((p) => ({ path: `${prefix}.${p.path}`, message: p.message })),
    );
  }
  return data;
}

/** Technicians an exemption names by id must be the company's own; another company's id is refused, never stored. */
export async function checkNamedTechnicians(
  fields: Record<string, unknown>,
  companyId: number,
  prefix = "body.fields",
): Promise<void> {
  const ids = Array.isArray(fields.technicianIds) ? (fields.technicianIds as number[]) : [];
  if (ids.length === 0) return;
  const own = await Technician.count({ where: { id: ids, companyId } });
  if (own !== new Set(ids).size) {
    throw new AppError("invalid_input", "Some fields need attention", [
      { path: `${prefix}.technicianIds`, message: "name technicians of this company only" },
    ]);
  }
}

export function lapseInstantFor(
  type: CredentialTypeDefinition,
  fields: Record<string, unknown>,
  timeZone: string,
): Date | null {
  return credentialLapseInstant(type, fields as never, timeZone);
}
