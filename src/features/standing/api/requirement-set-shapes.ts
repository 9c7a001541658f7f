import { z } from "zod";
import { requirementSchema } from "@shared/standing/requirements.ts";

// Run-time checks of shared/standing/schemas.ts RequirementSetDto and RequirementSetPreviewDto.
export const requirementSetSchema = z.object({
  id: z.number(),
  companyId: z.number(),
  siteId: z.number().nullable(),
  name: z.string(),
  requirements: z.array(requirementSchema),
  active: z.boolean(),
  updatedAt: z.string(),
});
export type RequirementSetView = z.infer<typeof requirementSetSchema>;

export const requirementSetPreviewSchema = z.object({
  technicians: z.number(),
  cleared: z.number(),
  lapsing: z.number(),
  notCleared: z.number(),
  meeting: z.number(),
});
export type RequirementSetPreview = z.infer<typeof requirementSetPreviewSchema>;
