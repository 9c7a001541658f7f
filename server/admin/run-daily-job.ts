import { AppError } from "../http/app-error.ts";
import { sweepRosterAlerts } from "../roster/index.ts";
import { remindBrokers } from "../credentials/broker-reminders.ts";
import { runLapseJob } from "../../jobs/lapse.ts";

/**
 * The daily round started by an admin: judged as of the moment it is asked for (never another day, so a hand-started
 * run cannot lapse tomorrow's credentials early or replay yesterday's), recorded and audited as that admin's run.
 * The advisory lock the scheduled run holds makes a second run wait for nobody: it is refused with 409.
 */
export async function runDailyJobNow(admin: Express.User, linkBase: string) {
  const asOf = new Date();
  const result = await runLapseJob({ asOf }, { startedBy: admin.id });
  if (result.skipped)
    throw new AppError("conflict", "The daily job is running already; try again when it has finished");
  // The rest of the scheduled round, each claimed once per threshold, so running it twice in a day sends nothing twice.
  await sweepRosterAlerts();
  await remindBrokers(asOf, linkBase);
  return {
    jobRunId: result.jobRunId,
    asOf: asOf.toISOString(),
    lapsed: result.lapsed,
    noticesCreated: result.noticesCreated,
    emailsQueued: result.emailsQueued,
    changedStandings: result.changedStandings.length,
  };
}
