import { formatCalendarDate, formatLocalDate } from "../dates/local-time.ts";
import { credentialTypeByCode, type CredentialTypeDefinition } from "../credentials/catalogue.ts";
import { credentialLapseInstant, credentialStartInstant } from "./lapse-instant.ts";
import { checkExemptionCovers } from "./exemption-coverage.ts";
import {
  compareLimits,
  findContentProblem,
  shortTypeName,
  wantsStackedLimits,
} from "./requirement-content.ts";
import type { Requirement } from "./requirements.ts";
import type {
  LimitLine,
  RequirementResult,
  StandingCredential,
  StandingOptions,
  UnmetReason,
} from "./standing-types.ts";
import { addCalendarMonths, endOfValidThroughInstant } from "./training-validity.ts";
import { LAPSING_WINDOW_DAYS, MS_PER_DAY, daysUntil } from "./warning-windows.ts";
import { fieldsForBuyers } from "../credentials/fields-for-buyers.ts";

interface Candidate {
  credential: StandingCredential;
  type: CredentialTypeDefinition;
  startsAt: Date;
  /** Earlier of the credential's own lapse and the site's maximum age; null = never. */
  endsAt: Date | null;
  endedByAge: boolean;
  reason: UnmetReason | null;
  detail: string;
  /** The umbrella stacked over this policy, or the policy under this umbrella. */
  also: Candidate[];
  /** Set when the line is met another way than by this one document alone ("GL $1M + umbrella $4M"). */
  metBy?: string;
  limitLines?: LimitLine[];
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
  underlying_missing: 3,
  exemption_does_not_cover: 3,
  too_old: 4,
  lapsed: 5,
  missing: 6,
};

const endMs = (end: Date | null): number => end?.getTime() ?? Number.POSITIVE_INFINITY;

