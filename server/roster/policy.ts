import { QueryTypes } from "sequelize";
import { db } from "../db/sequelize.ts";
import { requireOwnership, requireRole } from "../http/policy.ts";

export const canKeepRoster = requireRole("buyer");

export const canRemoveRosterEntry = requireOwnership(
  requireRole("buyer"),
  "an entry of the buyer's shop",
  async (user, params) => {
    const rows = await db().query<{ id: number }>(
      "SELECT id FROM roster_entries WHERE id = $1 AND shop_company_id = $2",
      {
        bind: [Number(params.entryId), user.companyId],
        type: QueryTypes.SELECT,
      },
    );
    return rows.length > 0;
  },
);
