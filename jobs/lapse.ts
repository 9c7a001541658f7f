import type { Sequelize, Transaction } from "sequelize";
import { loadConfig, publicUrl } from "../server/config.ts";
import { db } from "../server/db/sequelize.ts";
import { createWarningNotices, queueNoticeMessages, type HolderCount } from "../server/notices/index.ts";
import { lapsingWindowDays, refreshStandings, type ChangedStanding } from "../server/standing/index.ts";
import { countStatements, selectRows } from "../server/db/sql.ts";
import { remindMaintenanceDue } from "../server/machines/maintenance-reminders.ts";
import { JOB_LOCK_KEYS, withAdvisoryLock } from "./advisory-lock.ts";
import { finishJobRun, recordManualRun, startJobRun } from "./job-run-record.ts";

export interface LapseJobDeps {
  /** Connection to run on (tests race two pools); defaults to the app's. */
  sequelize?: Sequelize;
  /** Days before a lapse at which to warn (config WARNING_DAYS); the lapse itself (0) is always noticed. */
  warningDays?: readonly number[];
  /** Base of the links in the e-mails (config PUBLIC_URL). */
  publicUrl?: string;
  /** The admin who started this run by hand; the run is recorded as theirs and audited in its own transaction. */
  startedBy?: number;
}

export interface LapseJobReport {
  skipped: false;
  jobRunId: number;
  lapsed: number;
  noticesCreated: number;
  emailsQueued: number;
  /** Maintenance plans reminded 30 or 7 days before they fall due, and the e-mails queued for them. */
  maintenanceReminders: number;
  maintenanceEmails: number;
  changedStandings: ChangedStanding[];
  /** SQL statements the run issued, BEGIN and COMMIT included. */
  statements: number;
  startedAt: Date;
  finishedAt: Date;
  /** Milliseconds per step, for the run record and the closing note. */
  timings: Record<string, number>;
}

export type LapseJobResult = LapseJobReport | { skipped: true };

// BEGIN and COMMIT, issued by the transaction itself rather than through the counted helpers.
const TRANSACTION_STATEMENTS = 2;

/** The lapse step as one statement ($1 as of, $2 the run); the bench's floor runs the same text. */
export const LAPSE_CREDENTIALS_SQL = `WITH lapsed AS (
       UPDATE credentials SET state = 'lapsed', updated_at = CURRENT_TIMESTAMP
        WHERE state = 'verified' AND lapses_at <= $1::timestamptz
       RETURNING id, company_id, technician_id, lapses_at
     ), audited AS (
       INSERT INTO audit_events (actor_user_id, action, subject_type, subject_id, before, after)
       SELECT NULL, 'credential.lapsed', 'credential', id, '{"state":"verified"}'::jsonb,
              jsonb_build_object('state', 'lapsed', 'lapsesAt', lapses_at, 'asOf', $1::timestamptz, 'jobRunId', $2::int)
         FROM lapsed
     ), noticed AS (
       INSERT INTO notices (credential_id, threshold_days, lapses_at, job_run_id)
       SELECT id, 0, lapses_at, $2::int FROM lapsed
       ON CONFLICT ON CONSTRAINT notices_once_per_threshold DO NOTHING
       RETURNING id
     )
     SELECT company_id, technician_id, count(*)::int AS count, (SELECT count(*)::int FROM noticed) AS noticed
       FROM lapsed GROUP BY company_id, technician_id`;

/**
 * Marks every verified credential whose lapse instant is at or before `asOf` as lapsed, with one audit event each, and
 * a lapse notice (threshold 0) each, in one set-based statement.
 */
async function lapseCredentials(transaction: Transaction, asOf: Date, jobRunId: number) {
  return selectRows<HolderCount & { noticed: number }>(transaction, LAPSE_CREDENTIALS_SQL, [asOf, jobRunId]);
}

/** Technicians lacking a stored standing against the baseline or an active set (e.g. added since): the run fills them in. */
async function techniciansWithoutStanding(transaction: Transaction): Promise<number[]> {
  const rows = await selectRows<{ id: number }>(
    transaction,
    `SELECT DISTINCT t.id FROM technicians t
       CROSS JOIN (SELECT 0 AS set_key UNION ALL SELECT id FROM requirement_sets WHERE active) s
      WHERE NOT EXISTS (SELECT 1 FROM technician_standings ts
                         WHERE ts.technician_id = t.id AND coalesce(ts.requirement_set_id, 0) = s.set_key)`,
  );
  return rows.map((r) => r.id);
}

/**
 * Holders of a verified credential that came into force since the previous run: a renewal verified before its start
 * date leaves the holder not cleared until then, and nothing else would recompute it on that day. Dates are compared
 * with a day of slack either side so the holder's zone never matters; recomputing one holder too many is harmless.
 */
async function holdersComingIntoForce(
  transaction: Transaction,
  asOf: Date,
  jobRunId: number,
): Promise<HolderCount[]> {
  return selectRows<HolderCount>(
    transaction,
    `WITH previous AS (
       SELECT coalesce(max(as_of), $1::timestamptz - interval '2 days') AS as_of FROM job_runs
        WHERE job = 'lapse' AND id <> $2 AND as_of < $1::timestamptz)
     SELECT c.company_id, c.technician_id, count(*)::int AS count
       FROM credentials c, previous p
      WHERE c.state = 'verified'
        AND coalesce(c.fields->>'effectiveDate', c.fields->>'issueDate')::date
            BETWEEN (p.as_of AT TIME ZONE 'UTC')::date - 1 AND ($1::timestamptz AT TIME ZONE 'UTC')::date + 1
      GROUP BY c.company_id, c.technician_id`,
    [asOf.toISOString(), jobRunId],
  );
}

