import type { Transaction } from "sequelize";
import { runStatement, selectRows } from "../server/db/sql.ts";

/** Starts a job_runs row inside the run's transaction (a rolled-back run leaves no record of success). */
export async function startJobRun(
  transaction: Transaction,
  job: string,
  asOf: Date,
  startedAt: Date,
): Promise<number> {
  const [row] = await selectRows<{ id: number }>(
    transaction,
    "INSERT INTO job_runs (job, as_of, started_at) VALUES ($1, $2, $3) RETURNING id",
    [job, asOf, startedAt],
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
