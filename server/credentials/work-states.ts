import { QueryTypes } from "sequelize";
import { db } from "../db/sequelize.ts";
import { lookupPostalCode } from "../geo/index.ts";

// Enough sites to show a reviewer where the company works without listing a national account's every plant.
const MAX_SITES = 20;

/** Where a service company works: its own mailing address and the sites of its work orders, each with its state. */
export async function workStatesOf(companyId: number): Promise<{ state: string; where: string }[]> {
  const rows = await db().query<{ name: string; postal_code: string | null; own: boolean }>(
    `SELECT name, postal_code, true AS own FROM companies WHERE id = $1
     UNION ALL
     SELECT * FROM (SELECT DISTINCT s.name, s.postal_code, false AS own FROM work_orders w JOIN sites s ON s.id = w.site_id
                     WHERE w.service_company_id = $1 ORDER BY s.name LIMIT ${MAX_SITES}) sites`,
    { bind: [companyId], type: QueryTypes.SELECT },
  );
  return rows.flatMap((row) => {
    const place = row.postal_code ? lookupPostalCode(row.postal_code) : undefined;
    if (!place) return [];
    return [{ state: place.state, where: row.own ? "the company's address" : `site ${row.name}` }];
  });
}
