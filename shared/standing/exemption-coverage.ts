import type { ExemptionFields } from "../credentials/credential-fields.ts";
import { normalisePersonName } from "../credentials/reviewer-checks.ts";
import type { StandingOptions } from "./standing-types.ts";

/** The persons a state's exemption names; older rows carry only the holder's name. */
export function personsCoveredBy(fields: ExemptionFields): string[] {
  return fields.personsCovered.length > 0 ? fields.personsCovered : [fields.holderName];
}

/**
 * Why an exemption does not stand in for a workers' compensation policy for this technician, or null when it does.
 * A state exempts named persons (a sole proprietor, or officers or members), never the company's employees: it clears
 * only the technicians it names, and a company with more people than it names needs a policy (common practice; the
 * rules vary by state).
 */
export function checkExemptionCovers(
  fields: ExemptionFields,
  options: Pick<StandingOptions, "technician" | "companyHeadcount">,
): string | null {
  const persons = personsCoveredBy(fields);
  const { technician, companyHeadcount } = options;
  if (!technician) return "an exemption covers only the persons it names, and no technician was given.";
  const wanted = normalisePersonName(technician.name);
  const named =
    fields.technicianIds.includes(technician.id) ||
    persons.some((person) => normalisePersonName(person) === wanted);
  if (!named) {
    return `the ${fields.state} exemption names ${persons.join(", ")}, not ${technician.name}; it covers only the persons it names.`;
  }
  if (companyHeadcount !== undefined && companyHeadcount > persons.length) {
    return `the company has ${companyHeadcount} technicians and the exemption names ${persons.length}; employees need a workers' compensation policy.`;
  }
  return null;
}
