import type { Transaction } from "sequelize";
import { runStatement, selectRows } from "../db/sql.ts";
import { renderLapseNotice, type NoticeRecipient } from "./lapse-email.ts";

export interface HolderCount {
  company_id: number;
  technician_id: number | null;
  count: number;
}

/**
 * Warning notices for verified credentials whose lapse instant falls inside a warning window: one per credential per
 * threshold, the smallest window we are inside (the same rule as shared dueThreshold: remaining time <= N days of 24 h),
 * so a missed run still sends the one notice that matters. The unique constraint, not code, stops a second copy.
 */
/** The warning step as one statement ($1 as of, $2 thresholds > 0, $3 the widest, $4 the run); the bench's floor runs it too. */
export const WARNING_NOTICES_SQL = `WITH due AS (
       SELECT c.id, c.company_id, c.technician_id, c.lapses_at,
              (SELECT min(d) FROM unnest($2::int[]) AS d WHERE c.lapses_at <= $1::timestamptz + d * interval '24 hours') AS threshold_days
         FROM credentials c
        WHERE c.state = 'verified' AND c.lapses_at > $1::timestamptz AND c.lapses_at <= $1::timestamptz + $3::int * interval '24 hours'
     ), noticed AS (
       INSERT INTO notices (credential_id, threshold_days, lapses_at, job_run_id)
       SELECT id, threshold_days, lapses_at, $4 FROM due
       ON CONFLICT ON CONSTRAINT notices_once_per_threshold DO NOTHING
       RETURNING credential_id
     )
     SELECT d.company_id, d.technician_id, count(*)::int AS count
       FROM due d JOIN noticed n ON n.credential_id = d.id
      GROUP BY d.company_id, d.technician_id`;

export async function createWarningNotices(
  transaction: Transaction,
  options: { asOf: Date; thresholds: readonly number[]; jobRunId: number },
): Promise<HolderCount[]> {
  const widest = Math.max(...options.thresholds);
  return selectRows<HolderCount>(transaction, WARNING_NOTICES_SQL, [
    options.asOf,
    options.thresholds.filter((d) => d > 0),
    widest,
    options.jobRunId,
  ]);
}

interface RecipientRow {
  notice_id: number;
  threshold_days: number;
  lapses_at: Date;
  credential_id: number;
  type_code: string;
  type_name: string;
  company_name: string;
  time_zone: string;
  technician_id: number | null;
  technician_name: string | null;
  user_id: number;
  role: "provider_admin" | "technician";
  email: string;
  user_name: string;
}

/** Who hears about the notices of one run: the company's provider admins and, for a technician's own card, that technician. */
export async function findNoticeRecipients(
  transaction: Transaction,
  jobRunId: number,
): Promise<NoticeRecipient[]> {
  const rows = await selectRows<RecipientRow>(
    transaction,
    `WITH run_notices AS (
       SELECT n.id AS notice_id, n.threshold_days, n.lapses_at, c.id AS credential_id, c.type_code, c.company_id, c.technician_id
         FROM notices n JOIN credentials c ON c.id = n.credential_id
        WHERE n.job_run_id = $1
     ), addressed AS (
       -- Two equi-joins rather than one OR-join, so the planner can hash-join both against users.
       SELECT r.*, u.id AS user_id FROM run_notices r
         JOIN users u ON u.company_id = r.company_id AND u.role = 'provider_admin' AND u.active
       UNION ALL
       SELECT r.*, u.id AS user_id FROM run_notices r
         JOIN users u ON u.technician_id = r.technician_id AND u.role = 'technician' AND u.active
     )
     SELECT a.notice_id, a.threshold_days, a.lapses_at, a.credential_id, a.type_code, ct.name AS type_name,
            co.name AS company_name, co.time_zone, a.technician_id, t.name AS technician_name,
            u.id AS user_id, u.email, u.name AS user_name, u.role
       FROM addressed a
       JOIN users u ON u.id = a.user_id
       JOIN credential_types ct ON ct.code = a.type_code
       JOIN companies co ON co.id = a.company_id
       LEFT JOIN technicians t ON t.id = a.technician_id
      ORDER BY a.notice_id, u.id`,
    [jobRunId],
  );
  return rows.map((r) => ({
    noticeId: r.notice_id,
    thresholdDays: r.threshold_days,
    lapsesAt: new Date(r.lapses_at),
    credentialId: r.credential_id,
    typeCode: r.type_code,
    typeName: r.type_name,
    companyName: r.company_name,
    timeZone: r.time_zone,
    technicianId: r.technician_id,
    technicianName: r.technician_name,
    userId: r.user_id,
    role: r.role,
    email: r.email,
    userName: r.user_name,
  }));
}

// Rows per bulk insert: each statement binds one array per column.
const INSERT_CHUNK = 2_000;

/**
 * The outbox e-mails and in-app notifications of one chunk in one statement: column arrays unnested side by side
 * (PostgreSQL's multi-argument unnest), cheaper to bind and read than one JSON document of the same rows.
 */
const QUEUE_CHUNK_SQL = `WITH m AS (
       SELECT * FROM unnest($1::text[], $2::text[], $3::text[], $4::text[], $5::int[], $6::text[], $7::text[], $8::text[], $9::text[], $10::int[])
         AS m(to_address, subject, text_body, html_body, user_id, kind, title, body, link, notice_id)
     ), mail AS (
       INSERT INTO outbox_messages (to_address, subject, text_body, html_body)
       SELECT to_address, subject, text_body, html_body FROM m
     )
     INSERT INTO notifications (user_id, kind, title, body, link, notice_id)
     SELECT user_id, kind, title, body, link, notice_id FROM m`;

/**
 * Each recipient of each new notice gets an outbox row (e-mail) and an in-app notification, written by one bulk
 * statement per chunk, in the job's transaction: if the run rolls back, nothing is queued.
 */
export async function queueNoticeMessages(
  transaction: Transaction,
  recipients: readonly NoticeRecipient[],
  options: { asOf: Date; publicUrl: string },
): Promise<{ emails: number; notifications: number }> {
  for (let i = 0; i < recipients.length; i += INSERT_CHUNK) {
    const chunk = recipients.slice(i, i + INSERT_CHUNK);
    const columns: (string | number)[][] = Array.from({ length: 10 }, () => []);
    for (const r of chunk) {
      const m = renderLapseNotice(r, options.asOf, options.publicUrl);
      const row = [r.email, m.subject, m.text, m.html, r.userId, m.kind, m.title, m.body, m.link, r.noticeId];
      row.forEach((value, c) => columns[c]!.push(value));
    }
    await runStatement(transaction, QUEUE_CHUNK_SQL, columns);
  }
  return { emails: recipients.length, notifications: recipients.length };
}
