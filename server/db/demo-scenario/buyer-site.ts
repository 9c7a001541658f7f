import { QueryTypes, type Transaction } from "sequelize";
import { db } from "../sequelize.ts";

/**
 * The Marlow buyer's own plant, one machine on it and the plant's requirement set, so the first directory search
 * from that site is already judged by the shop's rules rather than the platform baseline alone.
 */
export async function insertDemoBuyerSite(transaction: Transaction): Promise<void> {
  const q = async (sql: string, bind: unknown[]) => {
    const [row] = await db().query<{ id: number }>(sql, { bind, transaction, type: QueryTypes.SELECT });
    if (!row) throw new Error(`demo buyer site: nothing for ${sql.slice(0, 60)}`);
    return row.id;
  };
  const shopId = await q(`SELECT id FROM companies WHERE name = 'Marlow Precision Components'`, []);
  const siteId = await q(
    `INSERT INTO sites (company_id, name, address_line, postal_code, time_zone, latitude, longitude)
     VALUES ($1, 'Marlow Quarry Bend plant', '3100 Quarry Bend Road', '61101', 'America/Chicago', 42.2711, -89.094)
     RETURNING id`,
    [shopId],
  );
  await q(
    `INSERT INTO equipment (site_id, builder, control_family, technology, model, serial_number)
     VALUES ($1, 'Vantor Machine Works', 'Kestle 40', 'mill', 'VM-40 vertical mill', 'VM40-3117') RETURNING id`,
    [siteId],
  );
  // Lockout/tagout training because servicing a machine means isolating its energy (29 CFR 1910.147).
  const requirements = [
    {
      label: "General liability $1M each occurrence",
      typeCodes: ["general_liability"],
      minLimits: { eachOccurrence: 1_000_000 },
    },
    { label: "Lockout/tagout training", typeCodes: ["lockout_tagout"] },
  ];
  await q(
    `INSERT INTO requirement_sets (company_id, site_id, name, requirements)
     VALUES ($1, $2, 'Quarry Bend plant rules', $3::jsonb) RETURNING id`,
    [shopId, siteId, JSON.stringify(requirements)],
  );
}
