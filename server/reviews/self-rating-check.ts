import { QueryTypes, type Transaction } from "sequelize";
import { selfRatingSignals, type PartyContacts } from "../../shared/reviews/self-rating.ts";
import type { SelfRatingSignal } from "../../shared/reviews/self-rating.ts";
import { db } from "../db/sequelize.ts";

interface ContactsRow {
  emails: string[];
  phones: (string | null)[];
  addresses: { line: string | null; postalCode: string | null }[];
}

// A company's sign-ins and its address; a shop adds its sites, a service company its technicians' own e-mail and phone.
const CONTACTS_SQL = `SELECT
    ARRAY(SELECT email FROM users WHERE company_id = $1)
      || ARRAY(SELECT email FROM technicians WHERE company_id = $1 AND email IS NOT NULL) AS emails,
    ARRAY(SELECT phone FROM technicians WHERE company_id = $1 AND phone IS NOT NULL)::text[] AS phones,
    (SELECT json_agg(json_build_object('line', a.line, 'postalCode', a.postal_code)) FROM (
       SELECT address_line AS line, postal_code FROM companies WHERE id = $1
       UNION ALL SELECT address_line, postal_code FROM sites WHERE company_id = $1) a) AS addresses`;

async function contactsOf(companyId: number, transaction: Transaction): Promise<PartyContacts> {
  const [row] = await db().query<ContactsRow>(CONTACTS_SQL, {
    bind: [companyId],
    transaction,
    type: QueryTypes.SELECT,
  });
  return { emails: row?.emails ?? [], phones: row?.phones ?? [], addresses: row?.addresses ?? [] };
}

/** What the shop and the service company have in common, read inside the review's own transaction. */
export async function findSelfRatingSignals(
  shopCompanyId: number,
  serviceCompanyId: number,
  transaction: Transaction,
): Promise<SelfRatingSignal[]> {
  const shop = await contactsOf(shopCompanyId, transaction);
  const service = await contactsOf(serviceCompanyId, transaction);
  return selfRatingSignals(shop, service);
}
