import cron, { type ScheduledTask } from "node-cron";
import type { Config } from "../server/config.ts";
import { log } from "../server/log.ts";
import { createSmtpMailer, type Mailer } from "../server/mail/index.ts";
import { sweepRosterAlerts } from "../server/roster/index.ts";
import { runLapseJob } from "./lapse.ts";
import { claimTick, tickOf } from "./claim-tick.ts";
import { runReviewerDigest } from "./reviewer-digest.ts";
import { runSendOutbox } from "./send-outbox.ts";
import { followUpDeps, runServiceRequestFollowUp } from "./service-request-follow-up.ts";

export interface RunningSchedule {
  tasks: ScheduledTask[];
  stop(): Promise<void>;
}

function guarded(name: string, work: () => Promise<unknown>, claimed = false) {
  return async (context?: { date?: Date }) => {
    try {
      if (claimed && !(await claimTick(name, tickOf(context?.date ?? new Date())))) {
        log.info({ job: name }, "scheduled job already run by another instance");
        return;
      }
      const result = await work();
      log.info({ job: name, result: summarize(result) }, "scheduled job finished");
    } catch (err) {
      log.error({ err, job: name }, "scheduled job failed");
    }
  };
}

function summarize(result: unknown): unknown {
  if (result && typeof result === "object" && "changedStandings" in result) {
    const { changedStandings, ...rest } = result as { changedStandings: unknown[] };
    return { ...rest, changedStandings: changedStandings.length };
  }
  return result;
}

/**
 * The server's timers: the lapse job and the reviewers' digest once a day at JOB_CRON in JOB_TIME_ZONE, and the outbox
 * every minute. `noOverlap` skips a tick while the previous one still runs; the advisory locks keep other instances out.
 */
export function startSchedule(config: Config, deps: { mailer?: Mailer } = {}): RunningSchedule {
  const mailer = deps.mailer ?? (config.SMTP_URL ? createSmtpMailer(config.SMTP_URL) : undefined);
  const daily = { timezone: config.JOB_TIME_ZONE, noOverlap: true };
  const tasks = [
    cron.schedule(
      config.JOB_CRON,
      guarded(
        "lapse",
        async () => {
          const result = await runLapseJob({ asOf: new Date() });
          // Rostered technicians coming within 30 days of a lapse alert their buyers even without a standing change.
          await sweepRosterAlerts();
          // The warnings leave now rather than at the outbox's next round.
          if (mailer) await runSendOutbox({ asOf: new Date() }, { mailer, from: config.MAIL_FROM });
          return result;
        },
        true,
      ),
      { ...daily, name: "lapse" },
    ),
    cron.schedule(
      config.JOB_CRON,
      guarded("reviewer_digest", () => runReviewerDigest({ asOf: new Date() }), true),
      { ...daily, name: "reviewer-digest" },
    ),
    // Every ten minutes: a machine-down request is chased after one business hour, so a daily run is too coarse.
    cron.schedule(
      "*/10 * * * *",
      guarded("service_request_follow_up", () =>
        runServiceRequestFollowUp({ asOf: new Date() }, followUpDeps(config)),
      ),
      { name: "service-request-follow-up", noOverlap: true },
    ),
  ];
  if (mailer) {
    tasks.push(
      cron.schedule(
        "* * * * *",
        guarded("outbox", () => runSendOutbox({ asOf: new Date() }, { mailer, from: config.MAIL_FROM })),
        {
          name: "outbox",
          noOverlap: true,
        },
      ),
    );
  }
  return {
    tasks,
    async stop() {
      for (const task of tasks) await task.stop();
      if (!deps.mailer) mailer?.close();
    },
  };
}
