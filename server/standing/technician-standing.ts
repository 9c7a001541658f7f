import type { StandingAgainstDto, TechnicianStandingDto } from "../../shared/standing/schemas.ts";
import type { RequirementResult, Standing } from "../../shared/standing/standing-types.ts";
import { db } from "../db/sequelize.ts";
import { notFound } from "../http/app-error.ts";
import { computeStandings } from "./compute-stored-standings.ts";
import { loadStandingInputs } from "./standing-inputs.ts";
import { selectRows } from "./sql.ts";

interface StoredRow {
  requirement_set_id: number | null;
  name: string;
  standing: Standing;
  earliest_lapse: Date | null;
  results: RequirementResult[];
  computed_at: Date;
}

/**
 * The technician's standing against the baseline and every active set: the stored rows, and for any pair not stored yet
 * (a technician added since the last decision) the engine's answer now.
 */
export async function readTechnicianStanding(technicianId: number): Promise<TechnicianStandingDto> {
  return db().transaction(async (transaction) => {
    const stored = await selectRows<StoredRow>(
      transaction,
      `SELECT s.requirement_set_id, coalesce(rs.name, 'Platform baseline') AS name, s.standing, s.earliest_lapse, s.results, s.computed_at
         FROM technician_standings s LEFT JOIN requirement_sets rs ON rs.id = s.requirement_set_id
        WHERE s.technician_id = $1 AND (s.requirement_set_id IS NULL OR rs.active)`,
      [technicianId],
    );
    const against: StandingAgainstDto[] = stored.map((r) => ({
      requirementSetId: r.requirement_set_id,
      name: r.name,
      standing: r.standing,
      earliestLapse: r.earliest_lapse ? new Date(r.earliest_lapse).toISOString() : null,
      computedAt: new Date(r.computed_at).toISOString(),
      results: r.results,
    }));
    const inputs = await loadStandingInputs({ companyIds: [], technicianIds: [technicianId] }, transaction);
    if (inputs.technicians.length === 0) throw notFound("That technician");
    const have = new Set(against.map((a) => a.requirementSetId ?? 0));
    const missing = inputs.targets.filter((t) => !have.has(t.id ?? 0));
    if (missing.length) {
      const now = new Date();
      const names = new Map(missing.map((t) => [t.id ?? 0, t.name]));
      for (const s of computeStandings({ ...inputs, targets: missing }, now)) {
        against.push({
          requirementSetId: s.requirementSetId,
          name: names.get(s.requirementSetId ?? 0) ?? "",
          standing: s.standing,
          earliestLapse: s.earliestLapse,
          computedAt: now.toISOString(),
          results: s.results,
        });
      }
    }
    return {
      technicianId,
      baseline: against.find((a) => a.requirementSetId === null) ?? null,
      requirementSets: against
        .filter((a) => a.requirementSetId !== null)
        .sort((a, b) => a.name.localeCompare(b.name)),
    };
  });
}
