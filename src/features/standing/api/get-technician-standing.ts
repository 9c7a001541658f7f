import { queryOptions, useQuery } from "@tanstack/react-query";
import {
  technicianStandingDtoSchema,
  type StandingAgainstDto,
  type TechnicianStandingDto,
} from "@shared/standing/schemas.ts";
import { api, isApiError } from "@/lib/api-client.ts";
import { standingKeys } from "./standing-keys.ts";

export type RequirementResultView = TechnicianStandingDto["requirementSets"][number]["results"][number];
export type StandingAgainstView = StandingAgainstDto;
export type TechnicianStanding = TechnicianStandingDto;

/** The technician's standing, or null while the standing service is not there yet (404), so pages show an empty state. */
export async function getTechnicianStanding(technicianId: number): Promise<TechnicianStanding | null> {
  try {
    return await api.get(`/technicians/${technicianId}/standing`, technicianStandingDtoSchema);
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
