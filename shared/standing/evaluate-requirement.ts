import { DateTime } from "luxon";
import { credentialTypeByCode, type CredentialTypeDefinition } from "../credentials/catalogue.ts";
import { credentialLapseInstant, credentialStartInstant } from "./lapse-instant.ts";
import { findContentProblem } from "./requirement-content.ts";
import type { Requirement } from "./requirements.ts";
import type {
  RequirementResult,
  StandingCredential,
  StandingOptions,
  UnmetReason,
} from "./standing-types.ts";
import { addCalendarMonths, endOfValidThroughInstant } from "./training-validity.ts";
import { LAPSING_WINDOW_DAYS, MS_PER_DAY, daysUntil } from "./warning-windows.ts";

interface Candidate {
  credential: StandingCredential;
  type: CredentialTypeDefinition;
  startsAt: Date;
  /** Earlier of the credential's own lapse and the site's maximum age; null = never. */
  endsAt: Date | null;
  endedByAge: boolean;
  reason: UnmetReason | null;
  detail: string;
}

// When nothing meets a requirement, the candidate shown is the one closest to meeting it: a document under review
// beats one that starts later, a returned one (the holder can act on it), a wrong one, and finally an old one.
const UNMET_RANK: Record<UnmetReason, number> = {
  awaiting_verification: 0,
  not_yet_in_force: 1,
  returned: 2,
  below_limit: 3,
  flag_absent: 3,
  wrong_control_family: 3,
  below_level: 3,
  too_old: 4,
  lapsed: 5,
  missing: 6,
};

const endMs = (end: Date | null): number => end?.getTime() ?? Number.POSITIVE_INFINITY;

function localDate(instant: Date, timeZone: string): string {
  return DateTime.fromJSDate(instant, { zone: timeZone }).toISODate() ?? instant.toISOString();
}

function issueDateOf(credential: StandingCredential): string | undefined {
  return "issueDate" in credential.fields ? credential.fields.issueDate : credential.issuedOn;
}

function ageLimitInstant(
  requirement: Requirement,
  credential: StandingCredential,
  timeZone: string,
): Date | null {
  const issued = issueDateOf(credential);
  if (requirement.maxAgeMonths === undefined || issued === undefined) return null;
  // Same convention as a training card: counts through issue + N months, ends at the next local midnight.
  return endOfValidThroughInstant(addCalendarMonths(issued, requirement.maxAgeMonths), timeZone);
}

/** A credential as people know it: its type and the number printed on it, never an internal id. */
function nameOf(type: CredentialTypeDefinition, credential: StandingCredential): string {
  const f = credential.fields as Partial<
    Record<"policyNumber" | "licenseNumber" | "certificateNumber" | "cardNumber", string>
  >;
  const reference = f.policyNumber ?? f.licenseNumber ?? f.certificateNumber ?? f.cardNumber;
  return reference ? `${type.name} ${reference}` : type.name;
}

function assess(
  requirement: Requirement,
  credential: StandingCredential,
  type: CredentialTypeDefinition,
  options: StandingOptions,
): Candidate {
  const { timeZone, asOf } = options;
  const ownEnd = credentialLapseInstant(type, credential.fields, timeZone);
  const ageEnd = ageLimitInstant(requirement, credential, timeZone);
  const endedByAge = ageEnd !== null && endMs(ageEnd) < endMs(ownEnd);
  const endsAt = endedByAge ? ageEnd : ownEnd;
  const startsAt = credentialStartInstant(type, credential.fields, timeZone);
  const base = { credential, type, startsAt, endsAt, endedByAge };
  const named = nameOf(type, credential);

  if (credential.state === "returned")
    return { ...base, reason: "returned", detail: `${named} was returned to the holder.` };
  // A lapse instant at or before asOf ends the credential even if its state still says verified (the daily job may not have run).
  if (credential.state === "lapsed" || endMs(endsAt) <= asOf.getTime()) {
    const on = endsAt ? ` on ${localDate(endsAt, timeZone)}` : "";
    if (endedByAge) {
      const detail = `${named} was issued ${issueDateOf(credential)}, older than the ${requirement.maxAgeMonths} months this site allows.`;
      return { ...base, reason: "too_old", detail };
    }
    return { ...base, reason: "lapsed", detail: `${named} lapsed${on}.` };
  }
  if (startsAt.getTime() > asOf.getTime()) {
    return {
      ...base,
      reason: "not_yet_in_force",
      detail: `${named} starts on ${localDate(startsAt, timeZone)}.`,
    };
  }
  const problem = findContentProblem(requirement, type, credential.fields);
  if (problem) return { ...base, ...problem };
  if (credential.state === "submitted") {
    return { ...base, reason: "awaiting_verification", detail: `${named} is awaiting verification.` };
  }
  return { ...base, reason: null, detail: `Met by ${named}.` };
}

