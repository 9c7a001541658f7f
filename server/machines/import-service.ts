import { QueryTypes, type Transaction } from "sequelize";
import {
  MAX_MACHINE_IMPORT_ROWS,
  checkMachineRow,
  guessMachineMapping,
  machineColumnMappingSchema,
  machineImportFields,
  type CheckedMachineRow,
  type MachineColumnMapping,
  type MachineImportPreview,
  type MachineImportReport,
} from "../../shared/machines/machine-import.ts";
import { db } from "../db/sequelize.ts";
import { AppError } from "../http/app-error.ts";
import { readImportTable } from "../imports/import-table.ts";
import type { UploadedSpreadsheet } from "../imports/read-spreadsheet.ts";
import { recordAudit } from "../audit/index.ts";
import { listCatalog } from "./catalog-service.ts";

export interface ImportOptions {
  mapping?: string | undefined;
  defaultSiteId?: number | undefined;
}

const machineTable = {
  maxRows: MAX_MACHINE_IMPORT_ROWS,
  fields: machineImportFields,
  mappingSchema: machineColumnMappingSchema,
  guess: guessMachineMapping,
};

interface ImportTable {
  headers: string[];
  records: Record<string, string>[];
  mapping: MachineColumnMapping;
}

/** The file read once (its temporary copy leaves the incoming folder on reading, whatever the outcome). */
const readMachineTable = (file: UploadedSpreadsheet | undefined, options: ImportOptions) =>
  readImportTable(file, options.mapping, machineTable);

/** Who holds each builder+serial on the platform now (the same keys as the one-serial-per-builder check). */
async function holdersOf(keys: string[], transaction?: Transaction) {
  if (keys.length === 0) return new Map<string, number>();
  const rows = await db().query<{ key: string; companyId: number }>(
    `SELECT lower(regexp_replace(btrim(e.builder), '\\s+', ' ', 'g')) || '|' || upper(btrim(e.serial_number)) AS key,
            s.company_id AS "companyId"
       FROM equipment e JOIN sites s ON s.id = e.site_id
      WHERE e.serial_number IS NOT NULL
        AND lower(regexp_replace(btrim(e.builder), '\\s+', ' ', 'g')) || '|' || upper(btrim(e.serial_number)) = ANY($1)`,
    { bind: [keys], type: QueryTypes.SELECT, transaction },
  );
  return new Map(rows.map((r) => [r.key, r.companyId]));
}

async function checkTable(
  companyId: number,
  table: ImportTable,
  options: ImportOptions,
  transaction?: Transaction,
) {
  const { headers, records, mapping } = table;
  const sites = await db().query<{ id: number; name: string }>(
    "SELECT id, name FROM sites WHERE company_id = $1 AND active ORDER BY id",
    { bind: [companyId], type: QueryTypes.SELECT, transaction },
  );
  if (options.defaultSiteId !== undefined && !sites.some((s) => s.id === options.defaultSiteId))
    throw new AppError("invalid_input", "Choose one of your own sites", [
      { path: "body.defaultSiteId", message: "not an active site of your shop" },
    ]);
  const catalog = await listCatalog(undefined, transaction);
  const ctx = {
    sites,
    defaultSiteId: options.defaultSiteId ?? (sites.length === 1 ? sites[0]!.id : null),
    builders: catalog.filter((e) => e.kind === "builder" && e.active),
    controls: catalog.filter((e) => e.kind === "control_family" && e.active),
    currentYear: new Date().getUTCFullYear(),
  };
  const rows = records.map((record, i) => checkMachineRow(i + 2, record, mapping, ctx));

  // Duplicates by builder and serial: twice in the file, already one of this shop's machines, or another shop's.
  const keyed = rows.flatMap((r) => (r.key ? [{ row: r, key: r.key }] : []));
  const holders = await holdersOf([...new Set(keyed.map((k) => k.key))], transaction);
  const firstLine = new Map<string, number>();
  const serialColumn = mapping.serialNumber ?? "Serial number";
  for (const { row, key } of keyed) {
    const add = (reason: string) =>
      row.problems.push({ line: row.line, column: serialColumn, field: "serialNumber", reason });
    const earlier = firstLine.get(key);
    if (earlier !== undefined) add(`the same builder and serial is also on line ${earlier}`);
    else firstLine.set(key, row.line);
    const holder = holders.get(key);
    if (holder === companyId) add("already one of your machines");
    else if (holder !== undefined)
      add("another shop holds this machine: ask that shop to start a transfer to you");
    if (row.problems.length > 0) row.input = null;
  }
  return { headers, mapping, rows };
}

