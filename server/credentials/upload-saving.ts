import type { Transaction } from "sequelize";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import type { FileStorage } from "../storage/index.ts";
import type { ExtractableMime } from "./extraction/extract-document.ts";
import { Document } from "./model.ts";
import { safeFileName, type UploadedFile } from "./upload-checks.ts";
import type { UploadReading } from "./upload-reading.ts";

/** What a caller other than the documents page adds: a narrower set of types, and work in the document's transaction. */
export interface UploadOptions {
  acceptOnly?: ExtractableMime[];
  /** Runs in the transaction that creates the row: if it throws, neither the row nor the file is kept. */
  inTransaction?: (document: Document, transaction: Transaction) => Promise<void>;
  /** Undoes what `inTransaction` committed when the file cannot be moved into place and the row is removed. */
  onDiscard?: (document: Document) => Promise<void>;
}

export interface SavedUpload {
  file: UploadedFile;
  sha256: string;
  mime: ExtractableMime;
  typeCode: string;
  technicianId: number | null;
  reading: UploadReading;
}

/**
 * The row and its audit commit first; only then is the staged file moved into storage, and if that fails the row
 * (and what the caller added in the transaction) is removed again, so nothing is half-saved.
 */
export async function saveAndCommitUpload(
  user: Express.User,
  upload: SavedUpload,
  stagedPath: string,
  storage: FileStorage,
  options: UploadOptions,
): Promise<Document> {
  const { file, sha256, mime, reading } = upload;
  const document = await db().transaction(async (transaction) => {
    const row = await Document.create(
      {
        companyId: user.companyId,
        uploadedBy: user.id,
        sha256,
        sizeBytes: file.size,
        mime,
        originalName: safeFileName(file.originalname),
        extractedText: reading.text.slice(0, 100_000),
        extractionMethod: reading.method,
        extractionEvidence: reading.evidence ?? null,
        typeCode: upload.typeCode,
        technicianId: upload.technicianId,
      },
      { transaction },
    );
    await recordAudit(
      {
        actorUserId: user.id,
        action: "document.uploaded",
        subjectType: "document",
        subjectId: row.id,
        after: { sha256, mime, sizeBytes: file.size },
      },
      transaction,
    );
    await options.inTransaction?.(row, transaction);
    return row;
  });
  try {
    await storage.commit(stagedPath, sha256);
  } catch (err) {
    await options.onDiscard?.(document);
    await document.destroy();
    throw err;
  }
  return document;
}
