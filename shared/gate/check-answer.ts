import { z } from "zod";
import { requirementStatuses } from "../standing/standing-types.ts";

/**
 * What the front desk reads after scanning a badge: who, for which company, and whether cleared at this instant against
 * the site's requirement set (or the platform baseline). A code that is not a badge, or has run out, says only that.
 */
const gateCheckReadSchema = z.object({
  state: z.enum(["cleared", "not_cleared"]),
  checkedAt: z.string(),
  // The photo is there only when the technician has put one on file.
  technician: z.object({ name: z.string(), company: z.string(), photo: z.string().optional() }),
  /** Null when the badge was scanned without a gate sign. */
  site: z.object({ name: z.string() }).nullable(),
  against: z.string(),
  lines: z.array(z.object({ requirement: z.string(), status: z.enum(requirementStatuses) })),
  /** The accepted work order with the site's today among its dates, if any. */
  workOrder: z.object({ id: z.number(), technology: z.string() }).nullable(),
});

const gateCheckRefusedSchema = z.object({
  state: z.enum(["expired", "invalid"]),
  checkedAt: z.string(),
});

export const gateCheckDtoSchema = z.discriminatedUnion("state", [
  gateCheckReadSchema,
  gateCheckRefusedSchema,
]);
export type GateCheckDto = z.infer<typeof gateCheckDtoSchema>;
