import { z } from "zod";
import { idParam } from "../credentials/schemas.ts";
import { requirementSchema, requirementSetSchema } from "./requirements.ts";
import { limitNames } from "../credentials/credential-fields.ts";
import { requirementStatuses, standings, unmetReasons } from "./standing-types.ts";

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

// Response shapes: the server's DTO types are inferred from these and the client parses its answers with them.

export const baselineDtoSchema = z.object({
  requirements: z.array(requirementSchema),
  updatedAt: z.string(),
});
export type BaselineDto = z.infer<typeof baselineDtoSchema>;

export const requirementSetDtoSchema = z.object({
  id: z.number(),
  companyId: z.number(),
  siteId: z.number().nullable(),
  name: z.string(),
  requirements: z.array(requirementSchema),
  active: z.boolean(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type RequirementSetDto = z.infer<typeof requirementSetDtoSchema>;

/** How many active technicians meet a set today ("meeting" = cleared + lapsing). */
export const requirementSetPreviewDtoSchema = z.object({
  technicians: z.number(),
  cleared: z.number(),
  lapsing: z.number(),
  notCleared: z.number(),
  meeting: z.number(),
});
export type RequirementSetPreviewDto = z.infer<typeof requirementSetPreviewDtoSchema>;

const limitLineSchema = z.object({
  limit: z.enum(limitNames),
  required: z.number(),
  shown: z.number().nullable(),
  met: z.boolean(),
  how: z.string(),
});

export const requirementResultSchema = z.object({
  requirement: requirementSchema,
  status: z.enum(requirementStatuses),
  reason: z.enum(unmetReasons).nullable(),
  detail: z.string(),
  credentialId: z.number().nullable(),
  lapsesAt: z.string().nullable(),
  // Standings stored before stacked limits were described carry no metBy.
  metBy: z.string().nullable().optional(),
  alsoCredentialIds: z.array(z.number()).optional(),
  limitLines: z.array(limitLineSchema).optional(),
});

/** The standing against the baseline (requirementSetId null) or one active requirement set. */
export const standingAgainstDtoSchema = z.object({
  requirementSetId: z.number().nullable(),
  name: z.string(),
  standing: z.enum(standings),
  earliestLapse: z.string().nullable(),
  computedAt: z.string(),
  results: z.array(requirementResultSchema),
});
export type StandingAgainstDto = z.infer<typeof standingAgainstDtoSchema>;

export const technicianStandingDtoSchema = z.object({
  technicianId: z.number(),
  baseline: standingAgainstDtoSchema.nullable(),
  requirementSets: z.array(standingAgainstDtoSchema),
});
export type TechnicianStandingDto = z.infer<typeof technicianStandingDtoSchema>;

export const jobRunDtoSchema = z.object({
  id: z.number(),
  job: z.string(),
  asOf: z.string(),
  startedAt: z.string(),
  finishedAt: z.string().nullable(),
  // What a run counted differs by job, so it stays open.
  counts: z.record(z.string(), z.unknown()),
  /** Which attempt of its scheduled tick this run was (1 = on time, 2+ = a retry after a failure). */
  attempt: z.number(),
  /** Why the run failed; null for a run that finished. */
  error: z.string().nullable(),
  /** The admin who ran it by hand ("Run the daily job now"); null for a scheduled run. */
  startedBy: z.object({ id: z.number(), name: z.string() }).nullable(),
});
export type JobRunDto = z.infer<typeof jobRunDtoSchema>;

/** What "Run the daily job now" answers: the run's id and what it did. */
export const manualJobRunDtoSchema = z.object({
  jobRunId: z.number(),
  asOf: z.string(),
  lapsed: z.number(),
  noticesCreated: z.number(),
  emailsQueued: z.number(),
  changedStandings: z.number(),
});
export type ManualJobRunDto = z.infer<typeof manualJobRunDtoSchema>;
