import type { CredentialTypeDefinition } from "../credentials/catalogue.ts";
import type { CredentialFields, InsuranceFields, LimitName } from "../credentials/credential-fields.ts";
import type { Requirement } from "./requirements.ts";
import type { LimitLine, UnmetReason } from "./standing-types.ts";

export interface ContentProblem {
  reason: Extract<UnmetReason, "below_limit" | "flag_absent" | "wrong_control_family" | "below_level">;
  detail: string;
}

const dollars = new Intl.NumberFormat("en-US");

function limitWords(name: LimitName): string {
  return name.replace(/([A-Z])/g, " $1").toLowerCase();
}

function sameName(a: string, b: string): boolean {
  return a.trim().localeCompare(b.trim(), "en", { sensitivity: "base" }) === 0;
}

/** "$1M", "$1.5M", "$500K", "$7,500": how limits are said aloud on a certificate. */
export function shortDollars(amount: number): string {
  if (amount >= 1_000_000 && amount % 100_000 === 0) return `$${amount / 1_000_000}M`;
  if (amount >= 1_000 && amount % 1_000 === 0) return `$${amount / 1_000}K`;
  return `$${dollars.format(amount)}`;
}

const SHORT_TYPE_NAMES: Record<string, string> = {
  general_liability: "GL",
  auto_liability: "auto",
  workers_comp: "WC/EL",
  umbrella_liability: "umbrella",
};

export function shortTypeName(type: CredentialTypeDefinition): string {
  return SHORT_TYPE_NAMES[type.code] ?? type.name;
}

/**
 * The limits an umbrella or excess policy adds on top of the primary policy's (common practice: the umbrella sits over
 * the scheduled underlying policies, so a $5M each-occurrence requirement is met by GL $1M + umbrella $4M).
 */
export const STACKABLE_LIMITS: Partial<Record<LimitName, LimitName>> = {
  eachOccurrence: "umbrellaEachOccurrence",
  generalAggregate: "umbrellaAggregate",
};

export function wantsStackedLimits(requirement: Requirement): boolean {
  return Object.keys(requirement.minLimits ?? {}).some((name) => name in STACKABLE_LIMITS);
}

/** Each required limit on its own line, with an umbrella's limits added where they stack. */
export function compareLimits(
  requirement: Requirement,
  type: CredentialTypeDefinition,
  fields: InsuranceFields,
  umbrella?: { type: CredentialTypeDefinition; fields: InsuranceFields },
): LimitLine[] {
  return (Object.entries(requirement.minLimits ?? {}) as [LimitName, number][]).map(([limit, required]) => {
    const own = fields.limits[limit];
    const stackName = STACKABLE_LIMITS[limit];
    const over = umbrella && stackName ? umbrella.fields.limits[stackName] : undefined;
    const parts = [own === undefined ? null : `${shortTypeName(type)} ${shortDollars(own)}`];
    if (umbrella && over !== undefined) parts.push(`${shortTypeName(umbrella.type)} ${shortDollars(over)}`);
    const shown = own === undefined && over === undefined ? null : (own ?? 0) + (over ?? 0);
    return {
      limit,
      required,
      shown,
      met: shown !== null && shown >= required,
      how: parts.filter((p) => p !== null).join(" + ") || "not shown",
    };
  });
}

/**
 * What the document itself fails to show, whatever its dates. Limits and flags apply to insurance only: a state
 * exemption that satisfies a workers' comp line has no insurer, so no limit and nothing to subrogate. Builder,
 * control family and level apply to machine-builder training only. `umbrella` is a policy stacked over this one.
 */
export function findContentProblem(
  requirement: Requirement,
  type: CredentialTypeDefinition,
  fields: CredentialFields,
  umbrella?: { type: CredentialTypeDefinition; fields: InsuranceFields },
): ContentProblem | null {
  if (type.fieldSet === "insurance" && "limits" in fields) {
    const short = compareLimits(requirement, type, fields, umbrella).filter((line) => !line.met);
    if (short.length > 0) {
      const lines = short.map(
        (line) =>
          `${limitWords(line.limit)} is ${line.shown === null ? "not shown" : dollars.format(line.shown)}` +
          (line.how.includes("+") ? ` (${line.how})` : "") +
          `; this site requires ${dollars.format(line.required)}`,
      );
      return { reason: "below_limit", detail: `${type.name}: ${lines.join("; ")}.` };
    }
    // Workers' compensation Part One pays the benefits the state's statute sets, printed "Per statute" on a certificate.
    if (requirement.statutory && !fields.statutory) {
      return { reason: "flag_absent", detail: `${type.name} does not show statutory limits (per statute).` };
    }
    if (requirement.additionalInsured && !fields.additionalInsured) {
      return { reason: "flag_absent", detail: `${type.name} does not show the site as additional insured.` };
    }
    if (requirement.waiverOfSubrogation && !fields.waiverOfSubrogation) {
      return { reason: "flag_absent", detail: `${type.name} does not show a waiver of subrogation.` };
    }
  }
  const wantsOem =
    requirement.builder !== undefined ||
    requirement.controlFamily !== undefined ||
    requirement.minLevel !== undefined;
  if (!wantsOem) return null;
  if (!("controlFamily" in fields)) {
    return { reason: "wrong_control_family", detail: `${type.name} is not machine-builder training.` };
  }
  if (requirement.builder !== undefined && !sameName(requirement.builder, fields.builder)) {
    return {
      reason: "wrong_control_family",
      detail: `Training is from ${fields.builder}; this site requires ${requirement.builder}.`,
    };
  }
  if (requirement.controlFamily !== undefined && !sameName(requirement.controlFamily, fields.controlFamily)) {
    return {
      reason: "wrong_control_family",
      detail: `Training covers the ${fields.controlFamily} control family; this site requires ${requirement.controlFamily}.`,
    };
  }
  if (requirement.minLevel !== undefined && fields.level < requirement.minLevel) {
    return {
      reason: "below_level",
      detail: `Training is level ${fields.level}; this site requires level ${requirement.minLevel} or higher.`,
    };
  }
  return null;
}
