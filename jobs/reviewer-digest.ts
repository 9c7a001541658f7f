import { DateTime } from "luxon";
import type { Sequelize } from "sequelize";
import { loadConfig, publicUrl } from "../server/config.ts";
import { db } from "../server/db/sequelize.ts";
import { countStatements, runStatement, selectRows } from "../server/db/sql.ts";
import { JOB_LOCK_KEYS, withAdvisoryLock } from "./advisory-lock.ts";
import { finishJobRun, startJobRun } from "./job-run-record.ts";

export interface ReviewerDigestDeps {
  sequelize?: Sequelize;
  /** Zone whose calendar day the digest belongs to (config JOB_TIME_ZONE). */
  timeZone?: string;
  publicUrl?: string;
}

export type ReviewerDigestResult =
  | { skipped: true }
  | { skipped: false; digestDate: string; queueCount: number; sent: number; statements: number };

interface DigestRow {
  user_id: number;
  email: string;
  name: string;
  queue_count: number;
  oldest_submitted_at: Date;
}

function waitingWords(oldest: Date, asOf: Date): string {
  const hours = Math.max(0, Math.floor((asOf.getTime() - oldest.getTime()) / 3_600_000));
  return hours < 48 ? `${hours} hour${hours === 1 ? "" : "s"}` : `${Math.floor(hours / 24)} days`;
}

/**
 * One e-mail a day to each reviewer while the verification queue is not empty: how many wait and for how long the
 * oldest has waited. The unique (user, date) row makes a second run on the same day send nothing.
 */
export async function runReviewerDigest(
  { asOf }: { asOf: Date },
  deps: ReviewerDigestDeps = {},
): Promise<ReviewerDigestResult> {
  const config = deps.timeZone && deps.publicUrl ? undefined : loadConfig();
  const timeZone = deps.timeZone ?? config!.JOB_TIME_ZONE;
  const queueLink = `${(deps.publicUrl ?? publicUrl(config!)).replace(/\/$/, "")}/review`;
  const digestDate = DateTime.fromJSDate(asOf, { zone: timeZone }).toISODate()!;
  let counter = { count: 0 };

  const outcome = await withAdvisoryLock(
    deps.sequelize ?? db(),
    JOB_LOCK_KEYS.reviewerDigest,
    async (transaction) => {
      const runId = await startJobRun(transaction, "reviewer_digest", asOf, new Date());
      const rows = await selectRows<DigestRow>(
        transaction,
        `WITH queue AS (
           SELECT count(*)::int AS n, min(submitted_at) AS oldest FROM credentials WHERE state = 'submitted' AND submitted_at <= $2
         ), written AS (
           INSERT INTO reviewer_digests (user_id, digest_date, queue_count, oldest_submitted_at)
           SELECT u.id, $1::date, q.n, q.oldest FROM users u CROSS JOIN queue q
            WHERE u.role = 'reviewer' AND u.active AND q.n > 0
           ON CONFLICT ON CONSTRAINT reviewer_digests_once_a_day DO NOTHING
           RETURNING user_id, queue_count, oldest_submitted_at
         )
         SELECT w.user_id, u.email, u.name, w.queue_count, w.oldest_submitted_at FROM written w JOIN users u ON u.id = w.user_id`,
        [digestDate, asOf],
      );
      if (rows.length) {
        const mails = rows.map((r) => {
          const waiting = waitingWords(new Date(r.oldest_submitted_at), asOf);
          const line = `${r.queue_count} document${r.queue_count === 1 ? "" : "s"} await verification; the oldest has waited ${waiting}.`;
          return {
            to_address: r.email,
            subject: `Verification queue: ${r.queue_count} waiting, oldest ${waiting}`,
            text_body: `Hello ${r.name},\n\n${line}\n\nOpen the queue: ${queueLink}\n\nClearbench`,
            html_body: `<p>Hello ${r.name.replace(/[<>&"]/g, "")},</p>\n<p>${line}</p>\n<p><a href="${queueLink}">Open the queue</a></p>\n<p>Clearbench</p>`,
          };
        });
        await runStatement(
          transaction,
          `INSERT INTO outbox_messages (to_address, subject, text_body, html_body)
           SELECT to_address, subject, text_body, html_body
             FROM jsonb_to_recordset($1::jsonb) AS m(to_address text, subject text, text_body text, html_body text)`,
          [JSON.stringify(mails)],
        );
      }
      const queueCount = rows[0]?.queue_count ?? 0;
      await finishJobRun(transaction, runId, { sent: rows.length, queueCount, digestDate });
      return { digestDate, queueCount, sent: rows.length };
    },
    (transaction) => {
      counter = countStatements(transaction);
    },
  );
  if (outcome.skipped) return { skipped: true };
  return { skipped: false, ...outcome.value, statements: counter.count + 2 };
}
