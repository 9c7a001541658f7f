import { QueryTypes } from "sequelize";
import {
  GATE_CHECK_LOG_LIMIT,
  type GateCheckLog,
  type GateCheckLogQuery,
  type GateCheckRecord,
} from "../../shared/gate/check-log.ts";
import { db } from "../db/sequelize.ts";
import { Company } from "../db/models.ts";

interface Row {
  id: number;
  technician_id: number;
  technician_name: string;
  company_name: string;
  site_id: number | null;
  site_name: string | null;
  shop_name: string | null;
  state: GateCheckRecord["state"];
  checked_at: Date;
}

/**
 * The checks a company may see: its own technicians' (service side) or those at its own sites (shop side). The scope
 * column is chosen by role and bound to the caller's company, so a filter naming another company's site or technician
 * finds nothing rather than their checks.
 */
export async function listGateChecks(user: Express.User, query: GateCheckLogQuery): Promise<GateCheckLog> {
  const isShop = user.role === "buyer";
  const scope = isShop ? "g.shop_company_id" : "g.service_company_id";
  const company = await Company.findByPk(user.companyId, { attributes: ["timeZone"] });
  const timeZone = query.timeZone ?? company?.timeZone ?? "UTC";
  const where = [`${scope} = :companyId`];
  // The day is read in the reader's zone by PostgreSQL's own copy of the IANA database, DST included.
  if (query.from) where.push("(g.checked_at AT TIME ZONE :timeZone)::date >= :from::date");
  if (query.to) where.push("(g.checked_at AT TIME ZONE :timeZone)::date <= :to::date");
  if (query.siteId) where.push("g.site_id = :siteId");
  if (query.technicianId) where.push("g.technician_id = :technicianId");
  const replacements = { ...query, companyId: user.companyId, timeZone, limit: GATE_CHECK_LOG_LIMIT + 1 };
  const rows = await db().query<Row>(
    `SELECT g.id, g.technician_id, t.name AS technician_name, c.name AS company_name,
            g.site_id, s.name AS site_name, shop.name AS shop_name, g.state, g.checked_at
       FROM gate_checks g
       JOIN technicians t ON t.id = g.technician_id
       JOIN companies c ON c.id = g.service_company_id
       LEFT JOIN sites s ON s.id = g.site_id
       LEFT JOIN companies shop ON shop.id = g.shop_company_id
      WHERE ${where.join(" AND ")}
      ORDER BY g.checked_at DESC, g.id DESC LIMIT :limit`,
    { replacements, type: QueryTypes.SELECT },
  );
  const [sites, technicians] = await Promise.all([
    db().query<{ id: number; name: string }>(
      isShop
        ? "SELECT id, name FROM sites WHERE company_id = :companyId ORDER BY name, id"
        : `SELECT DISTINCT s.id, s.name FROM gate_checks g JOIN sites s ON s.id = g.site_id
            WHERE g.service_company_id = :companyId ORDER BY s.name, s.id`,
      { replacements: { companyId: user.companyId }, type: QueryTypes.SELECT },
    ),
    db().query<{ id: number; name: string }>(
      isShop
        ? `SELECT DISTINCT t.id, t.name FROM gate_checks g JOIN technicians t ON t.id = g.technician_id
            WHERE g.shop_company_id = :companyId ORDER BY t.name, t.id`
        : "SELECT id, name FROM technicians WHERE company_id = :companyId ORDER BY name, id",
      { replacements: { companyId: user.companyId }, type: QueryTypes.SELECT },
    ),
  ]);
  return {
    timeZone,
    checks: rows.slice(0, GATE_CHECK_LOG_LIMIT).map((r) => ({
      id: r.id,
      technicianId: r.technician_id,
      technicianName: r.technician_name,
      companyName: r.company_name,
      siteId: r.site_id,
      siteName: r.site_name,
      shopName: r.shop_name,
      state: r.state,
      checkedAt: new Date(r.checked_at).toISOString(),
    })),
    sites,
    technicians,
    truncated: rows.length > GATE_CHECK_LOG_LIMIT,
  };
}
