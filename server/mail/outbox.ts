import { Op, type Transaction } from "sequelize";
import { OutboxMessage } from "./model.ts";
import type { Mailer } from "./mailer.ts";
import { db } from "../db/sequelize.ts";
import { log } from "../log.ts";

export interface MailDraft {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

/** Queues a message in the caller's transaction: if the use case rolls back, no mail goes out. */
export async function enqueueMail(draft: MailDraft, transaction?: Transaction): Promise<void> {
  await OutboxMessage.create(
    { toAddress: draft.to, subject: draft.subject, textBody: draft.text, htmlBody: draft.html ?? null },
    { transaction },
  );
}

const MAX_ATTEMPTS = 8;
const BASE_BACKOFF_MS = 30_000;
const MAX_BACKOFF_MS = 60 * 60_000;

export function nextBackoffMs(attempts: number): number {
  return Math.min(BASE_BACKOFF_MS * 2 ** Math.max(0, attempts - 1), MAX_BACKOFF_MS);
}

export interface DeliveryReport {
  sent: number;
  retried: number;
  failed: number;
}

/**
 * Sends every due message. Rows are claimed with SKIP LOCKED so two server instances never send the
 * same row; a failure keeps the row with a later attempt time, so nothing is lost while SMTP is down.
 */
export async function deliverDueMail(
  mailer: Mailer,
  from: string,
  now = new Date(),
  batch = 50,
): Promise<DeliveryReport> {
  const report: DeliveryReport = { sent: 0, retried: 0, failed: 0 };
  await db().transaction(async (transaction) => {
    const due = await OutboxMessage.findAll({
      where: { status: "pending", nextAttemptAt: { [Op.lte]: now } },
      order: [["id", "ASC"]],
      limit: batch,
      lock: transaction.LOCK.UPDATE,
      skipLocked: true,
      transaction,
    });
    for (const message of due) {
      try {
        await mailer.send({
          from,
          to: message.toAddress,
          subject: message.subject,
          text: message.textBody,
          html: message.htmlBody,
        });
        await message.update(
          { status: "sent", sentAt: new Date(), attempts: message.attempts + 1, lastError: null },
          { transaction },
        );
        report.sent += 1;
      } catch (err) {
        const attempts = message.attempts + 1;
        const failed = attempts >= MAX_ATTEMPTS;
        await message.update(
          {
            attempts,
            status: failed ? "failed" : "pending",
            lastError: err instanceof Error ? err.message.slice(0, 500) : String(err),
            nextAttemptAt: new Date(now.getTime() + nextBackoffMs(attempts)),
          },
          { transaction },
        );
        if (failed) report.failed += 1;
        else report.retried += 1;
        log.warn({ outboxId: message.id, attempts }, "mail delivery failed; will retry");
      }
    }
  });
  return report;
}

/** Asks the running server to deliver now instead of at its next round (no-op in tests without a sender). */
export function kickOutbox(locals: Record<string, unknown>): void {
  const kick = locals.kickOutbox;
  if (typeof kick === "function") kick();
}
