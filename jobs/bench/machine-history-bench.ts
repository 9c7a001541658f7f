import pg from "pg";

/** The machine of the signed-in buyer's shop with the most confirmed work orders, for the history page scenario. */
export async function busiestMachine(
  url: string,
  buyerEmail: string,
): Promise<{ id: number; confirmed: number }> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const { rows } = await client.query<{ id: number; confirmed: number }>(
      `SELECT o.equipment_id AS id, count(w.id)::int AS confirmed
         FROM users u
         JOIN machine_ownerships o ON o.company_id = u.company_id AND o.to_at IS NULL
         LEFT JOIN work_orders w ON w.equipment_id = o.equipment_id AND w.status = 'confirmed'
        WHERE u.email = $1
        GROUP BY o.equipment_id ORDER BY confirmed DESC, o.equipment_id LIMIT 1`,
      [buyerEmail],
    );
    if (!rows[0]) throw new Error(`no machine held by the shop of ${buyerEmail}`);
    return rows[0];
  } finally {
    await client.end();
  }
}
