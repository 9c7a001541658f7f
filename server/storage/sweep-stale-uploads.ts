import { readdir, rm, stat } from "node:fs/promises";
import path from "node:path";
import { QueryTypes } from "sequelize";
import { db } from "../db/sequelize.ts";
import type { FileStorage } from "./file-storage.ts";

/** An upload nobody submitted within a day is abandoned: the form that uploads it submits it within minutes. */
export const STALE_UPLOAD_MS = 24 * 60 * 60_000;

export interface StaleUploadReport {
  removedIncoming: number;
  removedDocuments: number;
  removedFiles: number;
}

async function deleteIfStillUnused(id: number): Promise<string | null> {
  try {
    const rows = await db().query<{ sha256: string }>(
      `DELETE FROM documents d
        WHERE d.id = :id
          AND NOT EXISTS (SELECT 1 FROM credentials c WHERE c.document_id = d.id)
          AND NOT EXISTS (SELECT 1 FROM work_order_messages m WHERE m.document_id = d.id)
        RETURNING d.sha256`,
      { replacements: { id }, type: QueryTypes.SELECT },
    );
    return rows[0]?.sha256 ?? null;
  } catch (err) {
    // Another table refers to it (a foreign key this sweep does not know about): it is in use, keep it.
    if ((err as { parent?: { code?: string } }).parent?.code === "23503") return null;
    throw err;
  }
}

/**
 * The scheduled sweep, safe while other instances serve uploads: temporary files older than a day in the incoming
 * folder, and documents uploaded over a day ago that no credential or message uses (with their stored file once no
 * other document has the same bytes). Rows whose move a crash interrupted are left to the start-up sweep.
 */
export async function sweepStaleUploads(storage: FileStorage, now: Date): Promise<StaleUploadReport> {
  const report: StaleUploadReport = { removedIncoming: 0, removedDocuments: 0, removedFiles: 0 };
  const cutoff = now.getTime() - STALE_UPLOAD_MS;
  for (const name of await readdir(storage.incomingDir).catch(() => [] as string[])) {
    const full = path.join(storage.incomingDir, name);
    const info = await stat(full).catch(() => undefined);
    if (info?.isFile() && info.mtimeMs < cutoff) {
      await rm(full, { force: true });
      report.removedIncoming += 1;
    }
  }
  const stale = await db().query<{ id: number }>(
    `SELECT d.id FROM documents d
      WHERE d.created_at < :cutoff
        AND NOT EXISTS (SELECT 1 FROM credentials c WHERE c.document_id = d.id)
        AND NOT EXISTS (SELECT 1 FROM work_order_messages m WHERE m.document_id = d.id)
      ORDER BY d.id`,
    { replacements: { cutoff: new Date(cutoff) }, type: QueryTypes.SELECT },
  );
  for (const { id } of stale) {
    const sha256 = await deleteIfStillUnused(id);
    if (!sha256) continue;
    report.removedDocuments += 1;
    const shared = await db().query("SELECT 1 FROM documents WHERE sha256 = :sha256 LIMIT 1", {
      replacements: { sha256 },
      type: QueryTypes.SELECT,
    });
    if (shared.length === 0 && (await storage.exists(sha256))) {
      await storage.remove(sha256);
      report.removedFiles += 1;
    }
  }
  return report;
}