/**
 * Technicians whose stored standing time alone has made stale: "cleared" with a requirement now lapsing inside the
 * lapsing window, or "lapsing" past the instant the engine gave for that lapse (its own instant, from the fields,
 * whatever the credential row's lapses_at says). With a lapse or a credential coming into force, which the other steps
 * return, these are the only standings that change overnight; a warning for a credential already inside the window
 * changes nothing, so warned holders are not recomputed as such. Read from the stored instants, so a missed run is
 * covered too; the slack (days counted in the company's zone) only recomputes a holder too many, which is harmless.
 */
async function techniciansEnteringWindow(transaction: Transaction, asOf: Date): Promise<number[]> {
  const rows = await selectRows<{ technician_id: number }>(
    transaction,
    `SELECT DISTINCT technician_id FROM technician_standings
      WHERE (standing = 'cleared' AND earliest_lapse <= $1::timestamptz + make_interval(days => $2::int + 2))
         OR (standing = 'lapsing' AND earliest_lapse <= $1::timestamptz + interval '1 day')`,
    [asOf, lapsingWindowDays()],
  );
  return rows.map((r) => r.technician_id);
}

function holdersOf(counts: HolderCount[], extraTechnicianIds: number[]) {
  const companyIds = new Set<number>();
  const technicianIds = new Set<number>(extraTechnicianIds);
  for (const c of counts) {
    if (c.technician_id === null) companyIds.add(c.company_id);
    else technicianIds.add(c.technician_id);
  }
  return { companyIds: [...companyIds], technicianIds: [...technicianIds] };
}

const sum = (counts: HolderCount[]) => counts.reduce((n, c) => n + c.count, 0);

/**
 * The daily lapse job: lapses what ended, creates the due warnings once each, queues their e-mails and in-app
 * notifications, and recomputes the standings of the holders concerned, all in one transaction behind an advisory lock
 * (a second instance gets `{ skipped: true }`). Set-based: the statement count does not grow with the data.
 */
export async function runLapseJob(
  { asOf }: { asOf: Date },
  deps: LapseJobDeps = {},
): Promise<LapseJobResult> {
  const startedAt = new Date();
  const sequelize = deps.sequelize ?? db();
  const config = deps.warningDays && deps.publicUrl ? undefined : loadConfig();
  const warningDays = deps.warningDays ?? config!.WARNING_DAYS;
  const base = deps.publicUrl ?? publicUrl(config!);
  let counter = { count: 0 };

  const outcome = await withAdvisoryLock(
    sequelize,
    JOB_LOCK_KEYS.lapse,
    async (transaction) => {
      const timings: Record<string, number> = {};
      const timed = async <T>(step: string, work: () => Promise<T>): Promise<T> => {
        const start = performance.now();
        const value = await work();
        timings[step] = Math.round(performance.now() - start);
        return value;
      };
      const jobRunId = await startJobRun(transaction, "lapse", asOf, startedAt, deps.startedBy ?? null);
      if (deps.startedBy !== undefined) await recordManualRun(transaction, deps.startedBy, jobRunId, asOf);
      const lapsed = await timed("lapse", () => lapseCredentials(transaction, asOf, jobRunId));
      const warned = await timed("warn", () =>
        createWarningNotices(transaction, { asOf, thresholds: warningDays, jobRunId }),
      );
      const queued = await timed("queue", () =>
        queueNoticeMessages(transaction, { jobRunId, asOf, publicUrl: base }),
      );
      const unstored = await timed("unstored", () => techniciansWithoutStanding(transaction));
      const starting = await timed("starting", () => holdersComingIntoForce(transaction, asOf, jobRunId));
      const entering = await timed("entering", () => techniciansEnteringWindow(transaction, asOf));
      const changedStandings = await timed("standings", () =>
        refreshStandings(holdersOf([...lapsed, ...starting], [...unstored, ...entering]), transaction, asOf),
      );
      const maintenance = await timed("maintenance", () =>
        remindMaintenanceDue(transaction, { asOf, jobRunId, publicUrl: base }),
      );
      const noticesCreated = (lapsed[0]?.noticed ?? 0) + sum(warned);
      const counts = {
        lapsed: sum(lapsed),
        noticesCreated,
        emailsQueued: queued.emails,
        ...maintenance,
        changedStandings: changedStandings.length,
        statements: counter.count + 1 + TRANSACTION_STATEMENTS,
        timings,
      };
      const finishedAt = await finishJobRun(transaction, jobRunId, counts);
      return {
        jobRunId,
        lapsed: counts.lapsed,
        noticesCreated,
        emailsQueued: queued.emails,
        ...maintenance,
        changedStandings,
        finishedAt,
        timings,
      };
    },
    (transaction) => {
      counter = countStatements(transaction);
    },
  );
  if (outcome.skipped) return { skipped: true };
  return { skipped: false, ...outcome.value, statements: counter.count + TRANSACTION_STATEMENTS, startedAt };
}
