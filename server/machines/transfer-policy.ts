import { QueryTypes } from "sequelize";
import { requireOwnership, requireRole } from "../http/policy.ts";
import { db } from "../db/sequelize.ts";
import { hasOwnedMachine, isMachineOfShop } from "./ownership.ts";

async function transferParties(transferId: unknown) {
  const id = Number(transferId);
  if (!Number.isInteger(id) || id <= 0) return null;
  const [row] = await db().query<{ from: number; to: number }>(
    `SELECT from_company_id AS "from", to_company_id AS "to" FROM machine_transfers WHERE id = $1`,
    { bind: [id], type: QueryTypes.SELECT },
  );
  return row ?? null;
}

export const canListTransfers = requireRole("buyer");

/** Only the shop that has the machine now may hand it on. */
export const canTransferMachine = requireOwnership(
  requireRole("buyer"),
  "a machine at a site of the buyer's shop",
  (user, params) => isMachineOfShop(user.companyId, params.machineId),
);

/** The shop that has the machine, or once had it: a seller keeps a read-only view of its own period. */
export const canSeeMachineOwnership = requireOwnership(
  requireRole("buyer"),
  "a machine the buyer's shop owns or owned",
  (user, params) => hasOwnedMachine(user.companyId, params.machineId),
);

export const canSeeTransfer = requireOwnership(
  requireRole("buyer"),
  "a transfer from or to the buyer's shop",
  async (user, params) => {
    const p = await transferParties(params.transferId);
    return p !== null && (p.from === user.companyId || p.to === user.companyId);
  },
);

export const canAnswerTransfer = requireOwnership(
  requireRole("buyer"),
  "a transfer to the buyer's shop",
  async (user, params) => (await transferParties(params.transferId))?.to === user.companyId,
);

export const canWithdrawTransfer = requireOwnership(
  requireRole("buyer"),
  "a transfer from the buyer's shop",
  async (user, params) => (await transferParties(params.transferId))?.from === user.companyId,
);
