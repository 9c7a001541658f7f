import { QueryTypes } from "sequelize";
import { requireOwnership, requireRole } from "../http/policy.ts";
import { db } from "../db/sequelize.ts";
import { isMachineOfShop } from "./ownership.ts";

// Photos move with the machine, so only the shop that has it now reaches them; a seller's or a stranger's id is a 404.
export const canManageMachinePhotos = requireOwnership(
  requireRole("buyer"),
  "a machine at a site of the buyer's shop",
  (user, params) => isMachineOfShop(user.companyId, params.machineId),
);

export const canOpenMachinePhoto = requireOwnership(
  requireRole("buyer"),
  "a photo of a machine at a site of the buyer's shop",
  async (user, params) => {
    if (!(await isMachineOfShop(user.companyId, params.machineId))) return false;
    const [row] = await db().query("SELECT 1 FROM machine_photos WHERE id = $1 AND equipment_id = $2", {
      bind: [Number(params.photoId), Number(params.machineId)],
      type: QueryTypes.SELECT,
    });
    return row !== undefined;
  },
);
