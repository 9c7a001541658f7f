import type { LimitName } from "@shared/credentials/credential-fields.ts";
import type { Requirement } from "@shared/standing/requirements.ts";
import { limitLabelWithCoverage } from "@shared/credentials/limit-lines.ts";

// The limit lines a minimum is usually set on (common practice); a stored minimum on any other line is kept as it is.
const offeredLimitNames = [
  "eachOccurrence",
  "generalAggregate",
  "combinedSingleLimit",
  "employersLiabilityEachAccident",
  "employersLiabilityDiseaseEachEmployee",
  "employersLiabilityDiseasePolicyLimit",
  "umbrellaEachOccurrence",
] as const satisfies readonly LimitName[];
export const offeredLimits = offeredLimitNames.map(
  (name) => [name, `${limitLabelWithCoverage(name)} ($)`] as const,
);

type OfferedLimit = (typeof offeredLimitNames)[number];

/** One requirement (of a set or of the baseline) as the form holds it: numbers stay text until the schema reads them. */
export type RequirementDraft = {
  key: string;
  id?: string | undefined;
  label: string;
  typeCodes: string[];
  limits: Partial<Record<OfferedLimit, string>>;
  otherLimits: Partial<Record<LimitName, number>>;
  additionalInsured: boolean;
  waiverOfSubrogation: boolean;
  statutory: boolean;
  maxAgeMonths: string;
  builder: string;
  controlFamily: string;
  minLevel: string;
};

let nextKey = 0;
const newKey = () => `requirement-${++nextKey}`;

export const emptyRequirementDraft = (): RequirementDraft => ({
  key: newKey(),
  label: "",
  typeCodes: [],
  limits: {},
  otherLimits: {},
  additionalInsured: false,
  waiverOfSubrogation: false,
  statutory: false,
  maxAgeMonths: "",
  builder: "",
  controlFamily: "",
  minLevel: "",
});

const isOffered = (name: string): name is OfferedLimit => offeredLimits.some(([n]) => n === name);

export function toRequirementDraft(requirement: Requirement): RequirementDraft {
  const limits: RequirementDraft["limits"] = {};
  const otherLimits: RequirementDraft["otherLimits"] = {};
  for (const [name, value] of Object.entries(requirement.minLimits ?? {})) {
    if (value === undefined) continue;
    if (isOffered(name)) limits[name] = String(value);
    else otherLimits[name as LimitName] = value;
  }
  return {
    key: newKey(),
    id: requirement.id,
    label: requirement.label,
    typeCodes: [...requirement.typeCodes],
    limits,
    otherLimits,
    additionalInsured: requirement.additionalInsured ?? false,
    waiverOfSubrogation: requirement.waiverOfSubrogation ?? false,
    statutory: requirement.statutory ?? false,
    maxAgeMonths: requirement.maxAgeMonths?.toString() ?? "",
    builder: requirement.builder ?? "",
    controlFamily: requirement.controlFamily ?? "",
    minLevel: requirement.minLevel?.toString() ?? "",
  };
}

// Empty means "not required"; anything else that is not a whole number reaches the schema as NaN so it is reported.
const numberOrNothing = (text: string): number | undefined => {
  const cleaned = text.replace(/[$,\s]/g, "");
  return cleaned === "" ? undefined : /^\d+$/.test(cleaned) ? Number(cleaned) : Number.NaN;
};
const textOrNothing = (text: string): string | undefined => text.trim() || undefined;

/** The draft as the shared requirement schema takes it (unset options are left out, not sent as false or empty). */
export function fromRequirementDraft(draft: RequirementDraft): Record<string, unknown> {
  const minLimits: Record<string, number> = { ...draft.otherLimits } as Record<string, number>;
  for (const [name] of offeredLimits) {
    const value = numberOrNothing(draft.limits[name] ?? "");
    if (value !== undefined) minLimits[name] = value;
  }
  return {
    ...(draft.id ? { id: draft.id } : {}),
    label: draft.label,
    typeCodes: draft.typeCodes,
    ...(Object.keys(minLimits).length > 0 ? { minLimits } : {}),
    ...(draft.additionalInsured ? { additionalInsured: true } : {}),
    ...(draft.waiverOfSubrogation ? { waiverOfSubrogation: true } : {}),
    ...(draft.statutory ? { statutory: true } : {}),
    maxAgeMonths: numberOrNothing(draft.maxAgeMonths),
    builder: textOrNothing(draft.builder),
    controlFamily: textOrNothing(draft.controlFamily),
    minLevel: numberOrNothing(draft.minLevel),
  };
}
