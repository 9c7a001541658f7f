import { QueryTypes } from "sequelize";
import { db } from "../server/db/sequelize.ts";

/** The scheduled instant a timer fired for, to the second, so every instance names the same tick. */
export function tickOf(firedAt: Date): Date {
  return new Date(Math.floor(firedAt.getTime() / 1000) * 1000);
}

/**
 * How long a claimed run may take before others treat it as crashed. Far above the daily jobs' real length (seconds),
 * so a slow run is never started twice.
 */
export const TICK_LEASE_MS = 30 * 60_000;

/**
 * Claims one scheduled run of a job for this instance. The advisory lock stops two runs overlapping; the claim also stops a
 * second instance whose clock fired a moment later from running the same tick again after the first finished. The claim
 * carries a lease, so a run that dies without a word is found and retried (retry-ticks.ts).
 */
export async function claimTick(job: string, tick: Date, now = new Date()): Promise<boolean> {
  const rows = await db().query(
    `INSERT INTO job_ticks (job, tick, status, attempts, lease_until)
     VALUES (:job, :tick, 'running', 1, :leaseUntil)
     ON CONFLICT DO NOTHING RETURNING job`,
    {
      replacements: { job, tick, leaseUntil: new Date(now.getTime() + TICK_LEASE_MS) },
      type: QueryTypes.SELECT,
    },
  );
  return rows.length === 1;
}

export interface ClaimedRetry {
  job: string;
  tick: Date;
  attempts: number;
  /** The previous attempt was still `running` when its lease ran out: it crashed without recording anything. */
  crashed: boolean;
}

/**
 * Claims one tick whose retry is due, or whose run's lease ran out, for this instance alone (SKIP LOCKED: two
 * instances' retry rounds never take the same tick).
 */
export async function claimDueRetry(
  jobs: string[],
  now: Date,
  maxAttempts: number,
): Promise<ClaimedRetry | null> {
  if (jobs.length === 0) return null;
  const [rows] = await db().query(
    `WITH due AS (
       SELECT job, tick, status FROM job_ticks
        WHERE job IN (:jobs) AND attempts < :maxAttempts
          AND ((status = 'retrying' AND next_attempt_at <= :now) OR (status = 'running' AND lease_until <= :now))
        ORDER BY tick
        LIMIT 1
        FOR UPDATE SKIP LOCKED)
     UPDATE job_ticks t
        SET status = 'running', attempts = t.attempts + 1, lease_until = :leaseUntil, next_attempt_at = NULL
       FROM due
      WHERE t.job = due.job AND t.tick = due.tick
     RETURNING t.job, t.tick, t.attempts, due.status AS previous`,
    { replacements: { jobs, now, maxAttempts, leaseUntil: new Date(now.getTime() + TICK_LEASE_MS) } },
  );
  const row = (rows as { job: string; tick: Date; attempts: number; previous: string }[])[0];
  return row
    ? { job: row.job, tick: row.tick, attempts: row.attempts, crashed: row.previous === "running" }
    : null;
}

/** A run that used its last attempt while `running` and then crashed is closed as failed rather than left hanging. */
export async function closeExhaustedCrashes(jobs: string[], now: Date, maxAttempts: number) {
  if (jobs.length === 0) return [];
  const [rows] = await db().query(
    `UPDATE job_ticks SET status = 'failed', lease_until = NULL, last_error = 'the run stopped without finishing'
      WHERE job IN (:jobs) AND status = 'running' AND lease_until <= :now AND attempts >= :maxAttempts
      RETURNING job, tick, attempts`,
    { replacements: { jobs, now, maxAttempts } },
  );
  return rows as { job: string; tick: Date; attempts: number }[];
}

export async function markTickSucceeded(job: string, tick: Date) {
  await db().query(
    "UPDATE job_ticks SET status = 'succeeded', lease_until = NULL, last_error = NULL WHERE job = :job AND tick = :tick",
    { replacements: { job, tick } },
  );
}

export async function markTickFailed(job: string, tick: Date, error: string, nextAttemptAt: Date | null) {
  await db().query(
    `UPDATE job_ticks SET status = :status, lease_until = NULL, last_error = :error, next_attempt_at = :nextAttemptAt
      WHERE job = :job AND tick = :tick`,
    { replacements: { job, tick, error, nextAttemptAt, status: nextAttemptAt ? "retrying" : "failed" } },
  );
}