/**
 * How long the requirement stays met: a verified renewal that starts by the time the current credential ends carries the
 * coverage on, so a renewal already on file does not trigger a "lapsing" warning.
 */
function coveredUntil(
  met: Candidate,
  candidates: readonly Candidate[],
  requirement: Requirement,
): Date | null {
  let end = met.endsAt;
  const successors = candidates.filter(
    (c) =>
      c.credential.state === "verified" &&
      findContentProblem(requirement, c.type, c.credential.fields) === null,
  );
  for (;;) {
    if (end === null) return null;
    const at = end.getTime();
    const next = successors
      .filter((c) => c.startsAt.getTime() <= at && endMs(c.endsAt) > at)
      .sort((a, b) => endMs(b.endsAt) - endMs(a.endsAt))[0];
    if (!next) return end;
    end = next.endsAt;
  }
}

function describeMet(
  met: Candidate,
  lapsesAt: Date | null,
  lapsing: boolean,
  options: StandingOptions,
): string {
  const named = nameOf(met.type, met.credential);
  if (lapsesAt === null) return `Met by ${named}; it does not expire.`;
  const until = localDate(lapsesAt, options.timeZone);
  return lapsing
    ? `Met by ${named}; lapsing in ${daysUntil(lapsesAt, options.asOf)} days (${until}).`
    : `Met by ${named} until ${until}.`;
}

function typeNames(requirement: Requirement, types: ReadonlyMap<string, CredentialTypeDefinition>): string {
  return requirement.typeCodes.map((code) => types.get(code)?.name ?? code).join(" or ");
}

/** Evaluates one requirement against every credential on file, at `asOf`. */
export function evaluateRequirement(
  requirement: Requirement,
  credentials: readonly StandingCredential[],
  options: StandingOptions,
): RequirementResult {
  const types = options.types ?? credentialTypeByCode;
  const warningDays = options.warningDays ?? LAPSING_WINDOW_DAYS;
  const candidates = credentials
    .filter((c) => requirement.typeCodes.includes(c.typeCode) && c.state !== "superseded")
    .map((c) => {
      const type = types.get(c.typeCode);
      if (!type) throw new RangeError(`Unknown credential type ${c.typeCode}`);
      return { credential: c, type };
    })
    .filter(({ credential, type }) => credential.holder === type.holder)
    .map(({ credential, type }) => assess(requirement, credential, type, options));

  const met = candidates
    .filter((c) => c.reason === null)
    .sort((a, b) => endMs(b.endsAt) - endMs(a.endsAt))[0];
  if (met) {
    const lapsesAt = coveredUntil(met, candidates, requirement);
    const lapsing =
      lapsesAt !== null && lapsesAt.getTime() - options.asOf.getTime() <= warningDays * MS_PER_DAY;
    return {
      requirement,
      status: lapsing ? "lapsing" : "met",
      reason: null,
      detail: describeMet(met, lapsesAt, lapsing, options),
      credentialId: met.credential.id,
      lapsesAt: lapsesAt?.toISOString() ?? null,
    };
  }

  const closest = candidates
    .filter((c): c is Candidate & { reason: UnmetReason } => c.reason !== null)
    .sort((a, b) => UNMET_RANK[a.reason] - UNMET_RANK[b.reason] || endMs(b.endsAt) - endMs(a.endsAt))[0];
  if (!closest) {
    return {
      requirement,
      status: "unmet",
      reason: "missing",
      detail: `No ${typeNames(requirement, types)} on file.`,
      credentialId: null,
      lapsesAt: null,
    };
  }
  return {
    requirement,
    status: "unmet",
    reason: closest.reason,
    detail: closest.detail,
    credentialId: closest.credential.id,
    lapsesAt: closest.endsAt?.toISOString() ?? null,
  };
}
