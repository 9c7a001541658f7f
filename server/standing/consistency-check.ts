import type { Transaction } from "sequelize";
import type { RequirementResult, Standing } from "../../shared/standing/standing-types.ts";
import { computeStandings, type ComputedStanding } from "./compute-stored-standings.ts";
import { loadStandingInputs } from "./standing-inputs.ts";
import { selectRows } from "../db/sql.ts";

export interface StandingDifference {
  technicianId: number;
  requirementSetId: number | null;
  /** What differs: the stored row is missing, extra (no such active set or technician), or disagrees with the engine. */
  problem: "missing" | "extra" | "standing" | "earliest_lapse" | "results";
  stored: string | null;
  computed: string | null;
}

interface StoredRow {
  technician_id: number;
  requirement_set_id: number | null;
  standing: Standing;
  earliest_lapse: Date | null;
  results: RequirementResult[];
  computed_at: Date;
}

const key = (technicianId: number, setId: number | null) => `${technicianId}:${setId ?? 0}`;
const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);

/** The parts of a requirement result that decide the standing; detail sentences are for people and may be reworded. */
function resultsFingerprint(results: readonly RequirementResult[]): string {
  return JSON.stringify(
    results.map((r) => [
      r.requirement.id ?? r.requirement.label,
      r.status,
      r.reason,
      r.credentialId,
      r.lapsesAt,
    ]),
  );
}

function compare(stored: StoredRow, computed: ComputedStanding): StandingDifference | null {
  const base = { technicianId: stored.technician_id, requirementSetId: stored.requirement_set_id };
  if (stored.standing !== computed.standing) {
    return { ...base, problem: "standing", stored: stored.standing, computed: computed.standing };
  }
  if (iso(stored.earliest_lapse) !== computed.earliestLapse) {
    return {
      ...base,
      problem: "earliest_lapse",
      stored: iso(stored.earliest_lapse),
      computed: computed.earliestLapse,
    };
  }
  const a = resultsFingerprint(stored.results);
  const b = resultsFingerprint(computed.results);
  return a === b ? null : { ...base, problem: "results", stored: a, computed: b };
}

/**
 * Recomputes every stored standing in memory, at the instant it was stored, and lists where the table disagrees with the
 * engine (there must be nothing). Rows the table lacks, and rows for archived sets or deleted technicians, count too.
 * `technicianIds` narrows the check to some technicians (the command checks everyone).
 */
export async function checkStandingConsistency(
  transaction: Transaction,
  options: { technicianIds?: number[] } = {},
): Promise<{ checked: number; differences: StandingDifference[] }> {
  const only = options.technicianIds;
  const inputs = await loadStandingInputs(
    only ? { companyIds: [], technicianIds: only } : "all",
    transaction,
  );
  const stored = await selectRows<StoredRow>(
    transaction,
    `SELECT technician_id, requirement_set_id, standing, earliest_lapse, results, computed_at FROM technician_standings
      WHERE $1::int[] IS NULL OR technician_id = ANY($1::int[])`,
    [only ?? null],
  );
  const technicians = new Map(inputs.technicians.map((t) => [t.id, t]));
  const targetIds = new Set(inputs.targets.map((t) => t.id ?? 0));
  const storedByKey = new Map(stored.map((r) => [key(r.technician_id, r.requirement_set_id), r]));
  const differences: StandingDifference[] = [];

  // Group the stored rows by technician and instant: one engine pass per group.
  const groups = new Map<string, StoredRow[]>();
  for (const row of stored) {
    if (!technicians.has(row.technician_id) || !targetIds.has(row.requirement_set_id ?? 0)) {
      differences.push({
        technicianId: row.technician_id,
        requirementSetId: row.requirement_set_id,
        problem: "extra",
        stored: row.standing,
        computed: null,
      });
      continue;
    }
    const groupKey = `${row.technician_id}@${new Date(row.computed_at).getTime()}`;
    groups.set(groupKey, [...(groups.get(groupKey) ?? []), row]);
  }
  for (const rows of groups.values()) {
    const first = rows[0]!;
    const computed = computeStandings(inputs, new Date(first.computed_at), [
      technicians.get(first.technician_id)!,
    ]);
    for (const row of rows) {
      const match = computed.find((c) => (c.requirementSetId ?? 0) === (row.requirement_set_id ?? 0));
      const difference = match ? compare(row, match) : null;
      if (difference) differences.push(difference);
    }
  }
  for (const technician of inputs.technicians) {
    for (const target of inputs.targets) {
      if (!storedByKey.has(key(technician.id, target.id))) {
        differences.push({
          technicianId: technician.id,
          requirementSetId: target.id,
          problem: "missing",
          stored: null,
          computed: null,
        });
      }
    }
  }
  return { checked: stored.length, differences };
}
