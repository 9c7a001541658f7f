import { z } from "zod";
import { idParam } from "../credentials/schemas.ts";
import { requirementSchema, requirementSetSchema } from "./requirements.ts";
import type { RequirementResult, Standing } from "./standing-types.ts";

export const requirementSetParamsSchema = z.object({ requirementSetId: idParam });
export const technicianStandingParamsSchema = z.object({ technicianId: idParam });

/** A shop's requirement set as the buyer's form sends it; `siteId` ties it to one of the shop's sites. */
export const requirementSetInputSchema = requirementSetSchema.extend({
  siteId: idParam.nullable().optional(),
});
export type RequirementSetInput = z.infer<typeof requirementSetInputSchema>;

export const listRequirementSetsQuerySchema = z.object({
  includeArchived: z
    .enum(["true", "false"])
    .default("false")
    .transform((v) => v === "true"),
});

export const baselineInputSchema = z.object({
  requirements: z.array(requirementSchema).min(1, "Add at least one requirement"),
});
export type BaselineInput = z.infer<typeof baselineInputSchema>;

export interface BaselineDto {
  requirements: z.infer<typeof requirementSchema>[];
  updatedAt: string;
}

export interface RequirementSetDto {
  id: number;
  companyId: number;
  siteId: number | null;
  name: string;
  requirements: z.infer<typeof requirementSchema>[];
  active: boolean;
  createdAt: string;
  updatedAt: string;
}

/** How many active technicians meet a set today ("meeting" = cleared + lapsing). */
export interface RequirementSetPreviewDto {
  technicians: number;
  cleared: number;
  lapsing: number;
  notCleared: number;
  meeting: number;
}

export interface StandingAgainstDto {
  requirementSetId: number | null;
  name: string;
  standing: Standing;
  earliestLapse: string | null;
  computedAt: string;
  results: RequirementResult[];
}

export interface TechnicianStandingDto {
  technicianId: number;
  baseline: StandingAgainstDto | null;
  requirementSets: StandingAgainstDto[];
}

export interface JobRunDto {
  id: number;
  job: string;
  asOf: string;
  startedAt: string;
  finishedAt: string | null;
  counts: Record<string, unknown>;
  /** Which attempt of its scheduled tick this run was (1 = on time, 2+ = a retry after a failure). */
  attempt: number;
  /** Why the run failed; null for a run that finished. */
  error: string | null;
  /** The admin who ran it by hand ("Run the daily job now"); null for a scheduled run. */
  startedBy: { id: number; name: string } | null;
}
