import type { RequirementMetDto } from "../../shared/directory/directory-shapes.ts";
import type { RequirementResult } from "../../shared/standing/standing-types.ts";
import { preparedRows } from "../db/sql.ts";

/**
 * How each line of the chosen requirement set is met, for one page of results only: read from the standings the job
 * stored (every listed technician has one, the filter demands it), so the directory does not run the engine per row.
 * One lookup for the page's ids (technician_standings_set_idx narrows it to the set).
 */
export async function loadRequirementsMet(
  requirementSetId: number,
  technicianIds: readonly number[],
): Promise<Map<number, RequirementMetDto[]>> {
  const out = new Map<number, RequirementMetDto[]>();
  if (technicianIds.length === 0) return out;
  const rows = await preparedRows<{ technician_id: number; results: RequirementResult[] }>(
    `SELECT technician_id, results FROM technician_standings
      WHERE requirement_set_id = $1 AND technician_id = ANY($2::int[])`,
    [requirementSetId, [...technicianIds]],
  );
  for (const row of rows) {
    out.set(
      row.technician_id,
      (row.results ?? []).map((r) => ({
        label: r.requirement.label,
        metBy: r.metBy ?? null,
        detail: r.detail,
        lapsing: r.status === "lapsing",
      })),
    );
  }
  return out;
}
