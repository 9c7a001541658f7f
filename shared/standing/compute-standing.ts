import { credentialTypeByCode } from "../credentials/catalogue.ts";
import { evaluateRequirement } from "./evaluate-requirement.ts";
import type { Requirement } from "./requirements.ts";
import type {
  RequirementResult,
  Standing,
  StandingCredential,
  StandingOptions,
  StandingResult,
} from "./standing-types.ts";

// Policies an umbrella is written over when the set asks for them on their own; general liability always.
const UNDERLYING_WHEN_REQUIRED = ["auto_liability", "workers_comp"];

/**
 * What an umbrella line needs beneath it for this set: general liability, plus auto and employer's liability when the set
 * requires those policies with no alternative (a line that also accepts a state exemption does not require employer's
 * liability).
 */
export function underlyingTypeCodesFor(requirements: readonly Requirement[]): string[] {
  const required = UNDERLYING_WHEN_REQUIRED.filter((code) =>
    requirements.some(
      (r) => r.typeCodes.includes(code) && r.typeCodes.every((c) => c === code || c === "umbrella_liability"),
    ),
  );
  return ["general_liability", ...required];
}

/** The worst of the requirement results: any unmet → not_cleared; else any lapsing → lapsing; else cleared. */
export function worstStanding(statuses: readonly RequirementResult["status"][]): Standing {
  return statuses.includes("unmet") ? "not_cleared" : statuses.includes("lapsing") ? "lapsing" : "cleared";
}

export function computeStanding(
  requirements: readonly Requirement[],
  credentials: readonly StandingCredential[],
  options: StandingOptions,
): StandingResult {
  const withUnderlying = {
    ...options,
    underlyingTypeCodes: options.underlyingTypeCodes ?? underlyingTypeCodesFor(requirements),
  };
  const results = requirements.map((requirement) =>
    evaluateRequirement(requirement, credentials, withUnderlying),
  );
  const standing = worstStanding(results.map((r) => r.status));
  const lapses = results
    .filter((r) => r.status !== "unmet" && r.lapsesAt !== null)
    .map((r) => r.lapsesAt as string)
    .sort();
  return { standing, earliestLapse: lapses[0] ?? null, results };
}

export interface TechnicianStandingInput {
  /** The employing company's insurance (and any other company-held credentials). */
  companyCredentials: readonly StandingCredential[];
  /** The technician's own training cards and licenses. */
  technicianCredentials: readonly StandingCredential[];
  requirements: readonly Requirement[];
  /** Zone of the company's mailing address: the policy period is read there (standard CGL declarations, ISO CG DS 01: "12:01 A.M. standard time at your mailing address", wording from memory). */
  companyTimeZone: string;
  /** The technician, so a workers' compensation exemption clears only the persons it names. */
  technician: { id: number; name: string };
  /** The company's active technicians: an exemption naming fewer people cannot stand in for a policy. */
  companyHeadcount: number;
  asOf: Date;
  warningDays?: number | undefined;
  types?: StandingOptions["types"];
}

/** A technician's standing: the company's insurance together with the technician's own training. */
export function computeTechnicianStanding(input: TechnicianStandingInput): StandingResult {
  return computeStanding(input.requirements, [...input.companyCredentials, ...input.technicianCredentials], {
    timeZone: input.companyTimeZone,
    asOf: input.asOf,
    warningDays: input.warningDays,
    types: input.types,
    technician: input.technician,
    companyHeadcount: input.companyHeadcount,
  });
}

/**
 * Whether a standing over these credentials can depend on who the technician is. The engine reads the technician (and
 * the company's headcount) only to match a workers' compensation exemption to the persons it names, so with no
 * exemption among them, every technician of a company who holds no credential of their own stands alike.
 */
export function standingReadsTechnician(
  credentials: readonly StandingCredential[],
  types: StandingOptions["types"] = credentialTypeByCode,
): boolean {
  return credentials.some((c) => types.get(c.typeCode)?.fieldSet === "exemption");
}
