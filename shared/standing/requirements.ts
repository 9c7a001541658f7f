import { z } from "zod";
import { singleLineText } from "../api/text.ts";
import { dollarsSchema, limitNames } from "../credentials/credential-fields.ts";

/** One line of a site's requirements. Any one of `typeCodes` satisfies it (e.g. a WC policy or a state exemption). */
export const requirementSchema = z.object({
  id: singleLineText().trim().min(1).max(80).optional(),
  label: singleLineText().trim().min(1, "Name the requirement").max(160),
  typeCodes: z
    .array(singleLineText().regex(/^[a-z][a-z0-9_]*$/, "Use a credential type code"))
    .min(1, "Pick at least one credential type"),
  minLimits: z.partialRecord(z.enum(limitNames), dollarsSchema).optional(),
  additionalInsured: z.boolean().optional(),
  waiverOfSubrogation: z.boolean().optional(),
  // Age of a training card measured from its issue date, for cards the regulation leaves open-ended (TRADE-FACTS 4: employers
  // often require an outreach card no older than 3-5 years).
  maxAgeMonths: z.number().int().min(1).max(240).optional(),
  builder: singleLineText().trim().min(1).max(120).optional(),
  controlFamily: singleLineText().trim().min(1).max(120).optional(),
  minLevel: z.union([z.literal(1), z.literal(2), z.literal(3)]).optional(),
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
      // Common practice: sole proprietors without employees may be exempt in most states (TRADE-FACTS 3).
      typeCodes: ["workers_comp", "workers_comp_exemption"],
    },
  ],
};
