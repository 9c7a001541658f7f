import {
  ARC_FLASH_CAUTION,
  EXEMPTION_CAUTION,
  INSURANCE_CAUTION,
  LICENSE_CAUTION,
  LOCKOUT_CAUTION,
  POWERED_TRUCK_CAUTION,
  RIGGING_CAUTION,
} from "../safety/cautions.ts";
import type { FieldSet } from "./credential-fields.ts";

export const credentialCategories = ["insurance", "safety", "oem", "license"] as const;
export type CredentialCategory = (typeof credentialCategories)[number];

export const credentialHolders = ["company", "technician"] as const;
export type CredentialHolder = (typeof credentialHolders)[number];

/**
 * How long a credential counts:
 * - `document_dates`: the dates printed on the document (policy period, or the card's expiry; no expiry printed = never lapses);
 * - `months_from_issue`: N calendar months from the issue date, unless the card prints an earlier or later expiry;
 * - `no_expiry`: never lapses by the calendar (a printed expiry still wins, see training-validity.ts).
 */
export type CredentialValidity =
  { kind: "document_dates" } | { kind: "months_from_issue"; months: number } | { kind: "no_expiry" };

export interface CredentialTypeDefinition {
  code: string;
  name: string;
  category: CredentialCategory;
  holder: CredentialHolder;
  fieldSet: FieldSet;
  validity: CredentialValidity;
  description: string;
  /** The caution shown where this type is uploaded or relied on; it lives in shared/safety/cautions.ts, once. */
  caution?: string;
}

// NFPA 70E (2024) 110.6(A)(3): retraining at intervals not to exceed 3 years.
export const ARC_FLASH_RETRAINING_MONTHS = 36;
// 29 CFR 1910.178(l)(4)(iii): operator performance evaluated at least once every 3 years (OSHA letter 2005-08-01).
export const POWERED_TRUCK_EVALUATION_MONTHS = 36;
// Common practice: 29 CFR 1910.147 sets no calendar interval for retraining ((c)(7)(iii) retrains on a change in job
// assignments, machines or procedures, or when an inspection shows deviations); employers align a yearly refresher
// with the at-least-annual periodic inspection of 1910.147(c)(6)(i).
export const LOCKOUT_REFRESHER_MONTHS = 12;
// Common practice, the same shape: 29 CFR 1910.146(g)(2) trains before first assignment, on a change of duties or of
// permit-space hazards, and when evaluation shows deviations, with no calendar interval; employers use a yearly
// refresher as for lockout/tagout.
export const CONFINED_SPACE_REFRESHER_MONTHS = 12;
// Common practice, varies by state: when a state's exemption prints no expiry, treat it as lasting 24 months from
// issue (e.g. Florida construction-industry elections run 2 years, from memory), so a stale exemption is not cleared
// forever. A printed expiry always governs.
export const WORKERS_COMP_EXEMPTION_MONTHS = 24;

/** Said on every catalog card whose interval is common practice rather than regulation. */
const SITE_DECIDES =
  "The 12-month interval is common practice, not a regulatory deadline; a site's requirement set decides the interval it wants.";
// Common practice: first aid / CPR / AED cards are usually valid 2 years (American Heart Association course cards, cpr.heart.org "Course Card Information").
export const FIRST_AID_CPR_MONTHS = 24;

const documentDates = { kind: "document_dates" } as const;
const noExpiry = { kind: "no_expiry" } as const;
const monthsFromIssue = (months: number) => ({ kind: "months_from_issue", months }) as const;

