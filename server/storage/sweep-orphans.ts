import { readdir, rm, stat } from "node:fs/promises";
import path from "node:path";
import { QueryTypes } from "sequelize";
import { db } from "../db/sequelize.ts";
import { log } from "../log.ts";
import type { FileStorage } from "./file-storage.ts";

// Another instance may be mid-upload: only files older than this are treated as abandoned.
const ABANDONED_AFTER_MS = 10 * 60_000;

/** Deletes a document row nothing refers to; a foreign key from any other table (a message attachment) keeps it. */
async function deleteUnusedDocument(id: number): Promise<boolean> {
  try {
    await db().query(
      "DELETE FROM documents d WHERE d.id = :id AND NOT EXISTS (SELECT 1 FROM credentials c WHERE c.document_id = d.id)",
      { replacements: { id } },
    );
    return true;
  } catch (err) {
    if ((err as { parent?: { code?: string } }).parent?.code === "23503") return false;
    throw err;
  }
}

async function isKnownHash(sha256: string): Promise<boolean> {
  const rows = await db().query("SELECT 1 FROM documents WHERE sha256 = :sha256 LIMIT 1", {
    replacements: { sha256 },
    type: QueryTypes.SELECT,
  });
  return rows.length > 0;
}

export interface SweepReport {
  finishedMoves: number;
  removedIncoming: number;
  removedRows: number;
  removedFiles: number;
}

/**
 * Run at start-up: after a crash, no row may be left without its file and no file without its row.
 * A row whose move was interrupted is completed from its `.ready` file; otherwise an unreferenced row
 * is deleted; stored files no row names, and abandoned incoming files, are removed.
 */
export async function sweepOrphans(storage: FileStorage, now = Date.now()): Promise<SweepReport> {
  const report: SweepReport = { finishedMoves: 0, removedIncoming: 0, removedRows: 0, removedFiles: 0 };
  const incoming = await readdir(storage.incomingDir).catch(() => [] as string[]);
  const rows = await db().query<{ id: number; sha256: string; referenced: boolean }>(
    `SELECT d.id, d.sha256, EXISTS (SELECT 1 FROM credentials c WHERE c.document_id = d.id) AS referenced FROM documents d`,
    { type: QueryTypes.SELECT },
  );
  const known = new Set(rows.map((r) => r.sha256));
  for (const row of rows) {
    if (await storage.exists(row.sha256)) continue;
    const ready = incoming.find((name) => name.startsWith(`${row.sha256}.`) && name.endsWith(".ready"));
    if (ready) {
      await storage.commit(path.join(storage.incomingDir, ready), row.sha256);
      incoming.splice(incoming.indexOf(ready), 1);
      report.finishedMoves += 1;
    } else if (!row.referenced && (await deleteUnusedDocument(row.id))) {
      report.removedRows += 1;
    } else {
      log.error({ documentId: row.id }, "stored file missing for a document in use");
    }
  }
  for (const name of incoming) {
    const full = path.join(storage.incomingDir, name);
    const info = await stat(full).catch(() => undefined);
    if (info && now - info.mtimeMs > ABANDONED_AFTER_MS) {
      await rm(full, { force: true });
      report.removedIncoming += 1;
    }
  }
  for await (const key of storage.keys()) {
    // Another instance may have committed a row and its file since the rows were read: look again before removing.
    if (!known.has(key) && !(await isKnownHash(key))) {
      await storage.remove(key);
      report.removedFiles += 1;
    }
  }
  return report;
}
