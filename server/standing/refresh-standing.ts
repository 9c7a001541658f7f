import type { Transaction } from "sequelize";
import type { Standing } from "../../shared/standing/standing-types.ts";
import { computeStandings, type ComputedStanding } from "./compute-stored-standings.ts";
import { emitStandingsChanged, type ChangedStanding } from "./standing-hooks.ts";
import { loadStandingInputs, loadTargets, type HolderSelection } from "./standing-inputs.ts";
import { runStatement, selectRows } from "../db/sql.ts";

export type { ChangedStanding } from "./standing-hooks.ts";

export interface Holder {
  companyId: number;
  /** Null = a company-held credential (insurance): every technician of the company is affected. */
  technicianId: number | null;
}

// Rows per upsert statement: keeps each bound JSON parameter a few megabytes at most.
const UPSERT_CHUNK = 2_000;

interface ChangedRow {
  technician_id: number;
  requirement_set_id: number | null;
  standing: Standing;
  before: Standing | null;
  earliest_lapse: Date | null;
}

/**
 * Upserts the computed standings and returns the pairs whose standing changed. The CTE reads the old rows from the
 * statement's snapshot, so one statement per chunk both writes and reports the change.
 */
async function storeStandings(
  rows: ComputedStanding[],
  asOf: Date,
  transaction: Transaction,
): Promise<ChangedStanding[]> {
  const companyOf = new Map(rows.map((r) => [r.technicianId, r.companyId]));
  const changes: ChangedStanding[] = [];
  for (let i = 0; i < rows.length; i += UPSERT_CHUNK) {
    const chunk = rows.slice(i, i + UPSERT_CHUNK).map((r) => ({
      technician_id: r.technicianId,
      requirement_set_id: r.requirementSetId,
      standing: r.standing,
      earliest_lapse: r.earliestLapse,
      results: r.results,
    }));
    const changed = await selectRows<ChangedRow>(
      transaction,
      `WITH incoming AS (
         SELECT * FROM jsonb_to_recordset($1::jsonb)
           AS r(technician_id int, requirement_set_id int, standing text, earliest_lapse timestamptz, results jsonb)
       ), old AS (
         SELECT s.technician_id, coalesce(s.requirement_set_id, 0) AS set_key, s.standing
           FROM technician_standings s
          WHERE s.technician_id IN (SELECT technician_id FROM incoming)
       ), written AS (
         INSERT INTO technician_standings (technician_id, requirement_set_id, standing, earliest_lapse, results, computed_at)
         SELECT technician_id, requirement_set_id, standing, earliest_lapse, results, $2 FROM incoming
         ON CONFLICT (technician_id, (coalesce(requirement_set_id, 0))) DO UPDATE
           SET standing = EXCLUDED.standing, earliest_lapse = EXCLUDED.earliest_lapse,
               results = EXCLUDED.results, computed_at = EXCLUDED.computed_at
         RETURNING technician_id, requirement_set_id, standing, earliest_lapse
       )
       SELECT w.technician_id, w.requirement_set_id, w.standing, w.earliest_lapse, o.standing AS before
         FROM written w
         LEFT JOIN old o ON o.technician_id = w.technician_id AND o.set_key = coalesce(w.requirement_set_id, 0)
        WHERE o.standing IS DISTINCT FROM w.standing`,
      [JSON.stringify(chunk), asOf],
    );
    for (const c of changed) {
      changes.push({
        technicianId: c.technician_id,
        companyId: companyOf.get(c.technician_id) ?? 0,
        requirementSetId: c.requirement_set_id,
        before: c.before,
        after: c.standing,
        earliestLapse: c.earliest_lapse ? new Date(c.earliest_lapse).toISOString() : null,
      });
    }
  }
  return changes;
}

/** Listeners hear about the changes once the caller's transaction commits (never about a rolled-back one). */
function announceAfterCommit(changes: ChangedStanding[], transaction: Transaction) {
  if (changes.length) transaction.afterCommit(() => emitStandingsChanged(changes));
}

/** Recomputes the standings (baseline and every active set) of the selected technicians and stores them. */
export async function refreshStandings(
  selection: HolderSelection,
  transaction: Transaction,
  asOf: Date = new Date(),
): Promise<ChangedStanding[]> {
  if (selection !== "all" && selection.companyIds.length === 0 && selection.technicianIds.length === 0)
    return [];
  const inputs = await loadStandingInputs(selection, transaction);
  const changes = await storeStandings(computeStandings(inputs, asOf), asOf, transaction);
  announceAfterCommit(changes, transaction);
  return changes;
}

/**
 * Recomputes the standings affected by a change to one holder's credentials, inside the caller's transaction (the
 * credential decision and the stored standing commit together). A technician-held credential affects that technician;
 * a company-held one (technicianId null: insurance) affects every technician of the company.
 */
export async function refreshStandingsForHolder(
  holder: { companyId: number; technicianId: number | null },
  transaction: Transaction,
  asOf?: Date,
): Promise<ChangedStanding[]> {
  const selection =
    holder.technicianId === null
      ? { companyIds: [holder.companyId], technicianIds: [] }
      : { companyIds: [], technicianIds: [holder.technicianId] };
  return refreshStandings(selection, transaction, asOf);
}

/** Every technician against the baseline and every active set; drops rows of archived sets. */
export async function refreshAllStandings(asOf: Date, transaction: Transaction): Promise<ChangedStanding[]> {
  await runStatement(
    transaction,
    "DELETE FROM technician_standings WHERE requirement_set_id IN (SELECT id FROM requirement_sets WHERE NOT active)",
  );
  return refreshStandings("all", transaction, asOf);
}

/** Every technician against one (new or edited) requirement set. */
export async function refreshStandingsForRequirementSet(
  requirementSetId: number,
  transaction: Transaction,
  asOf: Date = new Date(),
): Promise<ChangedStanding[]> {
  const targets = await loadTargets(transaction, [requirementSetId]);
  const inputs = await loadStandingInputs("all", transaction, { targets });
  const changes = await storeStandings(computeStandings(inputs, asOf), asOf, transaction);
  announceAfterCommit(changes, transaction);
  return changes;
}

/** Forgets the stored standings against an archived set, so the directory never filters on a stale one. */
export async function dropStandingsForRequirementSet(
  requirementSetId: number,
  transaction: Transaction,
): Promise<void> {
  await runStatement(transaction, "DELETE FROM technician_standings WHERE requirement_set_id = $1", [
    requirementSetId,
  ]);
}

export type { HolderSelection };
