import { evaluateRequirement } from "./evaluate-requirement.ts";
import type { Requirement } from "./requirements.ts";
import type {
  RequirementResult,
  Standing,
  StandingCredential,
  StandingOptions,
  StandingResult,
} from "./standing-types.ts";

/** The worst of the requirement results: any unmet → not_cleared; else any lapsing → lapsing; else cleared. */
export function worstStanding(statuses: readonly RequirementResult["status"][]): Standing {
  return statuses.includes("unmet") ? "not_cleared" : statuses.includes("lapsing") ? "lapsing" : "cleared";
}

export function computeStanding(
  requirements: readonly Requirement[],
  credentials: readonly StandingCredential[],
  options: StandingOptions,
): StandingResult {
  const results = requirements.map((requirement) => evaluateRequirement(requirement, credentials, options));
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
  /** Zone of the company's mailing address: the policy period is read there (TRADE-FACTS 1.1). */
  companyTimeZone: string;
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
  });
}
