import type { LimitName } from "./credential-fields.ts";

/** How each limit line reads on screen and in messages. */
export const LIMIT_LABELS: Record<LimitName, string> = {
  eachOccurrence: "Each occurrence",
  generalAggregate: "General aggregate",
  productsCompletedOpsAggregate: "Products-completed operations aggregate",
  personalAdvertisingInjury: "Personal and advertising injury",
  damageToRentedPremises: "Damage to rented premises",
  medicalExpense: "Medical expense (any one person)",
  combinedSingleLimit: "Combined single limit (each accident)",
  employersLiabilityEachAccident: "Employer's liability, each accident",
  employersLiabilityDiseaseEachEmployee: "Employer's liability, disease, each employee",
  employersLiabilityDiseasePolicyLimit: "Employer's liability, disease, policy limit",
  umbrellaEachOccurrence: "Umbrella, each occurrence",
  umbrellaAggregate: "Umbrella, aggregate",
};

/** A limit line's label inside a phrase ("General liability, each occurrence"). */
const limitLabelInSentence = (name: LimitName): string =>
  LIMIT_LABELS[name].charAt(0).toLowerCase() + LIMIT_LABELS[name].slice(1);

// The limit lines each coverage prints on a certificate of insurance (common practice); the upload form offers only
// these and the reader looks only for these, so a line of another coverage is never taken for one of this coverage's.
export const LIMIT_LINES_BY_COVERAGE = {
  general_liability: [
    "eachOccurrence",
    "generalAggregate",
    "productsCompletedOpsAggregate",
    "personalAdvertisingInjury",
    "damageToRentedPremises",
    "medicalExpense",
  ],
  auto_liability: ["combinedSingleLimit"],
  workers_comp: [
    "employersLiabilityEachAccident",
    "employersLiabilityDiseaseEachEmployee",
    "employersLiabilityDiseasePolicyLimit",
  ],
  umbrella_liability: ["umbrellaEachOccurrence", "umbrellaAggregate"],
} as const satisfies Record<string, readonly LimitName[]>;

const ALL_LIMIT_LINES = Object.keys(LIMIT_LABELS) as LimitName[];

/** The lines a credential type prints; a type of no known coverage may show any. */
export const limitLinesFor = (typeCode: string): readonly LimitName[] =>
  (LIMIT_LINES_BY_COVERAGE as Record<string, readonly LimitName[]>)[typeCode] ?? ALL_LIMIT_LINES;

// Where a requirement names a limit without its coverage around it, the coverage goes first unless the label says it.
const COVERAGE_PREFIX: Partial<Record<keyof typeof LIMIT_LINES_BY_COVERAGE, string>> = {
  general_liability: "General liability",
  auto_liability: "Auto",
};

/** "General liability, each occurrence", "Auto, combined single limit (each accident)", "Umbrella, aggregate". */
export function limitLabelWithCoverage(name: LimitName): string {
  const coverage = (Object.keys(LIMIT_LINES_BY_COVERAGE) as (keyof typeof LIMIT_LINES_BY_COVERAGE)[]).find(
    (code) => (LIMIT_LINES_BY_COVERAGE[code] as readonly LimitName[]).includes(name),
  );
  const prefix = coverage ? COVERAGE_PREFIX[coverage] : undefined;
  return prefix ? `${prefix}, ${limitLabelInSentence(name)}` : LIMIT_LABELS[name];
}
