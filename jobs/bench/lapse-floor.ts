import type pg from "pg";
import { LAPSE_CREDENTIALS_SQL } from "../lapse.ts";
import { WARNING_NOTICES_SQL } from "../../server/notices/lapse-notices.ts";
import type { ChangedStanding } from "../../server/standing/index.ts";

/**
 * The queue step as one statement: the run's notices joined to their recipients (the company's provider admins, and
 * the technician for their own card), an outbox e-mail and an in-app notification each, with the text made in SQL.
 * Shorter text than the job renders, so as a floor it errs low.
 */
const QUEUE_SQL = `
  WITH run_notices AS (
    SELECT n.id AS notice_id, n.threshold_days, n.lapses_at, c.type_code, c.company_id, c.technician_id
      FROM notices n JOIN credentials c ON c.id = n.credential_id WHERE n.job_run_id = $1
  ), addressed AS (
    SELECT r.*, u.id AS user_id FROM run_notices r
      JOIN users u ON u.company_id = r.company_id AND u.role = 'provider_admin' AND u.active
    UNION ALL
    SELECT r.*, u.id AS user_id FROM run_notices r
      JOIN users u ON u.technician_id = r.technician_id AND u.role = 'technician' AND u.active
  ), recipients AS (
    SELECT a.notice_id, a.threshold_days, u.id AS user_id, u.email, u.name AS user_name, ct.name AS type_name,
           coalesce(t.name, co.name) AS holder, to_char(a.lapses_at AT TIME ZONE co.time_zone, 'FMMonth FMDD, YYYY') AS day,
           CASE WHEN a.threshold_days = 0 THEN 'credential_lapsed' ELSE 'credential_lapsing' END AS kind
      FROM addressed a JOIN users u ON u.id = a.user_id JOIN credential_types ct ON ct.code = a.type_code
      JOIN companies co ON co.id = a.company_id LEFT JOIN technicians t ON t.id = a.technician_id
  ), texts AS (
    SELECT r.*, format('%s %s %s: %s', r.type_name, CASE WHEN r.threshold_days = 0 THEN 'lapsed' ELSE 'lapses' END, r.day, r.holder) AS subject,
           format(E'Hello %s,\\n\\n%s for %s %s on %s.\\nRenew it at %s/credentials.\\n', r.user_name, r.type_name, r.holder,
                  CASE WHEN r.threshold_days = 0 THEN 'lapsed' ELSE 'lapses' END, r.day, $2::text) AS body
      FROM recipients r
  ), mail AS (
    INSERT INTO outbox_messages (to_address, subject, text_body, html_body)
    SELECT email, subject, body, '<p>' || replace(replace(replace(body, '&', '&amp;'), '<', '&lt;'), E'\\n', '<br>') || '</p>'
      FROM texts RETURNING 1
  ), note AS (
    INSERT INTO notifications (user_id, kind, title, body, link, notice_id)
    SELECT user_id, kind, subject, body, '/credentials', notice_id FROM texts RETURNING 1
  )
  SELECT (SELECT count(*) FROM mail)::int AS emails, (SELECT count(*) FROM note)::int AS notifications`;

/**
 * The standings step as one statement: the rows the job changed, written with the job's new standing and lapse instant
 * (the rule engine that computes them has no SQL form here, so the floor leaves its computing out and errs low).
 */
const STANDINGS_SQL = `
  UPDATE technician_standings s
     SET standing = v.after, earliest_lapse = v.earliest_lapse::timestamptz, results = s.results, computed_at = $2
    FROM jsonb_to_recordset($1::jsonb) AS v(technician_id int, requirement_set_id int, after text, earliest_lapse text)
   WHERE s.technician_id = v.technician_id AND coalesce(s.requirement_set_id, 0) = coalesce(v.requirement_set_id, 0)`;

export interface LapseFloorResult {
  ms: number;
  steps: Record<string, number>;
  rows: Record<string, number>;
  statements: number;
}

/**
 * The lapse job's floor, measured: the fewest set-based statements doing every step the job does on the bench data, in
 * one transaction: (1) lapse with audit rows and lapse notices, (2) due warnings, (3) e-mails and in-app notifications
 * for them, (4) the changed standings. Maintenance reminders are left out (the large data set has no maintenance
 * plans, so the job's own step finds none); roster alerts and broker reminders are not part of the job's call.
 */
export async function measureLapseFloor(
  client: pg.Client,
  options: {
    asOf: Date;
    warningDays: readonly number[];
    publicUrl: string;
    changed: ChangedStanding[];
    /** Roll back instead of committing (a test compares the floor's rows with the job's on one database). */
    rollback?: boolean;
  },
): Promise<LapseFloorResult> {
  const steps: Record<string, number> = {};
  const rows: Record<string, number> = {};
  const step = async (name: string, sql: string, bind: unknown[]) => {
    const t0 = performance.now();
    const r = await client.query(sql, bind);
    steps[name] = Math.round(performance.now() - t0);
    return r;
  };
  const t0 = performance.now();
  await client.query("BEGIN");
  const run = await client.query<{ id: number }>(
    "INSERT INTO job_runs (job, as_of, started_at) VALUES ('lapse', $1, now()) RETURNING id",
    [options.asOf],
  );
  const jobRunId = run.rows[0]!.id;
  const lapsed = await step("lapse", LAPSE_CREDENTIALS_SQL, [options.asOf, jobRunId]);
  rows.lapsed = lapsed.rows.reduce((n, r: { count: number }) => n + r.count, 0);
  const thresholds = options.warningDays.filter((d) => d > 0);
  const warned = await step("warn", WARNING_NOTICES_SQL, [
    options.asOf,
    thresholds,
    Math.max(...thresholds),
    jobRunId,
  ]);
  rows.warned = warned.rows.reduce((n, r: { count: number }) => n + r.count, 0);
  const queued = await step("queue", QUEUE_SQL, [jobRunId, options.publicUrl]);
  rows.emails = (queued.rows[0] as { emails: number }).emails;
  const changed = JSON.stringify(
    options.changed.map((c) => ({
      technician_id: c.technicianId,
      requirement_set_id: c.requirementSetId,
      after: c.after,
      earliest_lapse: c.earliestLapse,
    })),
  );
  const standings = await step("standings", STANDINGS_SQL, [changed, options.asOf]);
  rows.standings = standings.rowCount ?? 0;
  await client.query(options.rollback ? "ROLLBACK" : "COMMIT");
  return { ms: Math.round(performance.now() - t0), steps, rows, statements: 7 };
}
