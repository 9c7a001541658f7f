import { QueryTypes, type Transaction } from "sequelize";
import {
  transferTransitions,
  type AcceptTransfer,
  type TransferAction,
  type TransferState,
} from "../../shared/machines/transfers.ts";
import { db } from "../db/sequelize.ts";
import { AppError, notFound } from "../http/app-error.ts";
import { recordAudit } from "../audit/index.ts";
import { handOver } from "./ownership.ts";
import { findTransferRow, toTransferDto, type TransferRow } from "./transfer-read.ts";
import { machineName, tellShopBuyers } from "./transfer-notify.ts";
import { transferMachineSchema } from "../../shared/machines/transfers.ts";

const doneAlready: Record<TransferState, string> = {
  open: "",
  accepted: "This transfer was already accepted",
  declined: "This transfer was already declined",
  withdrawn: "This transfer was withdrawn by the seller",
};

/** Locks the transfer and checks the caller's side may take the action from its present state (409 otherwise). */
async function lockForAction(
  actor: Express.User,
  transferId: number,
  action: TransferAction,
  transaction: Transaction,
): Promise<TransferRow> {
  await db().query("SELECT id FROM machine_transfers WHERE id = $1 FOR UPDATE", {
    bind: [transferId],
    transaction,
  });
  const row = await findTransferRow(transferId, transaction);
  const rule = transferTransitions[action];
  const sideCompany = rule.by === "seller" ? row?.fromCompanyId : row?.toCompanyId;
  if (!row || sideCompany !== actor.companyId) throw notFound("That transfer");
  if (row.state !== rule.from) throw new AppError("conflict", doneAlready[row.state]);
  return row;
}

async function markDecided(
  actor: Express.User,
  row: TransferRow,
  action: TransferAction,
  extra: { declineReason?: string | null; toSiteId?: number; snapshot?: unknown; at?: Date },
  transaction: Transaction,
) {
  const to = transferTransitions[action].to;
  await db().query(
    `UPDATE machine_transfers SET state = $2, decided_by = $3, decided_at = $7, updated_at = $7,
            decline_reason = COALESCE($4, decline_reason), to_site_id = COALESCE($5, to_site_id),
            machine_snapshot = COALESCE($6::jsonb, machine_snapshot)
      WHERE id = $1`,
    {
      bind: [
        row.id,
        to,
        actor.id,
        extra.declineReason ?? null,
        extra.toSiteId ?? null,
        extra.snapshot === undefined ? null : JSON.stringify(extra.snapshot),
        // The same instant as the ownership hand-over, so a history entry falls on exactly one side of it.
        extra.at ?? new Date(),
      ],
      transaction,
    },
  );
  await recordAudit(
    {
      actorUserId: actor.id,
      action: `machine_transfer.${to}`,
      subjectType: "machine_transfer",
      subjectId: row.id,
      before: { state: row.state },
      after: { state: to, ...(extra.toSiteId ? { toSiteId: extra.toSiteId } : {}) },
    },
    transaction,
  );
}

interface MachineNow {
  companyId: number;
  siteName: string;
  building: string | null;
  bay: string | null;
  notes: string | null;
  state: string;
}

/**
 * The receiving shop takes the machine over: it moves to the chosen site with its photos, the seller's period ends and
 * the receiver's begins at the same instant, and the seller's own notes and location stay in the seller's copy.
 */
