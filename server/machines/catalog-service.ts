import { QueryTypes, type Transaction } from "sequelize";
import {
  catalogKey,
  matchKeysFor,
  type CatalogEntryDto,
  type CatalogEntryInput,
  type CatalogKind,
} from "../../shared/machines/catalog.ts";
import { db } from "../db/sequelize.ts";
import { preparedRows } from "../db/sql.ts";
import { AppError } from "../http/app-error.ts";
import { recordAudit } from "../audit/index.ts";

interface Row {
  id: number;
  kind: CatalogKind;
  name: string;
  aliases: string[];
  active: boolean;
}

export async function listCatalog(kind?: CatalogKind, transaction?: Transaction): Promise<CatalogEntryDto[]> {
  const sql = `SELECT id, kind, name, aliases, active FROM machine_catalog_entries
      WHERE ($1::varchar IS NULL OR kind = $1) ORDER BY kind, lower(name), id`;
  // Outside a transaction (the directory reads it on every builder or control search) as a prepared statement.
  const rows = transaction
    ? await db().query<Row>(sql, { bind: [kind ?? null], type: QueryTypes.SELECT, transaction })
    : await preparedRows<Row>(sql, [kind ?? null]);
  return rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    name: r.name,
    aliases: r.aliases ?? [],
    active: r.active,
  }));
}

/** The keys a typed builder or control family matches (its catalog name and aliases), for the directory. */
export async function catalogMatchKeys(kind: CatalogKind, typed: string): Promise<string[]> {
  return matchKeysFor(await listCatalog(kind), typed);
}

/** Refuses a name or alias another entry of the same kind already answers to. */
async function refuseClash(input: CatalogEntryInput, selfId: number | null, transaction: Transaction) {
  const others = (await listCatalog(input.kind, transaction)).filter((e) => e.id !== selfId);
  const taken = new Map<string, string>();
  for (const e of others) for (const n of [e.name, ...e.aliases]) taken.set(catalogKey(n), e.name);
  const names = [input.name, ...input.aliases];
  names.forEach((n, i) => {
    const owner = taken.get(catalogKey(n));
    if (owner)
      throw new AppError("conflict", `"${n}" already names ${owner} in the catalog`, [
        { path: i === 0 ? "body.name" : `body.aliases.${i - 1}`, message: `already names ${owner}` },
      ]);
  });
}

export async function addCatalogEntry(actor: Express.User, input: CatalogEntryInput) {
  return db().transaction(async (transaction) => {
    await db().query("LOCK TABLE machine_catalog_entries IN SHARE ROW EXCLUSIVE MODE", { transaction });
    await refuseClash(input, null, transaction);
    const [row] = await db().query<{ id: number }>(
      `INSERT INTO machine_catalog_entries (kind, name, aliases, active) VALUES ($1, $2, $3, $4) RETURNING id`,
      { bind: [input.kind, input.name, input.aliases, input.active], type: QueryTypes.SELECT, transaction },
    );
    await recordAudit(
      {
        actorUserId: actor.id,
        action: "machine_catalog.added",
        subjectType: "machine_catalog_entry",
        subjectId: row!.id,
        after: input,
      },
      transaction,
    );
    return { id: row!.id, ...input };
  });
}

export async function editCatalogEntry(actor: Express.User, entryId: number, input: CatalogEntryInput) {
  return db().transaction(async (transaction) => {
    await db().query("LOCK TABLE machine_catalog_entries IN SHARE ROW EXCLUSIVE MODE", { transaction });
    const before = (await listCatalog(undefined, transaction)).find((e) => e.id === entryId);
    if (!before) throw new AppError("not_found", "That catalog entry was not found");
    if (before.kind !== input.kind)
      throw new AppError("invalid_input", "An entry keeps its kind", [
        { path: "body.kind", message: "cannot change" },
      ]);
    await refuseClash(input, entryId, transaction);
    await db().query(
      `UPDATE machine_catalog_entries SET name = $2, aliases = $3, active = $4, updated_at = now() WHERE id = $1`,
      { bind: [entryId, input.name, input.aliases, input.active], transaction },
    );
    await recordAudit(
      {
        actorUserId: actor.id,
        action: "machine_catalog.edited",
        subjectType: "machine_catalog_entry",
        subjectId: entryId,
        before,
        after: input,
      },
      transaction,
    );
    return { id: entryId, ...input };
  });
}
