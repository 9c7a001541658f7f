import { QueryTypes, type Transaction } from "sequelize";
import { db } from "../db/sequelize.ts";
import { composeMail, enqueueMail } from "../mail/index.ts";
import { Notification } from "../notices/index.ts";

export interface TransferNews {
  kind:
    | "machine_transfer_started"
    | "machine_transfer_accepted"
    | "machine_transfer_declined"
    | "machine_transfer_withdrawn";
  title: string;
  paragraphs: string[];
  next: { sentence: string; label: string };
}

/**
 * A bell notice and an e-mail (HTML and text) for every active buyer of the shop, written in the caller's transaction,
 * so a transfer that rolls back tells no one.
 */
export async function tellShopBuyers(
  companyId: number,
  news: TransferNews,
  linkBase: string,
  transaction: Transaction,
) {
  const buyers = await db().query<{ id: number; email: string; name: string }>(
    "SELECT id, email, name FROM users WHERE company_id = $1 AND role = 'buyer' AND active ORDER BY id",
    { bind: [companyId], type: QueryTypes.SELECT, transaction },
  );
  const link = "/machine-transfers";
  for (const buyer of buyers) {
    await Notification.create(
      {
        userId: buyer.id,
        kind: news.kind,
        title: news.title,
        body: news.paragraphs.join("\n"),
        link,
        noticeId: null,
      },
      { transaction },
    );
    await enqueueMail(
      composeMail({
        to: buyer.email,
        subject: news.title,
        greetName: buyer.name,
        paragraphs: news.paragraphs,
        next: { ...news.next, url: `${linkBase}${link}` },
      }),
      transaction,
    );
  }
}

export const machineName = (m: { builder: string; model: string; serialNumber: string | null }) =>
  `${m.builder} ${m.model}${m.serialNumber ? `, serial ${m.serialNumber}` : ""}`;
