import { QueryTypes } from "sequelize";
import type { Standing } from "../../shared/standing/standing-types.ts";
import {
  ENGAGED_WORK_ORDER_STATUSES,
  technicianViewLevel,
  type TechnicianFacts,
  type TechnicianViewLevel,
} from "../../shared/visibility/technician-visibility.ts";
import { db } from "../db/sequelize.ts";
import type { SignedInUser } from "../http/policy.ts";

interface FactsRow {
  company_id: number;
  active: boolean;
  standing: Standing | null;
  engaged: boolean;
}

/** The facts the shared rule decides from, in one statement; undefined when no such technician exists. */
async function loadFacts(user: SignedInUser, technicianId: number) {
  const [row] = await db().query<FactsRow>(
    `SELECT t.company_id, t.active, b.standing,
            EXISTS (SELECT 1 FROM work_orders wo
                     WHERE wo.technician_id = t.id AND wo.shop_company_id = $2 AND wo.status = ANY($3::text[])) AS engaged
       FROM technicians t
       LEFT JOIN technician_standings b ON b.technician_id = t.id AND b.requirement_set_id IS NULL
      WHERE t.id = $1`,
    {
      bind: [technicianId, user.role === "buyer" ? user.companyId : 0, [...ENGAGED_WORK_ORDER_STATUSES]],
      type: QueryTypes.SELECT,
    },
  );
  return row;
}

/** What this caller may see of the technician, by the shared rule; a missing id is "none", like a hidden one. */
export async function viewLevelOf(user: SignedInUser, technicianId: number): Promise<TechnicianViewLevel> {
  if (!Number.isSafeInteger(technicianId) || technicianId <= 0) return "none";
  const row = await loadFacts(user, technicianId);
  if (!row) return "none";
  const technician: TechnicianFacts = { active: row.active, baseline: row.standing };
  return technicianViewLevel(
    {
      role: user.role,
      sameCompany: row.company_id === user.companyId,
      isSelf: user.technicianId !== null && user.technicianId === technicianId,
      engaged: row.engaged,
    },
    technician,
  );
}
