import { db } from "../server/db/sequelize.ts";
import { log } from "../server/log.ts";
import { User } from "../server/accounts/index.ts";
import { tellPerson } from "../server/notices/index.ts";
import {
  claimDueRetry,
  claimTick,
  closeExhaustedCrashes,
  markTickFailed,
  markTickSucceeded,
} from "./claim-tick.ts";
import { JobRun } from "../server/db/models.ts";

/** A scheduled job's work, judged as of an instant. */
export type JobWork = (asOf: Date) => Promise<unknown>;

export interface TickDeps {
  /** Wait before each retry; a tick gets one more attempt than there are delays. */
  retryDelaysMs: number[];
  /** Base of the link in the admins' e-mail. */
  publicUrl: string;
  /** The clock; tests move it instead of waiting. */
  now?: () => Date;
}

export type TickOutcome = "skipped" | "succeeded" | "failed";

const jobTitles: Record<string, string> = {
  lapse: "The daily lapse check",
  reviewer_digest: "The reviewer digest",
  upload_sweep: "The sweep of abandoned uploads",
};

const errorText = (err: unknown) => (err instanceof Error ? err.message : String(err)).slice(0, 1000);

async function recordFailedRun(job: string, asOf: Date, startedAt: Date, attempt: number, error: string) {
  await JobRun.create({ job, asOf, startedAt, finishedAt: new Date(), counts: {}, attempt, error });
}

/**
 * Tells every active admin, in the app and by e-mail: when a tick first fails (its retries are on the way) and when it
 * has used its last attempt. A failure that a retry then mends is told once.
 */
async function notifyAdmins(
  job: string,
  tick: Date,
  attempt: number,
  error: string,
  retryAt: Date | null,
  deps: TickDeps,
) {
  const what = jobTitles[job] ?? `The job "${job}"`;
  const title = retryAt ? `${what} failed; retrying` : `${what} failed and will not be retried`;
  const body =
    `${what} scheduled for ${tick.toISOString()} failed on attempt ${attempt}: ${error}\n` +
    (retryAt
      ? `It will be tried again at ${retryAt.toISOString()}.`
      : "Every attempt is used: run it by hand (npm run job:lapse) once the cause is fixed.");
  const link = "/admin/job-runs";
  const admins = await User.findAll({ where: { role: "admin", active: true }, attributes: ["id", "email"] });
  await db().transaction(async (transaction) => {
    for (const admin of admins) {
      await tellPerson(
        {
          to: admin.email,
          subject: `Clearbench: ${title}`,
          text: `${body}\n\nJob runs: ${deps.publicUrl}${link}\n`,
        },
        { kind: "job_failed", title, body, link },
        transaction,
      );
    }
  });
}

async function attempt(
  job: string,
  tick: Date,
  attemptNo: number,
  work: JobWork,
  deps: TickDeps,
): Promise<TickOutcome> {
  const clock = deps.now ?? (() => new Date());
  const asOf = clock();
  const startedAt = new Date();
  try {
    const result = await work(asOf);
    await markTickSucceeded(job, tick);
    log.info({ job, attempt: attemptNo, result: summarize(result) }, "scheduled job finished");
    return "succeeded";
  } catch (err) {
    const error = errorText(err);
    const delay = deps.retryDelaysMs[attemptNo - 1];
    const retryAt = delay === undefined ? null : new Date(clock().getTime() + delay);
    log.error({ err, job, attempt: attemptNo, retryAt }, "scheduled job failed");
    await recordFailedRun(job, asOf, startedAt, attemptNo, error);
    await markTickFailed(job, tick, error, retryAt);
    if (attemptNo === 1 || !retryAt) await notifyAdmins(job, tick, attemptNo, error, retryAt, deps);
    return "failed";
  }
}

/** Runs one tick of a job if this instance claims it first; a failure is recorded and scheduled for a retry. */
export async function runScheduledTick(
  job: string,
  tick: Date,
  work: JobWork,
  deps: TickDeps,
): Promise<TickOutcome> {
  const now = (deps.now ?? (() => new Date()))();
  if (!(await claimTick(job, tick, now))) {
    log.info({ job }, "scheduled job already run by another instance");
    return "skipped";
  }
  return attempt(job, tick, 1, work, deps);
}

/**
 * The retry round (every minute): each tick whose retry is due, or whose run stopped without finishing (its lease ran
 * out), is claimed by one instance and run again. Returns how many attempts it made.
 */
export async function retryDueTicks(jobs: Record<string, JobWork>, deps: TickDeps): Promise<number> {
  const clock = deps.now ?? (() => new Date());
  const names = Object.keys(jobs);
  const maxAttempts = deps.retryDelaysMs.length + 1;
  for (const closed of await closeExhaustedCrashes(names, clock(), maxAttempts)) {
    const error = "the run stopped without finishing";
    await recordFailedRun(closed.job, closed.tick, clock(), closed.attempts, error);
    await notifyAdmins(closed.job, closed.tick, closed.attempts, error, null, deps);
  }
  let attempts = 0;
  for (;;) {
    const due = await claimDueRetry(names, clock(), maxAttempts);
    if (!due) return attempts;
    if (due.crashed) {
      const error = "the run stopped without finishing";
      await recordFailedRun(due.job, due.tick, clock(), due.attempts - 1, error);
      if (due.attempts - 1 === 1) await notifyAdmins(due.job, due.tick, 1, error, clock(), deps);
    }
    await attempt(due.job, due.tick, due.attempts, jobs[due.job]!, deps);
    attempts += 1;
  }
}

function summarize(result: unknown): unknown {
  if (result && typeof result === "object" && "changedStandings" in result) {
    const { changedStandings, ...rest } = result as { changedStandings: unknown[] };
    return { ...rest, changedStandings: changedStandings.length };
  }
  return result;
}
