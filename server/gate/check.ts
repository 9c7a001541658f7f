import { QueryTypes } from "sequelize";
import { calendarDateIn } from "../../shared/dates/local-time.ts";
import { db } from "../db/sequelize.ts";
import { readTechnicianStanding } from "../standing/technician-standing.ts";
import { technicianPhotoDataUrl } from "./photo.ts";
import { checkBadgeToken, siteFromGateCode } from "./token.ts";
import { Company, RequirementSet, Site, Technician } from "../db/models.ts";

export interface GateCheckDto {
  state: "cleared" | "not_cleared" | "expired" | "invalid";
  checkedAt: string;
  technician?: { name: string; company: string; photo?: string };
  site?: { name: string } | null;
  against?: string;
  lines?: { requirement: string; status: string }[];
  workOrder?: { id: number; technology: string } | null;
}

/**
 * What the front desk sees for a scanned badge: who, for which company, and whether cleared at this instant against the
 * site's requirement set (or the platform baseline). Nothing else about the technician, the company or other shops.
 */
export async function checkAtGate(
  secret: string,
  token: string,
  siteCode: string | undefined,
): Promise<GateCheckDto> {
  const now = new Date();
  const checkedAt = now.toISOString();
  const verdict = checkBadgeToken(secret, token, now);
  if (verdict.state !== "valid") return { state: verdict.state, checkedAt };
  const technician = await Technician.findByPk(verdict.technicianId, {
    attributes: ["id", "name", "companyId"],
  });
  if (!technician) return { state: "invalid", checkedAt };
  const company = await Company.findByPk(technician.companyId, { attributes: ["name"] });
  const siteId = siteCode ? siteFromGateCode(secret, siteCode) : null;
  const site = siteId
    ? await Site.findByPk(siteId, { attributes: ["id", "name", "companyId", "active", "timeZone"] })
    : null;
  const set = site
    ? await RequirementSet.findOne({ where: { siteId: site.id, active: true }, attributes: ["id"] })
    : null;
  const standing = await readTechnicianStanding(technician.id);
  const chosen =
    (set ? standing.requirementSets.find((s) => s.requirementSetId === set.id) : undefined) ??
    standing.baseline;
  const workOrder = site ? await todaysWorkOrder(technician.id, site, now) : null;
  const photo = await technicianPhotoDataUrl(technician.id);
  const state = chosen?.standing === "cleared" || chosen?.standing === "lapsing" ? "cleared" : "not_cleared";
  await db().query(
    `INSERT INTO gate_checks (technician_id, service_company_id, site_id, shop_company_id, state, checked_at)
     VALUES ($1, $2, $3, $4, $5, $6)`,
    { bind: [technician.id, technician.companyId, site?.id ?? null, site?.companyId ?? null, state, now] },
  );
  return {
    state,
    checkedAt,
    technician: { name: technician.name, company: company?.name ?? "", ...(photo ? { photo } : {}) },
    site: site ? { name: site.name } : null,
    against: chosen?.name ?? "Platform baseline",
    lines: (chosen?.results ?? []).map((r) => ({ requirement: r.requirement.label, status: r.status })),
    workOrder,
  };
}

/**
 * The accepted order that has this site's today among its dates. "Today" is the site's calendar date, so a check at
 * 7 a.m. in Chicago is not matched against the date already begun in UTC; an order for another day is not expected.
 */
async function todaysWorkOrder(technicianId: number, site: Site, now: Date) {
  const today = calendarDateIn(now, site.timeZone);
  const [order] = await db().query<{ id: number; technology: string }>(
    `SELECT id, technology FROM work_orders
      WHERE technician_id = $1 AND site_id = $2 AND shop_company_id = $3 AND status = 'accepted'
        AND preferred_dates @> jsonb_build_array($4::text)
      ORDER BY accepted_at DESC, id DESC LIMIT 1`,
    { bind: [technicianId, site.id, site.companyId, today], type: QueryTypes.SELECT },
  );
  return order ? { id: order.id, technology: order.technology } : null;
}
