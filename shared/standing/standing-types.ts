import type { CredentialHolder, CredentialTypeDefinition } from "../credentials/catalogue.ts";
import type { CredentialFields, LimitName } from "../credentials/credential-fields.ts";
import type { Requirement } from "./requirements.ts";

export const credentialStates = ["submitted", "verified", "returned", "superseded", "lapsed"] as const;
export type CredentialState = (typeof credentialStates)[number];

/** A credential as standing needs it: its fields are already parsed with the fieldSet's schema from credential-fields.ts. */
export interface StandingCredential {
  id: number;
  typeCode: string;
  state: CredentialState;
  fields: CredentialFields;
  holder: CredentialHolder;
  /** Issue date of the document when its fields carry none (ISO date). */
  issuedOn?: string | undefined;
}

export const requirementStatuses = ["met", "lapsing", "unmet"] as const;
export type RequirementStatus = (typeof requirementStatuses)[number];

export const unmetReasons = [
  "missing",
  "awaiting_verification",
  "returned",
  "lapsed",
  "not_yet_in_force",
  "below_limit",
  "flag_absent",
  "wrong_control_family",
  "below_level",
  "too_old",
  "underlying_missing",
  "exemption_does_not_cover",
] as const;
export type UnmetReason = (typeof unmetReasons)[number];

export interface RequirementResult {
  requirement: Requirement;
  status: RequirementStatus;
  reason: UnmetReason | null;
  /** One sentence for people, e.g. "Commercial general liability lapsed on Jul 15, 2027." */
  detail: string;
  /** The credential that met it; when unmet, the closest candidate (null when none is on file). */
  credentialId: number | null;
  /** ISO instant when the requirement stops being met (met/lapsing) or when the candidate ended (unmet); null = never. */
  lapsesAt: string | null;
  /** How the line was met, short enough for a table cell: "GL $1M + umbrella $4M"; null when unmet. */
  metBy?: string | null;
  /** Every other credential the line leans on (the umbrella over a GL policy, the GL under an umbrella). */
  alsoCredentialIds?: number[];
  /** Each required limit compared on its own line (employer's liability each accident, disease each employee, ...). */
  limitLines?: LimitLine[];
}

export interface LimitLine {
  limit: LimitName;
  required: number;
  /** What the documents show together (primary plus any umbrella stacked over it); null when not shown. */
  shown: number | null;
  met: boolean;
  /** "GL $1M + umbrella $4M" when stacked, "GL $1M" otherwise. */
  how: string;
}

export const standings = ["cleared", "lapsing", "not_cleared"] as const;
export type Standing = (typeof standings)[number];

export interface StandingResult {
  standing: Standing;
  /** Earliest lapse among the requirements that are met now (ISO instant), null when none of them lapses. */
  earliestLapse: string | null;
  results: RequirementResult[];
}

export interface StandingOptions {
  /** IANA zone of the insured's mailing address, also used for the technician's cards. */
  timeZone: string;
  asOf: Date;
  /** A met requirement whose lapse is within this many days is "lapsing". */
  warningDays?: number | undefined;
  /**
   * The technician whose standing this is: a workers' compensation exemption counts only for the persons it names.
   * Absent, no exemption can be matched to a person and none counts.
   */
  technician?: { id: number; name: string } | undefined;
  /** How many people the company employs (its active technicians); an exemption naming fewer cannot stand in for a policy. */
  companyHeadcount?: number | undefined;
  /** Policies an umbrella line needs in force beneath it; computeStanding derives them from the whole set. */
  underlyingTypeCodes?: readonly string[] | undefined;
  /** Credential catalogue; defaults to the built-in one. */
  types?: ReadonlyMap<string, CredentialTypeDefinition> | undefined;
}
