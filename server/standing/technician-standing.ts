import type { Transaction } from "sequelize";
import type { StandingAgainstDto, TechnicianStandingDto } from "../../shared/standing/schemas.ts";
import type { RequirementResult, Standing } from "../../shared/standing/standing-types.ts";
import { db } from "../db/sequelize.ts";
import { notFound } from "../http/app-error.ts";
import { computeStandings } from "./compute-stored-standings.ts";
import { loadStandingInputs } from "./standing-inputs.ts";
import { selectRows } from "../db/sql.ts";

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
export async function readTechnicianStanding(
  technicianId: number,
  viewer?: Express.User,
): Promise<TechnicianStandingDto> {
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
    const visible = await visibleSetIds(technicianId, viewer, transaction);
    return {
      technicianId,
      baseline: against.find((a) => a.requirementSetId === null) ?? null,
      requirementSets: against
        .filter((a) => a.requirementSetId !== null && (visible === "all" || visible.has(a.requirementSetId)))
        .sort((a, b) => a.name.localeCompare(b.name)),
    };
  });
}

/**
 * A shop's requirement sets are its own business: the service side sees only the sets of shops that work with this
 * technician (on their roster, directly or through the company, or through a work order); reviewers and admins see all.
 */
async function visibleSetIds(
  technicianId: number,
  viewer: Express.User | undefined,
  transaction: Transaction,
): Promise<"all" | Set<number>> {
  if (!viewer || viewer.role === "reviewer" || viewer.role === "admin") return "all";
  const rows = await selectRows<{ id: number }>(
    transaction,
    `SELECT rs.id FROM requirement_sets rs
      WHERE rs.active AND rs.company_id IN (
        SELECT re.shop_company_id FROM roster_entries re
         WHERE re.technician_id = $1 OR re.service_company_id = (SELECT company_id FROM technicians WHERE id = $1)
        UNION SELECT wo.shop_company_id FROM work_orders wo WHERE wo.technician_id = $1)`,
    [technicianId],
  );
  return new Set(rows.map((r) => r.id));
}
