/**
 * What "Cleared" means and what it does not, in one place for the screens, the printed proof and the e-mails. A
 * cleared technician has papers in order; the employer and the host site still decide who may do which work.
 */

export const CLEARED_MEANS =
  "Cleared means the required documents are verified and in force today. It does not say that a person is competent, qualified or authorized for a task.";

export const SAFETY_CAUTION_TITLE = "Cleared is about documents, not safety or skill";

// Per-type cautions: the catalog hangs each on its credential type (shown where that type is uploaded), and the list
// below repeats them where a decision about who works on a machine is made. The 70E section numbers are from memory
// (110.6 in the 2024 edition).
export const ARC_FLASH_CAUTION =
  "The employer decides who is a qualified person for electrical work (NFPA 70E 110.6; 110.2 in editions before 2021).";

export const LOCKOUT_CAUTION =
  "On the host site, the site's own lockout/tagout procedure applies to every machine serviced (29 CFR 1910.147).";

export const POWERED_TRUCK_CAUTION =
  "A forklift operator evaluation covers the trucks and the workplace it was done in; the host site decides whether another is needed (29 CFR 1910.178(l)).";

/** Each sentence names the rule it defers to. */
export const SAFETY_CAUTIONS: readonly string[] = [
  ARC_FLASH_CAUTION,
  LOCKOUT_CAUTION,
  POWERED_TRUCK_CAUTION,
  "A machine down never overrides lockout/tagout, permits or the site's safety rules.",
];

export const INSURANCE_CAUTION =
  "A certificate of insurance is information only and confers no rights; confirm coverage and additional insured status with the insurer or broker.";

export const LICENSE_CAUTION =
  "Trade license requirements vary by state and town; check with the authority where the work is done.";

export const RIGGING_CAUTION =
  "A machine rigging and moving card shows training only: every lift and move follows the site's lift plan, the rated capacity of the gear and floor loading checked with the site (common practice).";

export const EXEMPTION_CAUTION =
  "An exemption covers only the persons it names, never employees; whether it is accepted is up to the state and the site's insurer or broker (common practice; rules vary by state).";

// The certificate's own wording (ACORD 25 heading, from memory): it neither amends nor extends the policies it lists;
// additional insured status and waivers come by endorsement (common practice).
export const INSURANCE_CAUTION_DETAIL = [
  "It does not amend, extend or alter the coverage of the policies it lists; only the policies themselves do.",
  "Additional insured status and waiver of subrogation need an endorsement on the policy; a box ticked on the certificate is not one.",
] as const;
