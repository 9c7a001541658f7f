import type { FieldSet, Limits } from "./credential-fields.ts";

/**
 * Things a reviewer should look at twice. They are warnings shown beside the fields, never refusals:
 * the document may be right and our reading wrong, or the reviewer may accept it with a note.
 */
export const reviewerWarningCodes = [
  "named_insured_differs",
  "expiration_not_after_effective",
  "aggregate_below_each_occurrence",
  "disease_policy_limit_below_each_employee",
  "naic_not_five_digits",
  "limit_implausibly_small",
  "holder_name_differs",
  "submitted_for_another_holder",
  "exemption_from_another_state",
] as const;
export type ReviewerWarningCode = (typeof reviewerWarningCodes)[number];
export interface ReviewerWarning {
  code: ReviewerWarningCode;
  message: string;
}

export interface ReviewerCheckInput {
  fieldSet: FieldSet;
  /** The fields as they stand (proposed or corrected); any may be missing. */
  fields: {
    namedInsured?: string;
    naic?: string;
    effectiveDate?: string;
    expirationDate?: string;
    limits?: Limits;
    holderName?: string;
    issueDate?: string;
    expiryDate?: string;
    /** Exemption: the issuing state. */
    state?: string;
  };
  companyLegalName: string;
  technicianName?: string;
  /** The same file (by content hash) is already on another holder's credential. */
  duplicateOfOtherHolder?: boolean;
  /** Two-letter states where the company works: its own address and the sites of its work orders. */
  workStates?: readonly { state: string; where: string }[];
}

// Below this, a per-occurrence or per-accident liability limit is almost surely misread (a thousands-omitted
// table read as dollars, "$1M" read as 1) or mistyped: commercial liability limits start in the hundreds of
// thousands (common practice).
export const IMPLAUSIBLE_LIMIT_BELOW = 10_000;
const HEADLINE_LIMITS = [
  ["eachOccurrence", "each occurrence"],
  ["combinedSingleLimit", "combined single limit"],
  ["umbrellaEachOccurrence", "umbrella each occurrence"],
  ["generalAggregate", "general aggregate"],
  ["umbrellaAggregate", "umbrella aggregate"],
  ["employersLiabilityEachAccident", "employer's liability each accident"],
] as const;

const dollars = (amount: number) => `$${amount.toLocaleString("en-US")}`;

// NAIC company code: five digits (from memory).
const NAIC_PATTERN = /^\d{5}$/;
// Legal-form words that one document spells out and another abbreviates or drops.
const LEGAL_SUFFIXES = new Set([
  "llc",
  "inc",
  "incorporated",
  "co",
  "company",
  "corp",
  "corporation",
  "ltd",
  "limited",
  "lp",
  "llp",
  "pllc",
  "pc",
]);

function words(name: string): string[] {
  return name
    .toLowerCase()
    .replace(/&/g, " and ")
    .replace(/[^a-z0-9\s]/g, " ")
    .split(/\s+/)
    .filter((word) => word !== "");
}

/** A company name without case, punctuation, a leading "the" or trailing legal-form words. */
export function normaliseCompanyName(name: string): string {
  const list = words(name.replace(/\bl\.\s?l\.\s?c\.?/gi, "llc"));
  if (list[0] === "the") list.shift();
  while (list.length > 1 && LEGAL_SUFFIXES.has(list[list.length - 1] ?? "")) list.pop();
  return list.join(" ");
}

/** A person's name as a set of words, so "Thorne, Desmond J." and "desmond thorne" match. */
export function normalisePersonName(name: string): string {
  return words(name)
    .filter((word) => word.length > 1)
    .sort()
    .join(" ");
}

