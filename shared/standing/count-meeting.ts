import type { CredentialTypeDefinition } from "../credentials/catalogue.ts";
import { worstStanding } from "./compute-standing.ts";
import { evaluateRequirement } from "./evaluate-requirement.ts";
import type { Requirement } from "./requirements.ts";
import type { RequirementResult, StandingCredential } from "./standing-types.ts";

export interface CountedTechnician {
  id: number;
  companyId: number;
  /** Zone of the employing company's mailing address. */
  timeZone: string;
}

export interface CountMeetingInput {
  requirements: readonly Requirement[];
  technicians: readonly CountedTechnician[];
  companyCredentials: ReadonlyMap<number, readonly StandingCredential[]>;
  technicianCredentials: ReadonlyMap<number, readonly StandingCredential[]>;
  types: ReadonlyMap<string, CredentialTypeDefinition>;
  asOf: Date;
  warningDays: number;
}

/**
 * How many of the technicians are cleared or lapsing against the requirements, with the same engine as the stored
 * standings. A requirement met only by company-held types (insurance) has one answer per company, so it is evaluated
 * once per company rather than once per technician of that company.
 */
export function countMeeting(input: CountMeetingInput): { cleared: number; lapsing: number } {
  const heldBy = input.requirements.map((r) =>
    r.typeCodes.every((code) => input.types.get(code)?.holder === "company") ? "company" : "technician",
  );
  const memo = new Map<string, RequirementResult["status"]>();
  let cleared = 0;
  let lapsing = 0;
  for (const technician of input.technicians) {
    const statuses = input.requirements.map((requirement, i) => {
      const key = heldBy[i] === "company" ? `${i}:c${technician.companyId}` : `${i}:t${technician.id}`;
      let status = memo.get(key);
      if (status === undefined) {
        const credentials = [
          ...(input.companyCredentials.get(technician.companyId) ?? []),
          ...(heldBy[i] === "company" ? [] : (input.technicianCredentials.get(technician.id) ?? [])),
        ];
        status = evaluateRequirement(requirement, credentials, {
          timeZone: technician.timeZone,
          asOf: input.asOf,
          warningDays: input.warningDays,
          types: input.types,
        }).status;
        memo.set(key, status);
      }
      return status;
    });
    const standing = worstStanding(statuses);
    if (standing === "cleared") cleared += 1;
    else if (standing === "lapsing") lapsing += 1;
  }
  return { cleared, lapsing };
}
