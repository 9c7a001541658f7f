import { db } from "../server/db/sequelize.ts";
import type { FileStorage } from "../server/storage/index.ts";
import { sweepStaleUploads, type StaleUploadReport } from "../server/storage/sweep-stale-uploads.ts";
import { finishJobRun, startJobRun } from "./job-run-record.ts";

/**
 * Removes uploads abandoned for over a day (temporary files, documents never submitted) and records what it removed in
 * job_runs. The sweep's own statements are each safe on their own, so it holds no transaction while it works.
 */
export async function runUploadSweep(
  { asOf }: { asOf: Date },
  deps: { storage: FileStorage },
): Promise<StaleUploadReport> {
  const startedAt = new Date();
  const report = await sweepStaleUploads(deps.storage, asOf);
  await db().transaction(async (transaction) => {
    const id = await startJobRun(transaction, "upload_sweep", asOf, startedAt);
    await finishJobRun(transaction, id, { ...report });
  });
  return report;
}
