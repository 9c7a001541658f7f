import { QueryTypes } from "sequelize";
import { db } from "../server/db/sequelize.ts";

/** The scheduled instant a timer fired for, to the second, so every instance names the same tick. */
export function tickOf(firedAt: Date): Date {
  return new Date(Math.floor(firedAt.getTime() / 1000) * 1000);
}

/**
 * Claims one scheduled run of a job for this instance. The advisory lock stops two runs overlapping; the claim also stops a
 * second instance whose clock fired a moment later from running the same tick again after the first finished.
 */
export async function claimTick(job: string, tick: Date): Promise<boolean> {
  const rows = await db().query(
    "INSERT INTO job_ticks (job, tick) VALUES (:job, :tick) ON CONFLICT DO NOTHING RETURNING job",
    {
      replacements: { job, tick },
      type: QueryTypes.SELECT,
    },
  );
  return rows.length === 1;
}
