import { computeTechnicianStanding } from "../../shared/standing/compute-standing.ts";
import type { StandingResult } from "../../shared/standing/standing-types.ts";
import type { StandingInputs, StandingTechnician } from "./standing-inputs.ts";
import { lapsingWindowDays } from "./standing-window.ts";

export interface ComputedStanding extends StandingResult {
  technicianId: number;
  companyId: number;
  requirementSetId: number | null;
}

/** Every (technician, target) standing at `asOf`, with the shared engine: the company's insurance plus the technician's cards. */
export function computeStandings(
  inputs: StandingInputs,
  asOf: Date,
  technicians: StandingTechnician[] = inputs.technicians,
): ComputedStanding[] {
  const out: ComputedStanding[] = [];
  const warningDays = lapsingWindowDays();
  for (const technician of technicians) {
    const companyCredentials = inputs.companyCredentials.get(technician.companyId) ?? [];
    const technicianCredentials = inputs.technicianCredentials.get(technician.id) ?? [];
    for (const target of inputs.targets) {
      const result = computeTechnicianStanding({
        companyCredentials,
        technicianCredentials,
        requirements: target.requirements,
        companyTimeZone: technician.timeZone,
        technician: { id: technician.id, name: technician.name },
        companyHeadcount: technician.companyHeadcount,
        asOf,
        warningDays,
        types: inputs.types,
      });
      out.push({
        ...result,
        technicianId: technician.id,
        companyId: technician.companyId,
        requirementSetId: target.id,
      });
    }
  }
  return out;
}
