import { z } from "zod";
import { singleLineText, multiLineText } from "../api/text.ts";

/** Calendar date as printed on a document, kept as ISO text so no time zone can shift it. */
export const isoDateSchema = singleLineText()
  .regex(/^\d{4}-\d{2}-\d{2}$/, "Use YYYY-MM-DD")
  .refine(
    (d) =>
      !Number.isNaN(Date.parse(`${d}T00:00:00Z`)) && new Date(`${d}T00:00:00Z`).toISOString().startsWith(d),
    "Not a real date",
  );

/** Whole US dollars; limits on a certificate are printed without cents. */
export const dollarsSchema = z.number().int().min(0).max(1_000_000_000);

// NAIC company code: five digits (from memory).
export const naicSchema = singleLineText().regex(/^\d{5}$/, "NAIC company code has five digits");

export const limitNames = [
  "eachOccurrence",
  "generalAggregate",
  "productsCompletedOpsAggregate",
  "personalAdvertisingInjury",
  "damageToRentedPremises",
  "medicalExpense",
  "combinedSingleLimit",
  "employersLiabilityEachAccident",
  "employersLiabilityDiseaseEachEmployee",
  "employersLiabilityDiseasePolicyLimit",
  "umbrellaEachOccurrence",
  "umbrellaAggregate",
] as const;
export type LimitName = (typeof limitNames)[number];

export const limitsSchema = z.partialRecord(z.enum(limitNames), dollarsSchema);
export type Limits = z.infer<typeof limitsSchema>;

/** One coverage line of a certificate of insurance. */
export const insuranceFieldsSchema = z.object({
  insurerName: singleLineText().trim().min(1, "Enter the insurer").max(200),
  // Stored as text; a wrong length is a reviewer warning, not a refusal (the certificate may be wrong).
  naic: singleLineText().trim().max(9).optional(),
  policyNumber: singleLineText().trim().min(1, "Enter the policy number").max(60),
  namedInsured: multiLineText().trim().max(200).optional(),
  certificateHolder: multiLineText().trim().max(300).optional(),
  effectiveDate: isoDateSchema,
  expirationDate: isoDateSchema,
  limits: limitsSchema.default({}),
  additionalInsured: z.boolean().default(false),
  waiverOfSubrogation: z.boolean().default(false),
  // Workers' compensation Part One pays statutory benefits, with no dollar limit.
  statutory: z.boolean().optional(),
});
export type InsuranceFields = z.infer<typeof insuranceFieldsSchema>;

/** A safety-training wallet card or certificate. */
export const trainingFieldsSchema = z.object({
  holderName: singleLineText().trim().min(1, "Enter the name on the card").max(160),
  course: singleLineText().trim().max(200).optional(),
  issueDate: isoDateSchema,
  expiryDate: isoDateSchema.optional(),
  cardNumber: singleLineText().trim().max(60).optional(),
  trainer: singleLineText().trim().max(160).optional(),
});
export type TrainingFields = z.infer<typeof trainingFieldsSchema>;

/** Machine-builder training on a control family, at a level (1 operator, 2 maintenance, 3 advanced service). */
export const oemFieldsSchema = trainingFieldsSchema.extend({
  builder: singleLineText().trim().min(1).max(120),
  controlFamily: singleLineText().trim().min(1).max(120),
  level: z.number().int().min(1).max(3),
});
export type OemFields = z.infer<typeof oemFieldsSchema>;

export const licenseFieldsSchema = z.object({
  holderName: singleLineText().trim().min(1).max(160),
  licenseNumber: singleLineText().trim().min(1).max(60),
  issuingAuthority: singleLineText().trim().min(1).max(160),
  issueDate: isoDateSchema,
  expiryDate: isoDateSchema.optional(),
});
export type LicenseFields = z.infer<typeof licenseFieldsSchema>;

/**
 * A state-issued exemption from carrying workers' compensation. A state issues it to named persons (a sole proprietor,
 * or officers of a corporation or members of an LLC), often for a term; it covers those persons only, never the
 * company's employees.
 */
export const exemptionFieldsSchema = z.object({
  holderName: singleLineText().trim().min(1).max(160),
  state: singleLineText().regex(/^[A-Z]{2}$/, "Two-letter state code"),
  certificateNumber: singleLineText().trim().min(1).max(60),
  issueDate: isoDateSchema,
  // None printed: the catalogue's usual term applies (WORKERS_COMP_EXEMPTION_MONTHS, common practice).
  expiryDate: isoDateSchema.optional(),
  // The persons the state names; empty on older rows, where the holder's name is the one person covered.
  personsCovered: z.array(singleLineText().trim().min(2).max(160)).max(20).default([]),
  // Technicians the uploader ticked as the persons named, when a name on the document is spelled otherwise.
  technicianIds: z.array(z.number().int().positive()).max(20).default([]),
});
export type ExemptionFields = z.infer<typeof exemptionFieldsSchema>;

export const fieldSets = ["insurance", "training", "oem", "license", "exemption"] as const;
export type FieldSet = (typeof fieldSets)[number];

export const fieldSetSchemas = {
  insurance: insuranceFieldsSchema,
  training: trainingFieldsSchema,
  oem: oemFieldsSchema,
  license: licenseFieldsSchema,
  exemption: exemptionFieldsSchema,
} as const satisfies Record<FieldSet, z.ZodType>;

export type CredentialFields = InsuranceFields | TrainingFields | OemFields | LicenseFields | ExemptionFields;
