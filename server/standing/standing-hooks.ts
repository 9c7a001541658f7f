import type { Standing } from "../../shared/standing/standing-types.ts";
import { log } from "../log.ts";

/** One technician whose stored standing against the baseline (requirementSetId null) or a set changed. */
export interface ChangedStanding {
  technicianId: number;
  companyId: number;
  requirementSetId: number | null;
  /** Null when this is the first standing stored for the pair. */
  before: Standing | null;
  after: Standing;
  earliestLapse: string | null;
}

export type StandingsChangedListener = (changes: readonly ChangedStanding[]) => void | Promise<void>;

const listeners = new Set<StandingsChangedListener>();

/**
 * Subscribes to standing changes (e.g. the buyers' roster alerts). Listeners run after the writing transaction commits,
 * so they never see a change that was rolled back. Returns the unsubscribe function.
 */
export function onStandingsChanged(listener: StandingsChangedListener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

export async function emitStandingsChanged(changes: readonly ChangedStanding[]): Promise<void> {
  if (changes.length === 0) return;
  for (const listener of listeners) {
    try {
      await listener(changes);
    } catch (err) {
      // A failing listener must not undo or block the committed change.
      log.error({ err }, "standings-changed listener failed");
    }
  }
}