function insuranceWarnings(input: ReviewerCheckInput): ReviewerWarning[] {
  const { fields } = input;
  const warnings: ReviewerWarning[] = [];
  if (
    fields.namedInsured &&
    normaliseCompanyName(fields.namedInsured) !== normaliseCompanyName(input.companyLegalName)
  ) {
    warnings.push({
      code: "named_insured_differs",
      message: `The named insured "${fields.namedInsured}" is not the company's legal name "${input.companyLegalName}".`,
    });
  }
  if (fields.effectiveDate && fields.expirationDate && fields.expirationDate <= fields.effectiveDate) {
    warnings.push({
      code: "expiration_not_after_effective",
      message: "The expiration date is not after the effective date.",
    });
  }
  const limits = fields.limits ?? {};
  // General aggregate >= each occurrence (common practice).
  if (
    limits.generalAggregate !== undefined &&
    limits.eachOccurrence !== undefined &&
    limits.generalAggregate < limits.eachOccurrence
  ) {
    warnings.push({
      code: "aggregate_below_each_occurrence",
      message: "The general aggregate is below the each-occurrence limit.",
    });
  }
  // EL disease policy limit >= disease each employee (common practice).
  const diseasePolicy = limits.employersLiabilityDiseasePolicyLimit;
  const diseaseEmployee = limits.employersLiabilityDiseaseEachEmployee;
  if (diseasePolicy !== undefined && diseaseEmployee !== undefined && diseasePolicy < diseaseEmployee) {
    warnings.push({
      code: "disease_policy_limit_below_each_employee",
      message: "The employer's liability disease policy limit is below the disease each-employee limit.",
    });
  }
  for (const [name, words] of HEADLINE_LIMITS) {
    const amount = limits[name];
    if (amount !== undefined && amount < IMPLAUSIBLE_LIMIT_BELOW) {
      warnings.push({
        code: "limit_implausibly_small",
        message: `The ${words} limit reads ${dollars(amount)}, far below any usual limit; check whether the certificate prints "$1M" or omits thousands.`,
      });
    }
  }
  if (fields.naic !== undefined && fields.naic.trim() !== "" && !NAIC_PATTERN.test(fields.naic.trim())) {
    warnings.push({
      code: "naic_not_five_digits",
      message: `The NAIC company code "${fields.naic}" does not have five digits.`,
    });
  }
  return warnings;
}

function cardWarnings(input: ReviewerCheckInput): ReviewerWarning[] {
  const { fields } = input;
  const warnings: ReviewerWarning[] = [];
  if (
    fields.holderName &&
    input.technicianName &&
    normalisePersonName(fields.holderName) !== normalisePersonName(input.technicianName)
  ) {
    warnings.push({
      code: "holder_name_differs",
      message: `The name on the document "${fields.holderName}" is not the technician's name "${input.technicianName}".`,
    });
  }
  if (fields.issueDate && fields.expiryDate && fields.expiryDate <= fields.issueDate) {
    warnings.push({
      code: "expiration_not_after_effective",
      message: "The expiry date is not after the issue date.",
    });
  }
  return warnings;
}

/**
 * A state's workers' compensation exemption is that state's: work in another state falls under that state's own law
 * (common practice; rules on out-of-state work vary by state), so the reviewer checks before accepting it.
 */
function exemptionWarnings(input: ReviewerCheckInput): ReviewerWarning[] {
  const issuedBy = input.fields.state?.trim().toUpperCase();
  if (input.fieldSet !== "exemption" || !issuedBy) return [];
  const elsewhere = (input.workStates ?? []).filter((w) => w.state.toUpperCase() !== issuedBy);
  if (elsewhere.length === 0) return [];
  const places = elsewhere.map((w) => `${w.where} (${w.state})`).join(", ");
  return [
    {
      code: "exemption_from_another_state",
      message: `The exemption is issued by ${issuedBy}, but the company works in another state: ${places}. Check that the exemption covers work there.`,
    },
  ];
}

/** Warnings for a reviewer about one credential's fields. */
export function reviewerWarnings(input: ReviewerCheckInput): ReviewerWarning[] {
  const warnings = input.fieldSet === "insurance" ? insuranceWarnings(input) : cardWarnings(input);
  warnings.push(...exemptionWarnings(input));
  if (input.duplicateOfOtherHolder) {
    warnings.push({
      code: "submitted_for_another_holder",
      message: "The same file was already submitted for another holder.",
    });
  }
  return warnings;
}