export async function acceptTransfer(
  actor: Express.User,
  transferId: number,
  input: AcceptTransfer,
  linkBase: string,
) {
  await db().transaction(async (transaction) => {
    const row = await lockForAction(actor, transferId, "accept", transaction);
    const [site] = await db().query<{ id: number }>(
      "SELECT id FROM sites WHERE id = $1 AND company_id = $2 AND active",
      { bind: [input.siteId, actor.companyId], type: QueryTypes.SELECT, transaction },
    );
    if (!site)
      throw new AppError("invalid_input", "Choose one of your own sites for the machine", [
        { path: "body.siteId", message: "not an active site of your shop" },
      ]);
    const [machine] = await db().query<MachineNow>(
      `SELECT s.company_id AS "companyId", s.name AS "siteName", e.building, e.bay, e.notes, e.state
         FROM equipment e JOIN sites s ON s.id = e.site_id WHERE e.id = $1 FOR UPDATE OF e`,
      { bind: [row.machineId], type: QueryTypes.SELECT, transaction },
    );
    if (!machine || machine.companyId !== row.fromCompanyId)
      throw new AppError("conflict", "The seller no longer holds this machine");
    const now = new Date();
    await db().query(
      `UPDATE equipment SET site_id = $2, building = $3, bay = $4, notes = NULL,
              state = CASE WHEN state = 'sold' THEN 'running' ELSE state END, updated_at = $5
        WHERE id = $1`,
      { bind: [row.machineId, site.id, input.building ?? null, input.bay ?? null, now], transaction },
    );
    await handOver(row.machineId, actor.companyId, now, transaction);
    const { companyId: _c, ...sellerRecord } = machine;
    await markDecided(
      actor,
      row,
      "accept",
      { toSiteId: site.id, snapshot: { ...row.machineSnapshot, sellerRecord }, at: now },
      transaction,
    );
    await recordAudit(
      {
        actorUserId: actor.id,
        action: "equipment.transferred",
        subjectType: "equipment",
        subjectId: row.machineId,
        before: { companyId: row.fromCompanyId, ...sellerRecord },
        after: { companyId: actor.companyId, siteId: site.id, transferId: row.id },
      },
      transaction,
    );
    await tellShopBuyers(
      row.fromCompanyId,
      {
        kind: "machine_transfer_accepted",
        title: `${row.toShopName} accepted the machine transfer`,
        paragraphs: [
          `${row.toShopName} accepted the transfer of ${machineName(transferMachineSchema.parse(row.machineSnapshot?.machine))}. The machine is now theirs.`,
          "You keep a read-only copy of its history up to today.",
        ],
        next: { sentence: "See the transfer on the transfers page.", label: "Open machine transfers" },
      },
      linkBase,
      transaction,
    );
  });
  return toTransferDto((await findTransferRow(transferId))!, actor.companyId);
}

export async function declineTransfer(
  actor: Express.User,
  transferId: number,
  reason: string | undefined,
  linkBase: string,
) {
  await db().transaction(async (transaction) => {
    const row = await lockForAction(actor, transferId, "decline", transaction);
    await markDecided(actor, row, "decline", { declineReason: reason || null }, transaction);
    await tellShopBuyers(
      row.fromCompanyId,
      {
        kind: "machine_transfer_declined",
        title: `${row.toShopName} declined the machine transfer`,
        paragraphs: [
          `${row.toShopName} declined the transfer of ${machineName(transferMachineSchema.parse(row.machineSnapshot?.machine))}. The machine stays with you.`,
          ...(reason ? [`Their reason: ${reason}`] : []),
        ],
        next: { sentence: "You can start a new transfer from the machine.", label: "Open machine transfers" },
      },
      linkBase,
      transaction,
    );
  });
  return toTransferDto((await findTransferRow(transferId))!, actor.companyId);
}

export async function withdrawTransfer(actor: Express.User, transferId: number, linkBase: string) {
  await db().transaction(async (transaction) => {
    const row = await lockForAction(actor, transferId, "withdraw", transaction);
    await markDecided(actor, row, "withdraw", {}, transaction);
    await tellShopBuyers(
      row.toCompanyId,
      {
        kind: "machine_transfer_withdrawn",
        title: `${row.fromShopName} withdrew a machine transfer`,
        paragraphs: [
          `${row.fromShopName} withdrew the transfer of ${machineName(transferMachineSchema.parse(row.machineSnapshot?.machine))}. Nothing moved.`,
        ],
        next: {
          sentence: "Your transfers page shows what is still waiting.",
          label: "Open machine transfers",
        },
      },
      linkBase,
      transaction,
    );
  });
  return toTransferDto((await findTransferRow(transferId))!, actor.companyId);
}
