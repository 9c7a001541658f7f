import type { Transaction } from "sequelize";
import { tellPerson } from "../notices/index.ts";
import { select } from "./sql.ts";

export interface News {
  kind: string;
  title: string;
  lines: string[];
  link: string;
}

const escapeHtml = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c] ?? c,
  );

async function tell(users: { id: number; email: string }[], news: News, transaction: Transaction) {
  for (const user of users) {
    await tellPerson(
      {
        to: user.email,
        subject: news.title,
        text: `${news.lines.join("\n\n")}\n\nOpen it: ${news.link}\n\nClearbench`,
        html: `${news.lines.map((l) => `<p>${escapeHtml(l)}</p>`).join("")}<p><a href="${escapeHtml(news.link)}">Open it</a></p>`,
      },
      { kind: news.kind, body: news.lines.join("\n"), link: news.link },
      transaction,
    );
  }
}

/** In-app notification and an e-mail (queued in the caller's transaction) for each active office admin of a company. */
export async function tellCompany(companyId: number, news: News, transaction: Transaction) {
  const users = await select<{ id: number; email: string }>(
    "SELECT id, email FROM users WHERE company_id = $1 AND role = 'provider_admin' AND active ORDER BY id",
    [companyId],
    transaction,
  );
  await tell(users, news, transaction);
}

/** The buyer who raised the request; when that person has left, the shop's other buyers. */
export async function tellShop(
  request: { shop_company_id: number; created_by: number },
  news: News,
  transaction: Transaction,
) {
  let users = await select<{ id: number; email: string }>(
    "SELECT id, email FROM users WHERE id = $1 AND active",
    [request.created_by],
    transaction,
  );
  if (users.length === 0) {
    users = await select<{ id: number; email: string }>(
      "SELECT id, email FROM users WHERE company_id = $1 AND role = 'buyer' AND active ORDER BY id",
      [request.shop_company_id],
      transaction,
    );
  }
  await tell(users, news, transaction);
}
