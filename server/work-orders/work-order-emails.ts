import type { Transaction } from "sequelize";
import { Op } from "sequelize";
import type { WorkOrderSide } from "../../shared/work-orders/schemas.ts";
import { enqueueMail, type MailDraft } from "../mail/index.ts";
import { User } from "../accounts/index.ts";
import type { WorkOrder } from "./model.ts";

const escapeHtml = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c] ?? c,
  );

/** The people of one side: the buyer who raised it, or the service company's admins and the technician. */
async function recipients(
  workOrder: WorkOrder,
  side: WorkOrderSide,
  transaction: Transaction,
): Promise<string[]> {
  if (side === "shop") {
    const author = await User.findOne({ where: { id: workOrder.createdBy, active: true }, transaction });
    if (author) return [author.email];
    // The author has left: the shop's other buyers pick the work order up.
    const buyers = await User.findAll({
      where: { companyId: workOrder.shopCompanyId, role: "buyer", active: true },
      transaction,
    });
    return buyers.map((u) => u.email);
  }
  const users = await User.findAll({
    where: {
      companyId: workOrder.serviceCompanyId,
      active: true,
      [Op.or]: [{ role: "provider_admin" }, { role: "technician", technicianId: workOrder.technicianId }],
    },
    transaction,
  });
  return users.map((u) => u.email);
}

export interface WorkOrderNews {
  subject: string;
  lines: string[];
}

/** Queues one e-mail per person of the other side, in the caller's transaction. */
export async function mailOtherSide(
  workOrder: WorkOrder,
  to: WorkOrderSide,
  news: WorkOrderNews,
  link: string,
  transaction: Transaction,
) {
  const subject = `Work order #${workOrder.id}: ${news.subject}`;
  for (const address of await recipients(workOrder, to, transaction)) {
    const draft: MailDraft = {
      to: address,
      subject,
      text: `${news.lines.join("\n\n")}\n\nOpen the work order: ${link}\n\nClearbench`,
      html: `${news.lines.map((l) => `<p>${escapeHtml(l)}</p>`).join("")}<p><a href="${escapeHtml(link)}">Open the work order</a></p>`,
    };
    await enqueueMail(draft, transaction);
  }
}