const localDate = formatLocalDate;

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
// Detail sentences reach buyers, so a credential is named only by a number buyers may read (a policy or license
// number); a card or exemption certificate number stays with the holder.
function nameOf(type: CredentialTypeDefinition, credential: StandingCredential): string {
  const f = fieldsForBuyers(credential.fields as Record<string, unknown>) as Partial<
    Record<"policyNumber" | "licenseNumber", string>
  >;
  const reference = f.policyNumber ?? f.licenseNumber;
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
  // A site's interval replaces the catalog's default for a card that prints no expiry (the site decides how often it
  // wants retraining where the regulation sets no calendar interval); a printed expiry that comes sooner still ends it.
  const printsExpiry = "expiryDate" in credential.fields && credential.fields.expiryDate !== undefined;
  const siteDecides = (type.fieldSet === "training" || type.fieldSet === "oem") && !printsExpiry;
  const endedByAge = ageEnd !== null && (siteDecides || endMs(ageEnd) < endMs(ownEnd));
  const endsAt = endedByAge ? ageEnd : ownEnd;
  const startsAt = credentialStartInstant(type, credential.fields, timeZone);
  const base = { credential, type, startsAt, endsAt, endedByAge, also: [] };
  const named = nameOf(type, credential);

  if (credential.state === "returned")
    return { ...base, reason: "returned", detail: `${named} was returned to the holder.` };
  // A lapse instant at or before asOf ends the credential even if its state still says verified (the daily job may not have run).
  if (credential.state === "lapsed" || endMs(endsAt) <= asOf.getTime()) {
    const on = endsAt ? ` on ${localDate(endsAt, timeZone)}` : "";
    if (endedByAge) {
      const detail = `${named} was issued ${formatCalendarDate(issueDateOf(credential) ?? "")}, older than the ${requirement.maxAgeMonths} months this site allows.`;
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
  if (type.fieldSet === "exemption" && "personsCovered" in credential.fields) {
    const gap = checkExemptionCovers(credential.fields, options);
    if (gap) return { ...base, reason: "exemption_does_not_cover", detail: `${named}: ${gap}` };
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
  const named =
    met.also.length === 0
      ? nameOf(met.type, met.credential)
      : `${met.metBy} (${[met, ...met.also].map((c) => nameOf(c.type, c.credential)).join(" and ")})`;
  if (lapsesAt === null) return `Met by ${named}; it does not expire.`;
  const until = localDate(lapsesAt, options.timeZone);
  return lapsing
    ? `Met by ${named}; lapsing in ${daysUntil(lapsesAt, options.asOf)} days (${until}).`
    : `Met by ${named} until ${until}.`;
}

function typeNames(requirement: Requirement, types: ReadonlyMap<string, CredentialTypeDefinition>): string {
  return requirement.typeCodes.map((code) => types.get(code)?.name ?? code).join(" or ");
}

const UMBRELLA = "umbrella_liability";

function limitWordsShort(line: LimitLine): string {
  return line.limit.replace(/([A-Z])/g, " $1").toLowerCase();
}

/** How a met line reads in a table cell: the limits and the documents behind them, or the document's name. */
function metByOf(requirement: Requirement, met: Candidate): string {
  if (met.metBy) return met.metBy;
  if (met.credential.fields && "limits" in met.credential.fields && requirement.minLimits) {
    const lines = compareLimits(requirement, met.type, met.credential.fields);
    if (lines.length > 0) return lines.map((l) => `${l.how} ${limitWordsShort(l)}`).join("; ");
  }
  if ("state" in met.credential.fields && met.type.fieldSet === "exemption") {
    return `${met.credential.fields.state} exemption`;
  }
  return met.type.name;
}

/** Verified company policies of these types, in force at asOf, each with its own start and end. */
function policiesInForce(
  codes: readonly string[],
  credentials: readonly StandingCredential[],
  types: ReadonlyMap<string, CredentialTypeDefinition>,
  options: StandingOptions,
): Map<string, Candidate[]> {
  const out = new Map<string, Candidate[]>();
  for (const code of codes) {
    const type = types.get(code);
    if (!type) continue;
    const inForce = credentials
      .filter((c) => c.typeCode === code && c.holder === "company" && c.state === "verified")
      .map((c) => assess({ label: type.name, typeCodes: [code] }, c, type, options))
      .filter((c) => c.reason === null)
      .sort((a, b) => endMs(b.endsAt) - endMs(a.endsAt));
    out.set(code, inForce);
  }
  return out;
}

/**
 * An umbrella or excess policy pays only above its scheduled underlying policies (common practice), so an umbrella line
 * counts only while general liability (and any auto or employer's liability the set requires) is in force beneath
 * it; the line ends when the first of them ends.
 */
function withUnderlying(
  umbrella: Candidate,
  credentials: readonly StandingCredential[],
  types: ReadonlyMap<string, CredentialTypeDefinition>,
  options: StandingOptions,
): Candidate {
  if (umbrella.reason !== null && umbrella.reason !== "awaiting_verification") return umbrella;
  const codes = options.underlyingTypeCodes ?? ["general_liability"];
  const found = policiesInForce(codes, credentials, types, options);
  const missing = codes.filter((code) => (found.get(code) ?? []).length === 0);
  if (missing.length > 0) {
    const names = missing.map((code) => types.get(code)?.name ?? code).join(" and ");
    return {
      ...umbrella,
      reason: "underlying_missing",
      detail: `${umbrella.type.name} (credential ${umbrella.credential.id}) counts only over its underlying policies; no verified ${names} is in force.`,
    };
  }
  const under = codes
    .map((code) => (found.get(code) ?? [])[0])
    .filter((c): c is Candidate => c !== undefined);
  const endsAt = [umbrella, ...under].reduce<Date | null>(
    (soonest, c) => (endMs(c.endsAt) < endMs(soonest) ? c.endsAt : soonest),
    null,
  );
  return {
    ...umbrella,
    endsAt,
    also: under,
    metBy: `${shortTypeName(umbrella.type)} over ${under.map((c) => shortTypeName(c.type)).join(" + ")}`,
  };
}

/**
 * A primary policy that falls short only on limits an umbrella stacks over (each occurrence, aggregate) is met by the
 * two together when both are in force at the same instant (common practice: GL $1M + umbrella $4M meets $5M).
 */
function stackedCandidates(
  requirement: Requirement,
  primaries: readonly Candidate[],
  credentials: readonly StandingCredential[],
  types: ReadonlyMap<string, CredentialTypeDefinition>,
  options: StandingOptions,
): Candidate[] {
  const umbrellaType = types.get(UMBRELLA);
  if (!umbrellaType || !wantsStackedLimits(requirement)) return [];
  const umbrellas = credentials
    .filter((c) => c.typeCode === UMBRELLA && c.holder === "company" && c.state !== "superseded")
    .map((c) => assess({ label: umbrellaType.name, typeCodes: [UMBRELLA] }, c, umbrellaType, options))
    .filter((c) => c.reason === null || c.reason === "awaiting_verification");
  const out: Candidate[] = [];
  for (const primary of primaries) {
    if (primary.reason !== "below_limit" || primary.type.code === UMBRELLA) continue;
    if (!("limits" in primary.credential.fields)) continue;
    const primaryFields = primary.credential.fields;
    for (const umbrella of umbrellas) {
      if (!("limits" in umbrella.credential.fields)) continue;
      const over = { type: umbrella.type, fields: umbrella.credential.fields };
      const problem = findContentProblem(requirement, primary.type, primaryFields, over);
      const lines = compareLimits(requirement, primary.type, primaryFields, over);
      const awaiting =
        umbrella.reason === "awaiting_verification" || primary.credential.state === "submitted";
      const endsAt = endMs(umbrella.endsAt) < endMs(primary.endsAt) ? umbrella.endsAt : primary.endsAt;
      const metBy = lines.map((l) => `${l.how} ${limitWordsShort(l)}`).join("; ");
      out.push({
        ...primary,
        endsAt,
        also: [umbrella],
        limitLines: lines,
        metBy,
        ...(problem
          ? problem
          : awaiting
            ? { reason: "awaiting_verification" as const, detail: `${metBy}: awaiting verification.` }
            : { reason: null, detail: `Met by ${metBy}.` }),
      });
    }
  }
  return out;
}

/** Evaluates one requirement against every credential on file, at `asOf`. */
export function evaluateRequirement(
  requirement: Requirement,
  credentials: readonly StandingCredential[],
  options: StandingOptions,
): RequirementResult {
  const types = options.types ?? credentialTypeByCode;
  const warningDays = options.warningDays ?? LAPSING_WINDOW_DAYS;
  const single = credentials
    .filter((c) => requirement.typeCodes.includes(c.typeCode) && c.state !== "superseded")
    .map((c) => {
      const type = types.get(c.typeCode);
      if (!type) throw new RangeError(`Unknown credential type ${c.typeCode}`);
      return { credential: c, type };
    })
    .filter(({ credential, type }) => credential.holder === type.holder)
    .map(({ credential, type }) => assess(requirement, credential, type, options))
    .map((c) => (c.type.code === UMBRELLA ? withUnderlying(c, credentials, types, options) : c));
  const candidates = [...single, ...stackedCandidates(requirement, single, credentials, types, options)];

  const met = candidates
    .filter((c) => c.reason === null)
    .sort((a, b) => a.also.length - b.also.length || endMs(b.endsAt) - endMs(a.endsAt))[0];
  if (met) {
    // A line that leans on two documents ends with the first of them; renewals are not chained across the pair.
    const lapsesAt = met.also.length > 0 ? met.endsAt : coveredUntil(met, candidates, requirement);
    const lapsing =
      lapsesAt !== null && lapsesAt.getTime() - options.asOf.getTime() <= warningDays * MS_PER_DAY;
    const limitLines =
      met.limitLines ??
      ("limits" in met.credential.fields && requirement.minLimits
        ? compareLimits(requirement, met.type, met.credential.fields)
        : []);
    return {
      requirement,
      status: lapsing ? "lapsing" : "met",
      reason: null,
      detail: describeMet(met, lapsesAt, lapsing, options),
      credentialId: met.credential.id,
      lapsesAt: lapsesAt?.toISOString() ?? null,
      metBy: metByOf(requirement, met),
      alsoCredentialIds: met.also.map((c) => c.credential.id),
      limitLines,
    };
  }

  const closest = candidates
    .filter((c): c is Candidate & { reason: UnmetReason } => c.reason !== null)
    .sort(
      (a, b) =>
        UNMET_RANK[a.reason] - UNMET_RANK[b.reason] ||
        b.also.length - a.also.length ||
        endMs(b.endsAt) - endMs(a.endsAt),
    )[0];
  if (!closest) {
    return {
      requirement,
      status: "unmet",
      reason: "missing",
      detail: `No ${typeNames(requirement, types)} on file.`,
      credentialId: null,
      lapsesAt: null,
      metBy: null,
    };
  }
  return {
    requirement,
    status: "unmet",
    reason: closest.reason,
    detail: closest.detail,
    credentialId: closest.credential.id,
    lapsesAt: closest.endsAt?.toISOString() ?? null,
    metBy: null,
    alsoCredentialIds: closest.also.map((c) => c.credential.id),
    limitLines:
      closest.limitLines ??
      ("limits" in closest.credential.fields && requirement.minLimits
        ? compareLimits(requirement, closest.type, closest.credential.fields)
        : []),
  };
}
