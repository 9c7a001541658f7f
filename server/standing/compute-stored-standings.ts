import {
  computeTechnicianStanding,
  standingReadsTechnician,
} from "../../shared/standing/compute-standing.ts";
import type { StandingResult } from "../../shared/standing/standing-types.ts";
import type { StandingInputs, StandingTechnician } from "./standing-inputs.ts";
import { lapsingWindowDays } from "./standing-window.ts";

export interface ComputedStanding extends StandingResult {
  technicianId: number;
  companyId: number;
  requirementSetId: number | null;
}

/**
 * Every (technician, target) standing at `asOf`, with the shared engine: the company's insurance plus the technician's
 * cards. A technician with no credential of their own, in a company with no exemption on file, stands as every such
 * technician of the company does (standingReadsTechnician), so the engine runs once per company and target for them: a
 * company's lapsed insurance recomputes all its technicians, and most hold no card the targets read.
 */
export function computeStandings(
  inputs: StandingInputs,
  asOf: Date,
  technicians: StandingTechnician[] = inputs.technicians,
): ComputedStanding[] {
  const out: ComputedStanding[] = [];
  const warningDays = lapsingWindowDays();
  const alike = new Map<string, StandingResult>();
  for (const technician of technicians) {
    const companyCredentials = inputs.companyCredentials.get(technician.companyId) ?? [];
    const technicianCredentials = inputs.technicianCredentials.get(technician.id) ?? [];
    const sharesCompanyStanding =
      technicianCredentials.length === 0 && !standingReadsTechnician(companyCredentials, inputs.types);
    inputs.targets.forEach((target, index) => {
      const key = sharesCompanyStanding ? `${technician.companyId}:${index}` : null;
      let result = key ? alike.get(key) : undefined;
      if (!result) {
        result = computeTechnicianStanding({
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
        if (key) alike.set(key, result);
      }
      out.push({
        ...result,
        technicianId: technician.id,
        companyId: technician.companyId,
        requirementSetId: target.id,
      });
    });
  }
  return out;
}
