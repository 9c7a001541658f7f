import type { Transaction } from "sequelize";
import { Op } from "sequelize";
import type { WorkOrderSide } from "../../shared/work-orders/schemas.ts";
import { composeMail } from "../mail/index.ts";
import { tellPerson } from "../notices/index.ts";
import { User } from "../accounts/index.ts";
import type { WorkOrder } from "./model.ts";

/** The people of one side: the buyer who raised it, or the service company's admins and the technician. */
async function recipients(
  workOrder: WorkOrder,
  side: WorkOrderSide,
  transaction: Transaction,
): Promise<{ id: number; email: string }[]> {
  if (side === "shop") {
    const author = await User.findOne({ where: { id: workOrder.createdBy, active: true }, transaction });
    if (author) return [author];
    // The author has left: the shop's other buyers pick the work order up.
    return User.findAll({
      where: { companyId: workOrder.shopCompanyId, role: "buyer", active: true },
      transaction,
    });
  }
  return User.findAll({
    where: {
      companyId: workOrder.serviceCompanyId,
      active: true,
      [Op.or]: [{ role: "provider_admin" }, { role: "technician", technicianId: workOrder.technicianId }],
    },
    transaction,
  });
}

export interface WorkOrderNews {
  subject: string;
  lines: string[];
  /** What the reader should do now, in one sentence, and the words of the link that does it. */
  next: { sentence: string; label: string };
  /** Lines after the link, in small print (cautions). */
  after?: string[];
  /** The bell kind for news that changes the reader's plans ("work_order.cancelled"); other news rings as "work_order". */
  bell?: string;
}

/** Queues one e-mail per person of the other side, each also in that person's bell, in the caller's transaction. */
export async function mailOtherSide(
  workOrder: WorkOrder,
  to: WorkOrderSide,
  news: WorkOrderNews,
  link: string,
  transaction: Transaction,
) {
  const subject = `Work order #${workOrder.id}: ${news.subject}`;
  for (const address of await recipients(workOrder, to, transaction)) {
    await tellPerson(
      composeMail({
        to: address.email,
        subject,
        paragraphs: news.lines,
        next: { ...news.next, url: link },
        ...(news.after ? { after: news.after } : {}),
      }),
      { kind: news.bell ?? "work_order" },
      transaction,
    );
  }
}
