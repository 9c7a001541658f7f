import { QueryTypes, type Transaction } from "sequelize";
import {
  allowedTransferActions,
  sellerRecordSchema,
  transferMachineSchema,
  type MachineTransferDto,
  type MachineTransferList,
  type TransferSide,
  type TransferState,
} from "../../shared/machines/transfers.ts";
import { db } from "../db/sequelize.ts";
import { notFound } from "../http/app-error.ts";

export interface TransferRow {
  id: number;
  machineId: number;
  fromCompanyId: number;
  toCompanyId: number;
  fromShopName: string;
  toShopName: string;
  toEmail: string;
  note: string | null;
  state: TransferState;
  declineReason: string | null;
  createdAt: Date;
  decidedAt: Date | null;
  toSiteName: string | null;
  machineSnapshot: { machine?: unknown; sellerRecord?: unknown } | null;
}

const SELECT = `SELECT t.id, t.equipment_id AS "machineId", t.from_company_id AS "fromCompanyId",
    t.to_company_id AS "toCompanyId", fc.name AS "fromShopName", tc.name AS "toShopName", t.to_email AS "toEmail",
    t.note, t.state, t.decline_reason AS "declineReason", t.created_at AS "createdAt", t.decided_at AS "decidedAt",
    ts.name AS "toSiteName", t.machine_snapshot AS "machineSnapshot"
  FROM machine_transfers t
  JOIN companies fc ON fc.id = t.from_company_id
  JOIN companies tc ON tc.id = t.to_company_id
  LEFT JOIN sites ts ON ts.id = t.to_site_id`;

export async function findTransferRow(
  transferId: number,
  transaction?: Transaction,
): Promise<TransferRow | null> {
  const [row] = await db().query<TransferRow>(`${SELECT} WHERE t.id = $1`, {
    bind: [transferId],
    type: QueryTypes.SELECT,
    transaction,
  });
  return row ?? null;
}

/**
 * Each side sees what it needs to decide and nothing of the other's people: the seller sees the address it named and
 * its own record as it left; the receiver sees the site it chose. Neither sees who at the other shop acted.
 */
export function toTransferDto(row: TransferRow, companyId: number): MachineTransferDto {
  const side: TransferSide = row.fromCompanyId === companyId ? "seller" : "receiver";
  const seller = side === "seller";
  const sellerRecord = sellerRecordSchema.safeParse(row.machineSnapshot?.sellerRecord);
  return {
    id: row.id,
    machineId: row.machineId,
    state: row.state,
    side,
    machine: transferMachineSchema.parse(row.machineSnapshot?.machine),
    fromShopName: row.fromShopName,
    toShopName: row.toShopName,
    toEmail: seller ? row.toEmail : null,
    note: row.note,
    declineReason: row.declineReason,
    startedAt: new Date(row.createdAt).toISOString(),
    decidedAt: row.decidedAt ? new Date(row.decidedAt).toISOString() : null,
    toSiteName: seller ? null : row.toSiteName,
    sellerRecord: seller && sellerRecord.success ? sellerRecord.data : null,
    actions: allowedTransferActions(row.state, side),
  };
}

export async function findTransfer(companyId: number, transferId: number): Promise<MachineTransferDto> {
  const row = await findTransferRow(transferId);
  if (!row || (row.fromCompanyId !== companyId && row.toCompanyId !== companyId))
    throw notFound("That transfer");
  return toTransferDto(row, companyId);
}

export async function listShopTransfers(companyId: number): Promise<MachineTransferList> {
  const rows = await db().query<TransferRow>(
    `${SELECT} WHERE t.from_company_id = $1 OR t.to_company_id = $1 ORDER BY t.created_at DESC, t.id DESC`,
    { bind: [companyId], type: QueryTypes.SELECT },
  );
  const dtos = rows.map((r) => toTransferDto(r, companyId));
  return {
    incoming: dtos.filter((d) => d.side === "receiver"),
    outgoing: dtos.filter((d) => d.side === "seller"),
  };
}

/** The transfers of one machine the caller took part in, newest first, for the machine's transfer page. */
export async function listMachineTransfers(
  companyId: number,
  machineId: number,
): Promise<MachineTransferDto[]> {
  const rows = await db().query<TransferRow>(
    `${SELECT} WHERE t.equipment_id = $1 AND (t.from_company_id = $2 OR t.to_company_id = $2)
      ORDER BY t.created_at DESC, t.id DESC`,
    { bind: [machineId, companyId], type: QueryTypes.SELECT },
  );
  return rows.map((r) => toTransferDto(r, companyId));
}
