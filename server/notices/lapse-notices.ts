import type { Transaction } from "sequelize";
import { selectRows } from "../db/sql.ts";
import { formatLapseInstant, LAPSE_INSTANTS_SQL, QUEUE_LAPSE_MESSAGES_SQL } from "./lapse-email.ts";

export interface HolderCount {
  company_id: number;
  technician_id: number | null;
  count: number;
}

/**
 * Warning notices for verified credentials whose lapse instant falls inside a warning window: one per credential per
 * threshold, the smallest window we are inside (the same rule as shared dueThreshold: remaining time <= N days of 24 h),
 * so a missed run still sends the one notice that matters. The unique constraint, not code, stops a second copy.
 */
/** The warning step as one statement ($1 as of, $2 thresholds > 0, $3 the widest, $4 the run); the bench's floor runs it too. */
export const WARNING_NOTICES_SQL = `WITH due AS (
       SELECT c.id, c.company_id, c.technician_id, c.lapses_at,
              (SELECT min(d) FROM unnest($2::int[]) AS d WHERE c.lapses_at <= $1::timestamptz + d * interval '24 hours') AS threshold_days
         FROM credentials c
        WHERE c.state = 'verified' AND c.lapses_at > $1::timestamptz AND c.lapses_at <= $1::timestamptz + $3::int * interval '24 hours'
     ), noticed AS (
       INSERT INTO notices (credential_id, threshold_days, lapses_at, job_run_id)
       SELECT id, threshold_days, lapses_at, $4 FROM due
       ON CONFLICT ON CONSTRAINT notices_once_per_threshold DO NOTHING
       RETURNING credential_id
     )
     SELECT d.company_id, d.technician_id, count(*)::int AS count
       FROM due d JOIN noticed n ON n.credential_id = d.id
      GROUP BY d.company_id, d.technician_id`;

export async function createWarningNotices(
  transaction: Transaction,
  options: { asOf: Date; thresholds: readonly number[]; jobRunId: number },
): Promise<HolderCount[]> {
  const widest = Math.max(...options.thresholds);
  return selectRows<HolderCount>(transaction, WARNING_NOTICES_SQL, [
    options.asOf,
    options.thresholds.filter((d) => d > 0),
    widest,
    options.jobRunId,
  ]);
}

/**
 * Each recipient of each new notice of the run gets an outbox row (e-mail) and an in-app notification, in the job's
 * transaction (if the run rolls back, nothing is queued): the lapse instants are put in words once per zone and
 * instant, then one statement words and writes every message (QUEUE_LAPSE_MESSAGES_SQL).
 */
export async function queueNoticeMessages(
  transaction: Transaction,
  options: { jobRunId: number; asOf: Date; publicUrl: string },
): Promise<{ emails: number; notifications: number }> {
  const instants = await selectRows<{ time_zone: string; lapses_at: Date }>(transaction, LAPSE_INSTANTS_SQL, [
    options.jobRunId,
  ]);
  const [counts] = await selectRows<{ emails: number; notifications: number }>(
    transaction,
    QUEUE_LAPSE_MESSAGES_SQL,
    [
      options.jobRunId,
      options.asOf.toISOString(),
      options.publicUrl.replace(/\/$/, ""),
      instants.map((i) => i.time_zone),
      instants.map((i) => new Date(i.lapses_at).toISOString()),
      instants.map((i) => formatLapseInstant(new Date(i.lapses_at), i.time_zone)),
    ],
  );
  return counts ?? { emails: 0, notifications: 0 };
}
