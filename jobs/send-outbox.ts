import { deliverDueMail, type Mailer } from "../server/mail/index.ts";

export interface SendOutboxDeps {
  mailer: Mailer;
  from: string;
  /** Rounds of `deliverDueMail` (50 messages each) before giving the rest to the next run. */
  maxRounds?: number;
}

export interface SendOutboxReport {
  sent: number;
  retried: number;
  failed: number;
}

/**
 * Delivers every outbox message due at `asOf`. Each round claims rows with SKIP LOCKED, so parallel senders never send
 * one row twice; a failed send keeps its row for a later attempt with backoff, so nothing is lost while SMTP is down.
 */
export async function runSendOutbox(
  { asOf }: { asOf: Date },
  deps: SendOutboxDeps,
): Promise<SendOutboxReport> {
  const total: SendOutboxReport = { sent: 0, retried: 0, failed: 0 };
  for (let round = 0; round < (deps.maxRounds ?? 200); round += 1) {
    const report = await deliverDueMail(deps.mailer, deps.from, asOf);
    total.sent += report.sent;
    total.retried += report.retried;
    total.failed += report.failed;
    // A round that sent nothing means the rest is failing or not yet due: stop rather than spin.
    if (report.sent === 0) break;
  }
  return total;
}
