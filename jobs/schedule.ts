import cron, { type ScheduledTask } from "node-cron";
import { publicUrl, type Config } from "../server/config.ts";
import { log } from "../server/log.ts";
import { createSmtpMailer, type Mailer } from "../server/mail/index.ts";
import { sweepRosterAlerts } from "../server/roster/index.ts";
import { createStorage, type FileStorage } from "../server/storage/index.ts";
import { remindBrokers } from "../server/credentials/broker-reminders.ts";
import { runLapseJob } from "./lapse.ts";
import { tickOf } from "./claim-tick.ts";
import { retryDueTicks, runScheduledTick, type JobWork, type TickDeps } from "./run-tick.ts";
import { runReviewerDigest } from "./reviewer-digest.ts";
import { runSendOutbox } from "./send-outbox.ts";
import { followUpDeps, runServiceRequestFollowUp } from "./service-request-follow-up.ts";
import { runUploadSweep } from "./sweep-uploads.ts";

export interface RunningSchedule {
  tasks: ScheduledTask[];
  stop(): Promise<void>;
}

// Hourly, at an odd minute so it does not meet the daily jobs.
const UPLOAD_SWEEP_CRON = "17 * * * *";

/** The claimed jobs by name: each runs once per tick across every instance, and is retried when it fails. */
export function scheduledJobs(
  config: Config,
  deps: { mailer?: Mailer; storage: FileStorage },
): Record<string, JobWork> {
  return {
    lapse: async (asOf) => {
      const result = await runLapseJob({ asOf });
      // Rostered technicians coming within 30 days of a lapse alert their buyers even without a standing change.
      await sweepRosterAlerts();
      // Brokers are chased on the same daily round, so reminders go out with the lapse warnings they anticipate.
      await remindBrokers(asOf, publicUrl(config));
      // The warnings leave now rather than at the outbox's next round.
      if (deps.mailer)
        await runSendOutbox({ asOf: new Date() }, { mailer: deps.mailer, from: config.MAIL_FROM });
      return result;
    },
    reviewer_digest: (asOf) => runReviewerDigest({ asOf }),
    upload_sweep: (asOf) => runUploadSweep({ asOf }, { storage: deps.storage }),
    service_request_follow_up: (asOf) => runServiceRequestFollowUp({ asOf }, followUpDeps(config)),
  };
}

function guarded(work: () => Promise<unknown>, name: string) {
  return async () => {
    try {
      await work();
    } catch (err) {
      log.error({ err, job: name }, "scheduled task failed");
    }
  };
}

/**
 * The server's timers: the lapse job and the reviewers' digest once a day at JOB_CRON in JOB_TIME_ZONE, the sweep of
 * abandoned uploads hourly, the outbox and the retry round every minute. `noOverlap` skips a tick while the previous
 * one still runs; claimed ticks and the advisory locks keep other instances out.
 */
export function startSchedule(
  config: Config,
  deps: { mailer?: Mailer; storage?: FileStorage } = {},
): RunningSchedule {
  const mailer = deps.mailer ?? (config.SMTP_URL ? createSmtpMailer(config.SMTP_URL) : undefined);
  const storage = deps.storage ?? createStorage(config.UPLOADS_DIR, config);
  const jobs = scheduledJobs(config, { mailer, storage });
  const tickDeps: TickDeps = {
    retryDelaysMs: config.JOB_RETRY_MINUTES.map((m) => m * 60_000),
    publicUrl: publicUrl(config),
  };
  const claimed = (name: string) => (context?: { date?: Date }) =>
    guarded(() => runScheduledTick(name, tickOf(context?.date ?? new Date()), jobs[name]!, tickDeps), name)();
  const daily = { timezone: config.JOB_TIME_ZONE, noOverlap: true };
  const tasks = [
    cron.schedule(config.JOB_CRON, claimed("lapse"), { ...daily, name: "lapse" }),
    cron.schedule(config.JOB_CRON, claimed("reviewer_digest"), { ...daily, name: "reviewer-digest" }),
    cron.schedule(UPLOAD_SWEEP_CRON, claimed("upload_sweep"), { noOverlap: true, name: "upload-sweep" }),
    // Every ten minutes: a machine-down request is chased after one business hour, so a daily run is too coarse.
    cron.schedule("*/10 * * * *", claimed("service_request_follow_up"), {
      noOverlap: true,
      name: "service-request-follow-up",
    }),
    cron.schedule(
      "* * * * *",
      guarded(() => retryDueTicks(jobs, tickDeps), "job_retries"),
      { noOverlap: true, name: "job-retries" },
    ),
  ];
  if (mailer) {
    tasks.push(
      cron.schedule(
        "* * * * *",
        guarded(() => runSendOutbox({ asOf: new Date() }, { mailer, from: config.MAIL_FROM }), "outbox"),
        { name: "outbox", noOverlap: true },
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
