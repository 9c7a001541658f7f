import type { Transaction } from "sequelize";
import { OutboxMessage } from "./model.ts";
import type { Mailer } from "./mailer.ts";
import { db } from "../db/sequelize.ts";
import { log } from "../log.ts";

export interface MailDraft {
  to: string;
  subject: string;
  text: string;
  html?: string;
  /** What happened in a sentence or two, and the mail's one link: what the bell shows of it (server/notices/tell-person.ts). */
  summary?: string;
  link?: string;
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

/** How long a claimed message stays out of other senders' reach; a sender that dies mid-send frees it after this. */
export const CLAIM_LEASE_MS = 2 * 60_000;

/**
 * The Message-ID of an outbox row: the same on every attempt, so a message sent again after a crash between the send
 * and its mark is recognisable as the same message by the recipient's mail system and by anyone reading the headers.
 */
export function outboxMessageId(message: { id: number; createdAt: Date }, from: string): string {
  const domain = /@([^>\s]+)>?\s*$/.exec(from)?.[1] ?? "clearbench.invalid";
  return `<outbox.${message.id}.${message.createdAt.getTime()}@${domain}>`;
}

/**
 * Claims the oldest due message for this sender alone, in its own statement: the claim pushes `next_attempt_at` one
 * lease ahead and counts the attempt, so no other sender takes it while it is being sent, and a sender that crashes
 * leaves it due again once the lease runs out.
 */
async function claimNextDue(now: Date): Promise<OutboxMessage | null> {
  const [rows] = await db().query(
    `UPDATE outbox_messages SET next_attempt_at = :leaseUntil, attempts = attempts + 1
      WHERE id = (
        SELECT id FROM outbox_messages
         WHERE status = 'pending' AND next_attempt_at <= :now
         ORDER BY id
         LIMIT 1
         FOR UPDATE SKIP LOCKED)
      RETURNING id`,
    { replacements: { now, leaseUntil: new Date(now.getTime() + CLAIM_LEASE_MS) } },
  );
  const claimed = (rows as { id: number }[])[0];
  return claimed ? OutboxMessage.findByPk(claimed.id) : null;
}

export interface DeliveryHooks {
  /** Runs between a message's send and its mark; tests throw here to stand in for a crash. */
  afterSend?: (message: OutboxMessage) => void | Promise<void>;
}

/**
 * Sends up to `batch` due messages, each claimed, sent and marked on its own: no transaction is held across SMTP, so a
 * crash can send again at most the one message whose mark it interrupted, and that one with its Message-ID unchanged.
 * A failure keeps the row with a later attempt time, so nothing is lost while SMTP is down.
 */
export async function deliverDueMail(
  mailer: Mailer,
  from: string,
  now = new Date(),
  batch = 50,
  hooks: DeliveryHooks = {},
): Promise<DeliveryReport> {
  const report: DeliveryReport = { sent: 0, retried: 0, failed: 0 };
  for (let i = 0; i < batch; i += 1) {
    const message = await claimNextDue(now);
    if (!message) break;
    try {
      await mailer.send({
        from,
        to: message.toAddress,
        subject: message.subject,
        text: message.textBody,
        html: message.htmlBody,
        messageId: outboxMessageId(message, from),
      });
    } catch (err) {
      const failed = message.attempts >= MAX_ATTEMPTS;
      await message.update({
        status: failed ? "failed" : "pending",
        lastError: err instanceof Error ? err.message.slice(0, 500) : String(err),
        nextAttemptAt: new Date(now.getTime() + nextBackoffMs(message.attempts)),
      });
      if (failed) report.failed += 1;
      else report.retried += 1;
      log.warn({ outboxId: message.id, attempts: message.attempts }, "mail delivery failed; will retry");
      continue;
    }
    await hooks.afterSend?.(message);
    await message.update({ status: "sent", sentAt: new Date(), lastError: null });
    report.sent += 1;
  }
  return report;
}

/** Asks the running server to deliver now instead of at its next round (no-op in tests without a sender). */
export function kickOutbox(locals: Record<string, unknown>): void {
  const kick = locals.kickOutbox;
  if (typeof kick === "function") kick();
}