export const credentialTypes: readonly CredentialTypeDefinition[] = [
  {
    code: "general_liability",
    name: "Commercial general liability",
    category: "insurance",
    holder: "company",
    fieldSet: "insurance",
    // Standard policy wording: 12:01 a.m. standard time on the effective date to 12:01 a.m. on the expiration date (ISO CG DS 01 wording, from memory).
    validity: documentDates,
    description:
      "Liability for bodily injury and property damage arising from the company's operations and completed work.",
    caution: INSURANCE_CAUTION,
  },
  {
    code: "auto_liability",
    name: "Automobile liability",
    category: "insurance",
    holder: "company",
    fieldSet: "insurance",
    validity: documentDates, // policy period as printed, 12:01 a.m. standard time as in the CGL declarations
    description:
      "Liability for vehicles used to reach the customer's site, usually one combined single limit.",
    caution: INSURANCE_CAUTION,
  },
  {
    code: "workers_comp",
    name: "Workers' compensation and employer's liability",
    category: "insurance",
    holder: "company",
    fieldSet: "insurance",
    validity: documentDates, // policy period as printed, 12:01 a.m. standard time as in the CGL declarations
    description:
      "Statutory benefits for injured employees (Part One) and employer's liability limits (Part Two).",
    caution: INSURANCE_CAUTION,
  },
  {
    code: "umbrella_liability",
    name: "Umbrella / excess liability",
    category: "insurance",
    holder: "company",
    fieldSet: "insurance",
    validity: documentDates, // policy period as printed, 12:01 a.m. standard time as in the CGL declarations
    description: "Limits above the general, auto and employer's liability policies.",
    caution: INSURANCE_CAUTION,
  },
  {
    code: "workers_comp_exemption",
    name: "Workers' compensation exemption",
    category: "insurance",
    holder: "company",
    fieldSet: "exemption",
    // A printed expiry governs; none printed, the usual term (common practice, see WORKERS_COMP_EXEMPTION_MONTHS).
    validity: monthsFromIssue(WORKERS_COMP_EXEMPTION_MONTHS),
    description:
      "A state-issued exemption from carrying workers' compensation, for the persons it names (a sole proprietor or officers) only, never for employees. Without a printed expiry it counts for 24 months from issue (common practice; terms vary by state).",
    caution: EXEMPTION_CAUTION,
  },
  {
    code: "osha_10",
    name: "OSHA 10-hour outreach card",
    category: "safety",
    holder: "technician",
    fieldSet: "training",
    // Federal outreach cards carry no expiry (osha.gov Outreach FAQ); sites wanting a recent card set a maximum age.
    validity: noExpiry,
    description: "Ten-hour awareness course in workplace safety and health.",
  },
  {
    code: "osha_30",
    name: "OSHA 30-hour outreach card",
    category: "safety",
    holder: "technician",
    fieldSet: "training",
    validity: noExpiry, // no federal expiry (osha.gov Outreach FAQ)
    description: "Thirty-hour course in workplace safety and health, for supervisors and lead technicians.",
  },
  {
    code: "arc_flash",
    name: "Electrical safety (arc flash) training",
    category: "safety",
    holder: "technician",
    fieldSet: "training",
    validity: monthsFromIssue(ARC_FLASH_RETRAINING_MONTHS), // NFPA 70E (2024) 110.6(A)(3)
    description:
      "Training in safety-related electrical work practices near energized parts. The card alone does not make someone a qualified person: the employer decides that (NFPA 70E 110.6).",
    caution: ARC_FLASH_CAUTION,
  },
  {
    code: "lockout_tagout",
    name: "Lockout/tagout (hazardous energy control) training",
    category: "safety",
    holder: "technician",
    fieldSet: "training",
    validity: monthsFromIssue(LOCKOUT_REFRESHER_MONTHS), // common practice, see LOCKOUT_REFRESHER_MONTHS
    description: `Training in the control of hazardous energy while servicing machines. On the host site, the site's own lockout/tagout procedure applies (29 CFR 1910.147); 29 CFR 1910.147(c)(7)(iii) requires retraining when jobs, machines or procedures change. ${SITE_DECIDES}`,
    caution: LOCKOUT_CAUTION,
  },
  {
    code: "powered_truck",
    name: "Powered industrial truck operator",
    category: "safety",
    holder: "technician",
    fieldSet: "training",
    validity: monthsFromIssue(POWERED_TRUCK_EVALUATION_MONTHS), // 29 CFR 1910.178(l)(4)(iii)
    description:
      "Forklift operator training and performance evaluation. The evaluation covers the trucks and workplace it was done in; the host site decides whether another is needed (29 CFR 1910.178(l)).",
    caution: POWERED_TRUCK_CAUTION,
  },
  {
    code: "first_aid_cpr",
    name: "First aid / CPR / AED",
    category: "safety",
    holder: "technician",
    fieldSet: "training",
    validity: monthsFromIssue(FIRST_AID_CPR_MONTHS), // common practice, see FIRST_AID_CPR_MONTHS
    description: "First aid, cardiopulmonary resuscitation and defibrillator use.",
  },
  {
    code: "confined_space",
    name: "Permit-required confined space entry",
    category: "safety",
    holder: "technician",
    fieldSet: "training",
    validity: monthsFromIssue(CONFINED_SPACE_REFRESHER_MONTHS), // common practice, see CONFINED_SPACE_REFRESHER_MONTHS
    description: `Entry into permit-required confined spaces such as coolant pits and chip conveyor trenches. 29 CFR 1910.146(g)(2) requires training when duties or permit-space hazards change. ${SITE_DECIDES}`,
  },
  {
    code: "oem_training",
    name: "Machine builder (OEM) training",
    category: "oem",
    holder: "technician",
    fieldSet: "oem",
    // Common practice: no regulatory expiry; the builder's printed expiry governs when there is one.
    validity: documentDates,
    description: "A machine builder's service training on a control family, at a stated level.",
  },
  {
    code: "trade_license",
    name: "Trade license",
    category: "license",
    holder: "technician",
    fieldSet: "license",
    validity: documentDates, // the issuing authority's printed expiry
    description:
      "A state or local license, e.g. for electrical work on machine supply circuits. Requirements vary by state and town; check with the authority where the work is done.",
    caution: LICENSE_CAUTION,
  },
  {
    code: "machine_rigging",
    name: "Machine rigging and moving",
    category: "safety",
    holder: "technician",
    fieldSet: "training",
    // Common practice: no federal card expiry for rigging in general industry; a site wanting a recent card sets a
    // maximum age in its requirement set.
    validity: noExpiry,
    description:
      "Training in rigging, lifting and moving machine tools. The card shows training only: every lift follows the site's lift plan, the rated capacity of the gear and floor loading checked with the site.",
    caution: RIGGING_CAUTION,
  },
];

export const credentialTypeByCode: ReadonlyMap<string, CredentialTypeDefinition> = new Map(
  credentialTypes.map((type) => [type.code, type]),
);