function summarize(
  headers: string[],
  mapping: MachineColumnMapping,
  rows: CheckedMachineRow[],
): MachineImportPreview {
  const goodCount = rows.filter((r) => r.input).length;
  return {
    headers,
    mapping,
    rows: rows.map((r) => ({
      line: r.line,
      builder: r.input?.builder ?? "",
      model: r.input?.model ?? "",
      serialNumber: r.input?.serialNumber ?? null,
      problems: r.problems,
    })),
    goodCount,
    badCount: rows.length - goodCount,
  };
}

export async function previewMachineImport(
  actor: Express.User,
  file: UploadedSpreadsheet | undefined,
  options: ImportOptions,
): Promise<MachineImportPreview> {
  const { headers, mapping, rows } = await checkTable(
    actor.companyId,
    await readMachineTable(file, options),
    options,
  );
  return summarize(headers, mapping, rows);
}

/**
 * One transaction for the whole file. By default a file with any problem imports nothing and answers every problem
 * (line, column, reason); with `skipRowsWithProblems` the good rows go in together and the others are reported.
 */
export async function commitMachineImport(
  actor: Express.User,
  file: UploadedSpreadsheet | undefined,
  options: ImportOptions & { skipRowsWithProblems: boolean },
): Promise<MachineImportReport> {
  const table = await readMachineTable(file, options);
  return db().transaction(async (transaction) => {
    await db().query("SELECT pg_advisory_xact_lock(hashtext('machine-import'), $1)", {
      bind: [actor.companyId],
      transaction,
    });
    // The same per-serial locks as the machine form (taken in order, so two imports cannot deadlock), then the rows
    // are checked again: a machine added meanwhile under one of these serials cannot slip past the check.
    const first = (await checkTable(actor.companyId, table, options, transaction)).rows;
    const locks = first.flatMap((r) => (r.key ? [`machine-serial:${r.key.replace("|", ":")}`] : []));
    for (const key of [...new Set(locks)].sort())
      await db().query("SELECT pg_advisory_xact_lock(hashtext($1))", { bind: [key], transaction });
    const checked =
      locks.length > 0 ? (await checkTable(actor.companyId, table, options, transaction)).rows : first;
    const bad = checked.filter((r) => !r.input);
    if (bad.length > 0 && !options.skipRowsWithProblems)
      throw new AppError(
        "invalid_input",
        `${bad.length} ${bad.length === 1 ? "row has" : "rows have"} problems; nothing was imported`,
        bad.flatMap((r) =>
          r.problems.map((p) => ({
            path: `file.line.${p.line}.${p.field}`,
            message: `${p.column}: ${p.reason}`,
          })),
        ),
      );
    const good = checked.flatMap((r) => (r.input ? [r.input] : []));
    if (good.length === 0)
      throw new AppError("invalid_input", "No row can be imported", [
        { path: "file", message: "no good rows" },
      ]);
    const ids: number[] = [];
    for (const g of good) {
      const [row] = await db().query<{ id: number }>(
        `INSERT INTO equipment (site_id, builder, control_family, technology, model, serial_number, year_built,
                in_service_on, building, bay, state, notes, created_at, updated_at)
         VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12, now(), now()) RETURNING id`,
        {
          bind: [
            g.siteId,
            g.builder,
            g.controlFamily,
            g.technology,
            g.model,
            g.serialNumber,
            g.yearBuilt,
            g.inServiceOn,
            g.building,
            g.bay,
            g.state,
            g.notes,
          ],
          type: QueryTypes.SELECT,
          transaction,
        },
      );
      ids.push(row!.id);
    }
    await recordAudit(
      {
        actorUserId: actor.id,
        action: "equipment.imported",
        subjectType: "company",
        subjectId: actor.companyId,
        after: { imported: ids.length, machineIds: ids, skippedLines: bad.map((r) => r.line) },
      },
      transaction,
    );
    return {
      imported: ids.length,
      machineIds: ids,
      skipped: bad.map((r) => ({ line: r.line, reasons: r.problems.map((p) => `${p.column}: ${p.reason}`) })),
    };
  });
}
