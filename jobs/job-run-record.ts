import type { Transaction } from "sequelize";
import { runStatement, selectRows } from "../server/db/sql.ts";

/** Starts a job_runs row inside the run's transaction (a rolled-back run leaves no record of success). */
export async function startJobRun(
  transaction: Transaction,
  job: string,
  asOf: Date,
  startedAt: Date,
  startedBy: number | null = null,
): Promise<number> {
  const [row] = await selectRows<{ id: number }>(
    transaction,
    "INSERT INTO job_runs (job, as_of, started_at, started_by) VALUES ($1, $2, $3, $4) RETURNING id",
    [job, asOf, startedAt, startedBy],
  );
  return row!.id;
}

export async function finishJobRun(
  transaction: Transaction,
  id: number,
  counts: Record<string, unknown>,
): Promise<Date> {
  const finishedAt = new Date();
  await runStatement(transaction, "UPDATE job_runs SET finished_at = $2, counts = $3::jsonb WHERE id = $1", [
    id,
    finishedAt,
    JSON.stringify(counts),
  ]);
  return finishedAt;
}

/** The audit event of a run an admin started by hand, written in the run's transaction so a rolled-back run leaves none. */
export async function recordManualRun(
  transaction: Transaction,
  adminId: number,
  jobRunId: number,
  asOf: Date,
): Promise<void> {
  await runStatement(
    transaction,
    `INSERT INTO audit_events (actor_user_id, action, subject_type, subject_id, before, after)
     VALUES ($1, 'job.run_manually', 'job_run', $2, NULL, jsonb_build_object('job', 'lapse', 'asOf', $3::timestamptz))`,
    [adminId, jobRunId, asOf],
  );
}
