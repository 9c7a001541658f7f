import { QueryTypes } from "sequelize";
import type { StartTransfer } from "../../shared/machines/transfers.ts";
import { db } from "../db/sequelize.ts";
import { AppError, notFound } from "../http/app-error.ts";
import { recordAudit } from "../audit/index.ts";
import { findTransferRow, toTransferDto } from "./transfer-read.ts";
import { machineName, tellShopBuyers } from "./transfer-notify.ts";

interface MachineRow {
  id: number;
  companyId: number;
  builder: string;
  controlFamily: string;
  technology: string;
  model: string;
  serialNumber: string | null;
  yearBuilt: number | null;
  inServiceOn: string | null;
}

/** The shop a buyer's sign-in e-mail belongs to; a service company's or a platform user's address names no shop. */
async function shopOfBuyer(email: string) {
  const [row] = await db().query<{ companyId: number; name: string }>(
    `SELECT c.id AS "companyId", c.name FROM users u JOIN companies c ON c.id = u.company_id
      WHERE lower(u.email) = $1 AND u.role = 'buyer' AND u.active AND c.kind = 'shop' LIMIT 1`,
    { bind: [email.toLowerCase()], type: QueryTypes.SELECT },
  );
  return row ?? null;
}

/** The seller names the buying shop by one of its buyers' e-mail; the machine stays put until that shop accepts. */
export async function startTransfer(
  actor: Express.User,
  machineId: number,
  input: StartTransfer,
  linkBase: string,
) {
  const receiver = await shopOfBuyer(input.email);
  if (!receiver)
    throw new AppError("invalid_input", "No shop on Clearbench has a buyer signing in with this e-mail", [
      { path: "body.email", message: "not a shop buyer's e-mail on Clearbench" },
    ]);
  if (receiver.companyId === actor.companyId)
    throw new AppError("invalid_input", "This e-mail belongs to your own shop; name the buying shop", [
      { path: "body.email", message: "your own shop" },
    ]);
  const transferId = await db().transaction(async (transaction) => {
    // Locking the machine row serialises two starts for the same machine; the partial unique index backs it up.
    const [machine] = await db().query<MachineRow>(
      `SELECT e.id, s.company_id AS "companyId", e.builder, e.control_family AS "controlFamily", e.technology,
              e.model, e.serial_number AS "serialNumber", e.year_built AS "yearBuilt",
              to_char(e.in_service_on, 'YYYY-MM-DD') AS "inServiceOn"
         FROM equipment e JOIN sites s ON s.id = e.site_id WHERE e.id = $1 FOR UPDATE OF e`,
      { bind: [machineId], type: QueryTypes.SELECT, transaction },
    );
    if (!machine || machine.companyId !== actor.companyId) throw notFound("That machine");
    const [open] = await db().query<{ id: number }>(
      "SELECT id FROM machine_transfers WHERE equipment_id = $1 AND state = 'open'",
      { bind: [machineId], type: QueryTypes.SELECT, transaction },
    );
    if (open)
      throw new AppError("conflict", "A transfer of this machine is already waiting; withdraw it first", [
        { path: "params.machineId", message: "a transfer is already open" },
      ]);
    const { id: _id, companyId: _companyId, ...identity } = machine;
    const [row] = await db().query<{ id: number }>(
      `INSERT INTO machine_transfers (equipment_id, from_company_id, to_company_id, to_email, note, started_by,
              machine_snapshot)
       VALUES ($1, $2, $3, $4, $5, $6, $7) RETURNING id`,
      {
        bind: [
          machineId,
          actor.companyId,
          receiver.companyId,
          input.email,
          input.note || null,
          actor.id,
          JSON.stringify({ machine: identity }),
        ],
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    await recordAudit(
      {
        actorUserId: actor.id,
        action: "machine_transfer.started",
        subjectType: "machine_transfer",
        subjectId: row!.id,
        after: {
          machineId,
          fromCompanyId: actor.companyId,
          toCompanyId: receiver.companyId,
          toEmail: input.email,
        },
      },
      transaction,
    );
    const seller = await db().query<{ name: string }>("SELECT name FROM companies WHERE id = $1", {
      bind: [actor.companyId],
      type: QueryTypes.SELECT,
      transaction,
    });
    await tellShopBuyers(
      receiver.companyId,
      {
        kind: "machine_transfer_started",
        title: `${seller[0]!.name} is transferring a machine to you`,
        paragraphs: [
          `${seller[0]!.name} has started a transfer of ${machineName(identity)} to your shop.`,
          "If you accept, the machine, its photos and its service history move to one of your sites. The history shows each job's date, kind of work, service company, work done and parts; the seller's prices, messages and people stay with the seller.",
        ],
        next: { sentence: "Accept it or decline it on the transfers page.", label: "Open machine transfers" },
      },
      linkBase,
      transaction,
    );
    return row!.id;
  });
  return toTransferDto((await findTransferRow(transferId))!, actor.companyId);
}
