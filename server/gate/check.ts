import { Op } from "sequelize";
import { Company } from "../companies/model.ts";
import { RequirementSet } from "../standing/model.ts";
import { readTechnicianStanding } from "../standing/technician-standing.ts";
import { Site } from "../sites/model.ts";
import { Technician } from "../technicians/model.ts";
import { WorkOrder } from "../work-orders/model.ts";
import { checkBadgeToken, siteFromGateCode } from "./token.ts";

export interface GateCheckDto {
  state: "cleared" | "not_cleared" | "expired" | "invalid";
  checkedAt: string;
  technician?: { name: string; company: string };
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
    ? await Site.findByPk(siteId, { attributes: ["id", "name", "companyId", "active"] })
    : null;
  const set = site
    ? await RequirementSet.findOne({ where: { siteId: site.id, active: true }, attributes: ["id"] })
    : null;
  const standing = await readTechnicianStanding(technician.id);
  const chosen =
    (set ? standing.requirementSets.find((s) => s.requirementSetId === set.id) : undefined) ??
    standing.baseline;
  const workOrder = site ? await todaysWorkOrder(technician.id, site.id, site.companyId) : null;
  return {
    state: chosen?.standing === "cleared" || chosen?.standing === "lapsing" ? "cleared" : "not_cleared",
    checkedAt,
    technician: { name: technician.name, company: company?.name ?? "" },
    site: site ? { name: site.name } : null,
    against: chosen?.name ?? "Platform baseline",
    lines: (chosen?.results ?? []).map((r) => ({ requirement: r.requirement.label, status: r.status })),
    workOrder,
  };
}

async function todaysWorkOrder(technicianId: number, siteId: number, shopCompanyId: number) {
  const order = await WorkOrder.findOne({
    where: { technicianId, siteId, shopCompanyId, status: { [Op.in]: ["accepted"] } },
    attributes: ["id", "technology"],
    order: [["acceptedAt", "DESC"]],
  });
  return order ? { id: order.id, technology: order.technology } : null;
}
