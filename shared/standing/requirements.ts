import { z } from "zod";
import { singleLineText } from "../api/text.ts";
import { dollarsSchema, limitNames } from "../credentials/credential-fields.ts";

// A certificate's workers' compensation line covers the insured's own employees only, so no certificate can name a site
// as additional insured on it (common practice; from memory, the ACORD 25 certificate leaves its "ADDL INSD" box unused on the WC line).
const WORKERS_COMP_CODES = new Set(["workers_comp", "workers_comp_exemption"]);

/** One line of a site's requirements. Any one of `typeCodes` satisfies it (e.g. a WC policy or a state exemption). */
export const requirementSchema = z
  .object({
    id: singleLineText().trim().min(1).max(80).optional(),
    label: singleLineText().trim().min(1, "Name the requirement").max(160),
    typeCodes: z
      .array(singleLineText().regex(/^[a-z][a-z0-9_]*$/, "Use a credential type code"))
      .min(1, "Pick at least one credential type"),
    minLimits: z.partialRecord(z.enum(limitNames), dollarsSchema).optional(),
    additionalInsured: z.boolean().optional(),
    waiverOfSubrogation: z.boolean().optional(),
    // Workers' compensation Part One shows "Per statute" (statutory benefits) rather than a dollar limit.
    statutory: z.boolean().optional(),
    // The site's interval for a training card, in months from its issue date. For a card that prints no expiry it
    // replaces the catalog's default (longer or shorter); a printed expiry that comes sooner still ends the card.
    // Employers often want an open-ended outreach card no older than 3-5 years (common practice).
    maxAgeMonths: z.number().int().min(1).max(240).optional(),
    builder: singleLineText().trim().min(1).max(120).optional(),
    controlFamily: singleLineText().trim().min(1).max(120).optional(),
    minLevel: z.union([z.literal(1), z.literal(2), z.literal(3)]).optional(),
  })
  .superRefine((requirement, ctx) => {
    const workersComp = requirement.typeCodes.some((code) => WORKERS_COMP_CODES.has(code));
    if (requirement.additionalInsured && workersComp) {
      ctx.addIssue({
        code: "custom",
        path: ["additionalInsured"],
        message:
          "Additional insured cannot apply to workers' compensation: no certificate can show it. Ask for a waiver of subrogation instead.",
      });
    }
    if (requirement.statutory && !requirement.typeCodes.includes("workers_comp")) {
      ctx.addIssue({
        code: "custom",
        path: ["statutory"],
        message: "Statutory limits apply to a workers' compensation policy only.",
      });
    }
  });
export type Requirement = z.infer<typeof requirementSchema>;

export const requirementSetSchema = z.object({
  name: singleLineText().trim().min(1, "Name the requirement set").max(160),
  requirements: z.array(requirementSchema).min(1, "Add at least one requirement"),
});
export type RequirementSet = z.infer<typeof requirementSetSchema>;

/** What every listed technician must meet, whatever the shop asks on top. */
export const defaultBaseline: RequirementSet = {
  name: "Platform baseline",
  requirements: [
    {
      id: "baseline_general_liability",
      label: "General liability in force",
      typeCodes: ["general_liability"],
    },
    {
      id: "baseline_workers_comp",
      label: "Workers' compensation or a state exemption",
      // Common practice: sole proprietors and officers may be exempt in most states, for themselves only.
      typeCodes: ["workers_comp", "workers_comp_exemption"],
    },
  ],
};
