import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { requirementStatuses, standings, unmetReasons } from "@shared/standing/standing-types.ts";
import { api, isApiError } from "@/lib/api-client.ts";
import { standingKeys } from "./standing-keys.ts";

// Run-time check of shared/standing/standing-types.ts StandingResult; only what the page shows is required.
const requirementResultSchema = z.object({
  requirement: z.object({ id: z.string().optional(), label: z.string() }).loose(),
  status: z.enum(requirementStatuses),
  reason: z.enum(unmetReasons).nullable(),
  detail: z.string(),
  credentialId: z.number().nullable(),
  lapsesAt: z.string().nullable(),
  // Standings stored before stacked limits were described carry no metBy.
  metBy: z.string().nullable().optional(),
});
export type RequirementResultView = z.infer<typeof requirementResultSchema>;

// shared/standing/schemas.ts StandingAgainstDto: the baseline (requirementSetId null) or one active requirement set.
const standingAgainstSchema = z.object({
  requirementSetId: z.number().nullable(),
  name: z.string(),
  standing: z.enum(standings),
  earliestLapse: z.string().nullable(),
  computedAt: z.string(),
  results: z.array(requirementResultSchema),
});
export type StandingAgainstView = z.infer<typeof standingAgainstSchema>;

const technicianStandingSchema = z.object({
  technicianId: z.number(),
  baseline: standingAgainstSchema.nullable(),
  requirementSets: z.array(standingAgainstSchema),
});
export type TechnicianStanding = z.infer<typeof technicianStandingSchema>;

/** The technician's standing, or null while the standing service is not there yet (404), so pages show an empty state. */
export async function getTechnicianStanding(technicianId: number): Promise<TechnicianStanding | null> {
  try {
    return await api.get(`/technicians/${technicianId}/standing`, technicianStandingSchema);
  } catch (error) {
    if (isApiError(error) && error.status === 404) return null;
    throw error;
  }
}

export const technicianStandingQuery = (technicianId: number) =>
  queryOptions({
    queryKey: standingKeys.technician(technicianId),
    queryFn: () => getTechnicianStanding(technicianId),
  });

export const useTechnicianStanding = (technicianId: number) =>
  useQuery(technicianStandingQuery(technicianId));
