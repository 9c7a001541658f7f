import { parseArgs } from "node:util";
import { loadConfig, publicUrl } from "../server/config.ts";
import { configureLog } from "../server/log.ts";
import { connectDatabase } from "../server/db/sequelize.ts";
import { initModels } from "../server/db/associations.ts";
import { createSmtpMailer } from "../server/mail/index.ts";
import { checkStandingConsistency } from "../server/standing/index.ts";
import { registerRosterAlerts, setRosterAlertLinkBase, sweepRosterAlerts } from "../server/roster/index.ts";
import { remindBrokers } from "../server/credentials/broker-reminders.ts";
import { runLapseJob } from "./lapse.ts";
import { runReviewerDigest } from "./reviewer-digest.ts";
import { runSendOutbox } from "./send-outbox.ts";
import { followUpDeps, runServiceRequestFollowUp } from "./service-request-follow-up.ts";

// `npm run job:lapse -- --as-of 2027-03-01T06:00:00Z [--no-send]`, `npm run job:lapse -- --check`, `npm run job:outbox`.
const say = (line: string) => process.stdout.write(`${line}\n`);
const DEV_DATABASE_URL = "postgres://postgres@127.0.0.1:54329/clearbench";
const DEV_SMTP_URL = "smtp://127.0.0.1:2525";

const { values, positionals } = parseArgs({
  allowPositionals: true,
  options: {
    "as-of": { type: "string" },
    "no-send": { type: "boolean", default: false },
    check: { type: "boolean", default: false },
  },
});

const command = positionals[0] ?? "lapse";
const config = loadConfig();
setRosterAlertLinkBase(publicUrl(config));
configureLog(config.LOG_LEVEL === "info" ? "warn" : config.LOG_LEVEL);

if (!config.DATABASE_URL) {
  say("DATABASE_URL is not set. Run this while `npm start` is running, pointing at its database:");
  say(
    `  DATABASE_URL=${DEV_DATABASE_URL} npm run job:${command} -- ${process.argv.slice(3).join(" ")}`.trimEnd(),
  );
  process.exit(2);
}

const asOf = values["as-of"] ? new Date(values["as-of"]) : new Date();
if (Number.isNaN(asOf.getTime())) {
  say(`--as-of must be an ISO instant such as 2027-03-01T06:00:00Z, not ${values["as-of"]}`);
  process.exit(2);
}

const sequelize = connectDatabase(config.DATABASE_URL, { poolMax: 3 });
initModels(sequelize);
const ms = (since: number) => `${(performance.now() - since).toFixed(0)} ms`;

async function sendOutbox(): Promise<void> {
  const mailer = createSmtpMailer(config.SMTP_URL ?? DEV_SMTP_URL);
  const started = performance.now();
  try {
    const report = await runSendOutbox({ asOf: new Date() }, { mailer, from: config.MAIL_FROM });
    say(
      `outbox: sent ${report.sent}, will retry ${report.retried}, failed ${report.failed} (${ms(started)})`,
    );
  } finally {
    mailer.close();
  }
}

async function main(): Promise<number> {
  if (command === "lapse" && values.check) {
    const started = performance.now();
    const { checked, differences } = await sequelize.transaction((t) => checkStandingConsistency(t));
    say(`consistency check: ${checked} stored standings, ${differences.length} differences (${ms(started)})`);
    for (const d of differences.slice(0, 50)) {
      say(
        `  technician ${d.technicianId}, set ${d.requirementSetId ?? "baseline"}: ${d.problem} (stored ${d.stored}, computed ${d.computed})`,
      );
    }
    return differences.length === 0 ? 0 : 1;
  }
  if (command === "lapse") {
    // Buyers' roster alerts hear the standings this run changes.
    registerRosterAlerts();
    const started = performance.now();
    const result = await runLapseJob({ asOf });
    if (result.skipped) {
      say("lapse job: skipped, another instance holds the lock");
      return 0;
    }
    say(
      `lapse job as of ${asOf.toISOString()}: ${result.lapsed} lapsed, ${result.noticesCreated} notices, ${result.emailsQueued} e-mails queued,`,
    );
    say(
      `  ${result.changedStandings.length} standings changed, ${result.statements} SQL statements, ${ms(started)}`,
    );
    const rosterAlerts = await sweepRosterAlerts();
    say(`  ${rosterAlerts} roster alerts to buyers`);
    say(
      `  ${result.maintenanceReminders} maintenance reminders, ${result.maintenanceEmails} e-mails queued for them`,
    );
    if (!values["no-send"]) await sendOutbox();
    return 0;
  }
  if (command === "digest") {
    const result = await runReviewerDigest({ asOf });
    say(
      result.skipped
        ? "reviewer digest: skipped"
        : `reviewer digest ${result.digestDate}: ${result.sent} sent, queue ${result.queueCount}`,
    );
    if (!values["no-send"]) await sendOutbox();
    return 0;
  }
  if (command === "follow-up") {
    const started = performance.now();
    const result = await runServiceRequestFollowUp({ asOf }, followUpDeps(config));
    say(
      `service-request follow-up as of ${asOf.toISOString()}: ${result.reminded} reminders (${result.companiesReminded} companies), ${result.expired} expired (${ms(started)})`,
    );
    if (!values["no-send"]) await sendOutbox();
    return 0;
  }
  if (command === "broker-reminders") {
    const started = performance.now();
    const result = await remindBrokers(asOf, publicUrl(config));
    say(`broker reminders as of ${asOf.toISOString()}: ${result.reminded} sent (${ms(started)})`);
    if (!values["no-send"]) await sendOutbox();
    return 0;
  }
  if (command === "outbox") {
    await sendOutbox();
    return 0;
  }
  say(`Unknown job ${command}: use lapse, digest, follow-up, broker-reminders or outbox`);
  return 2;
}

try {
  process.exitCode = await main();
} catch (err) {
  say(`job failed: ${err instanceof Error ? err.message : String(err)}`);
  process.exitCode = 1;
} finally {
  await sequelize.close();
}
