import { randomBytes } from "node:crypto";
import { QueryTypes } from "sequelize";
import { BROKER_LINK_DAYS, BROKER_REMINDER_DAYS } from "../../shared/credentials/broker-schemas.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import { enqueueMail } from "../mail/index.ts";
import { CredentialType } from "./model.ts";
import { BrokerUploadRequest } from "./broker-model.ts";
import { brokerReminderMail } from "./broker-emails.ts";
import { brokerLinkUrl, digestOf, formatDay } from "./broker-requests.ts";
import { Company } from "../db/models.ts";

const DAY_MS = 24 * 60 * 60 * 1000;

/** The threshold most recently crossed: a run that missed the 30-day mark sends the 14-day one, not both. */
export function thresholdFor(daysLeft: number): number | undefined {
  return [...BROKER_REMINDER_DAYS].sort((a, b) => a - b).find((t) => daysLeft <= t);
}

export interface BrokerReminderReport {
  reminded: number;
}

/**
 * Reminds the broker of a coverage's latest request when the coverage lapses within a threshold and nothing arrived.
 * Each reminder is claimed by the unique (request, threshold) row, so runs that overlap or repeat send it once. The
 * link's token is only ever in an e-mail, so a reminder carries a fresh one (the earlier link stops working) and keeps
 * the link open for at least another period.
 */
export async function remindBrokers(asOf: Date, linkBase: string): Promise<BrokerReminderReport> {
  const due = await db().query<{ id: number; lapses_at: Date }>(
    // Only the latest request for a coverage is chased, even when its link already ran out: the reminder renews it.
    `SELECT r.id, r.lapses_at FROM (
       SELECT DISTINCT ON (r.credential_id) r.id, r.used_at, c.lapses_at
         FROM broker_upload_requests r
         JOIN credentials c ON c.id = r.credential_id
        WHERE r.created_at <= :asOf
        ORDER BY r.credential_id, r.id DESC) r
      WHERE r.used_at IS NULL AND r.lapses_at > :asOf AND r.lapses_at <= :horizon`,
    {
      type: QueryTypes.SELECT,
      replacements: { asOf, horizon: new Date(asOf.getTime() + Math.max(...BROKER_REMINDER_DAYS) * DAY_MS) },
    },
  );
  let reminded = 0;
  for (const row of due) {
    const lapsesAt = new Date(row.lapses_at);
    const threshold = thresholdFor(Math.ceil((lapsesAt.getTime() - asOf.getTime()) / DAY_MS));
    if (threshold === undefined) continue;
    const sent = await db().transaction(async (transaction) => {
      const [claimed] = await db().query<{ id: number }>(
        `INSERT INTO broker_request_reminders (request_id, days_before) VALUES (:id, :threshold)
         ON CONFLICT (request_id, days_before) DO NOTHING RETURNING id`,
        { type: QueryTypes.SELECT, replacements: { id: row.id, threshold }, transaction },
      );
      if (!claimed) return false;
      const request = await BrokerUploadRequest.findByPk(row.id, {
        transaction,
        lock: transaction.LOCK.UPDATE,
      });
      if (!request || request.usedAt) return false;
      const token = randomBytes(32).toString("base64url");
      const expiresAt = new Date(
        Math.max(request.expiresAt.getTime(), asOf.getTime() + BROKER_LINK_DAYS * DAY_MS),
      );
      await request.update({ tokenSha256: digestOf(token), expiresAt }, { transaction });
      // In turn: the transaction's one connection runs one statement at a time.
      const company = await Company.findByPk(request.companyId, { transaction });
      const type = await CredentialType.findByPk(request.typeCode, { transaction });
      const shop = request.shopCompanyId
        ? await Company.findByPk(request.shopCompanyId, { transaction })
        : null;
      await enqueueMail(
        brokerReminderMail({
          to: request.brokerEmail,
          contactName: request.contactName,
          companyName: company!.name,
          coverageName: type!.name,
          certificateHolder: shop?.name ?? null,
          holderRole: request.holderRole,
          expiresAt: formatDay(expiresAt, company!.timeZone),
          lapsesOn: formatDay(lapsesAt, company!.timeZone),
          link: brokerLinkUrl(linkBase, token),
        }),
        transaction,
      );
      // On the coverage's own trail, so the office sees on its timeline that the broker was chased.
      await recordAudit(
        {
          actorUserId: null,
          action: "broker_request.reminded",
          subjectType: "credential",
          subjectId: request.credentialId!,
          after: { requestId: request.id, daysBefore: threshold, brokerEmail: request.brokerEmail },
        },
        transaction,
      );
      return true;
    });
    if (sent) reminded += 1;
  }
  return { reminded };
}
