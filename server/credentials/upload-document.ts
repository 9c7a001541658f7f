import { createHash } from "node:crypto";
import type { Transaction } from "sequelize";
import { READY_SUFFIX } from "../storage/index.ts";
import { createReadStream } from "node:fs";
import { readFile, rename, rm } from "node:fs/promises";
import { randomUUID } from "node:crypto";
import path from "node:path";
import { pipeline } from "node:stream/promises";
import { fileTypeFromBuffer, fileTypeFromFile, type FileTypeResult } from "file-type";
import type { UploadDocument } from "../../shared/credentials/schemas.ts";
import { withoutLoneSurrogates } from "../../shared/api/text.ts";
import { reviewerWarnings, type ReviewerWarning } from "../../shared/credentials/reviewer-checks.ts";
import type { CertificateProposal } from "../../shared/credentials/extract-fields.ts";
import type { Evidence } from "../../shared/credentials/locate-values.ts";
import { AppError } from "../http/app-error.ts";
import { db } from "../db/sequelize.ts";
import { recordAudit } from "../audit/index.ts";
import type { FileStorage } from "../storage/index.ts";
import { extractDocument, type ExtractableMime } from "./extraction/extract-document.ts";
import { isOcrAvailable } from "./extraction/ocr.ts";
import { refuseOversizedImage, refuseOversizedPages } from "./extraction/render-bounds.ts";
import { DocumentUnreadableError } from "./extraction/document-unreadable-error.ts";
import { activeType } from "./catalogue.ts";
import { resolveHolder } from "./resolve-holder.ts";
import { Credential, CredentialType, Document } from "./model.ts";
import { workStatesOf } from "./work-states.ts";
import { Company, Technician } from "../db/models.ts";
import { DOCUMENT_FILE_TYPES } from "../../shared/credentials/upload-limits.ts";

const EXTENSIONS: Record<ExtractableMime, readonly string[]> = DOCUMENT_FILE_TYPES;

const UNREADABLE: Record<string, string> = {
  empty: "The PDF has no pages or no content",
  corrupt: "The PDF is damaged and cannot be read; export or scan it again",
  timeout: "The PDF took too long to read; upload a simpler copy (print to PDF, or a scan)",
  encrypted: "The PDF is password-protected; upload an unprotected copy",
};

/** What a caller other than the documents page adds: a narrower set of types, and work in the document's transaction. */
export interface UploadOptions {
  acceptOnly?: ExtractableMime[];
  /** Runs in the transaction that creates the row: if it throws, neither the row nor the file is kept. */
  inTransaction?: (document: Document, transaction: Transaction) => Promise<void>;
  /** Undoes what `inTransaction` committed when the file cannot be moved into place and the row is removed. */
  onDiscard?: (document: Document) => Promise<void>;
}

export interface UploadedFile {
  path: string;
  originalname: string;
  size: number;
}

/** Keeps a display name safe to store and to echo in a header: no folders, no control characters, bounded. */
export function safeFileName(name: string): string {
  const base = path
    .basename(withoutLoneSurrogates(name).replace(/\\/g, "/"))
    // eslint-disable-next-line no-control-regex -- control characters are exactly what is removed here
    .replace(/[\u0000-\u001f\u007f-\u009f"<>|:*?]/g, "_")
    .trim();
  return Array.from(base || "document")
    .slice(0, 120)
    .join("");
}

export async function sniffUpload(bytes: Buffer, originalName: string): Promise<ExtractableMime> {
  return checkSniffed(await fileTypeFromBuffer(bytes), originalName);
}

/** The same check from the file on disk: file-type reads only the first few kilobytes it needs. */
export async function sniffUploadFile(filePath: string, originalName: string): Promise<ExtractableMime> {
  return checkSniffed(await fileTypeFromFile(filePath), originalName);
}

/** SHA-256 of a file read as a stream, so a 10 MB upload is never held whole just to be hashed. */
async function sha256OfFile(filePath: string): Promise<string> {
  const hash = createHash("sha256");
  await pipeline(createReadStream(filePath), hash);
  return hash.digest("hex");
}

function checkSniffed(detected: FileTypeResult | undefined, originalName: string): ExtractableMime {
  const mime = detected?.mime as ExtractableMime | undefined;
  if (!mime || !(mime in EXTENSIONS)) {
    throw new AppError(
      "unsupported_type",
      "Only PDF, PNG or JPEG files are accepted (checked from the file's content)",
      [{ path: "file", message: "not a PDF, PNG or JPEG" }],
    );
  }
  const ext = path.extname(originalName).toLowerCase();
  if (!EXTENSIONS[mime].includes(ext)) {
    throw new AppError(
      "unsupported_type",
      `The file's name says ${ext || "no type"} but its content is ${mime}; rename or re-export it`,
      [{ path: "file", message: "extension does not match content" }],
    );
  }
  return mime;
}

/**
 * Stores an uploaded file and proposes fields read from it. The database row commits first; only then
 * is the temporary file renamed into place, and any failure removes both, so nothing is half-saved.
 */
export async function uploadDocument(
  user: Express.User,
  input: UploadDocument,
  file: UploadedFile | undefined,
  storage: FileStorage,
  options: UploadOptions = {},
) {
  let pending = file?.path;
  try {
    if (!file)
      throw new AppError("invalid_input", "Choose a file to upload", [{ path: "file", message: "required" }]);
    const type = await activeType(input.typeCode);
    const technicianId = await resolveHolder(user, type, input.technicianId);
    if (file.size === 0)
      throw new AppError("invalid_input", "The file is empty", [{ path: "file", message: "0 bytes" }]);

    const mime = await sniffUploadFile(file.path, file.originalname);
    if (options.acceptOnly && !options.acceptOnly.includes(mime))
      throw new AppError("unsupported_type", `Only ${options.acceptOnly.join(" or ")} is accepted here`, [
        { path: "file", message: `${mime} is not accepted here` },
      ]);
    const sha256 = await sha256OfFile(file.path);
    // Named by its hash before the row commits, so the start-up sweep can finish a move a crash interrupted.
    const ready = path.join(storage.incomingDir, `${sha256}.${randomUUID()}${READY_SUFFIX}`);
    await rename(file.path, ready);
    pending = ready;
    if (mime === "application/pdf") await refuseOversizedPages(ready);
    else await refuseOversizedImage(ready);
    // The bytes are read only when something reads them: the PDF text layer (and OCR of a scan), or OCR of an image.
    // Without OCR an image yields no text whatever its bytes, so it is not read into memory at all.
    const needsBytes = mime === "application/pdf" || (await isOcrAvailable());
    const bytes = needsBytes ? await readFile(ready) : Buffer.alloc(0);
    // The file's own memory rather than a second copy when it has an ArrayBuffer to itself (pdf.js may transfer it;
    // nothing reads it after extraction); a slice of a shared pool is copied, as before.
    const ownMemory = bytes.byteOffset === 0 && bytes.buffer.byteLength === bytes.byteLength;
    const extraction = await extractDocument({
      bytes: ownMemory ? new Uint8Array(bytes.buffer) : new Uint8Array(bytes),
      mime,
      credentialType: { code: type.code, fieldSet: type.fieldSet },
    }).catch((err: unknown) => {
      if (err instanceof DocumentUnreadableError) {
        throw new AppError("invalid_input", UNREADABLE[err.reason] ?? "The file cannot be read", [
          { path: "file", message: err.reason },
        ]);
      }
      throw err;
    });

    const document = await db().transaction(async (transaction) => {
      const row = await Document.create(
        {
          companyId: user.companyId,
          uploadedBy: user.id,
          sha256,
          sizeBytes: file.size,
          mime,
          originalName: safeFileName(file.originalname),
          extractedText: extraction.text.slice(0, 100_000),
          extractionMethod: extraction.method,
          extractionEvidence: extraction.evidence ?? null,
          typeCode: type.code,
          technicianId: technicianId ?? null,
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
      await storage.commit(ready, sha256);
    } catch (err) {
      await options.onDiscard?.(document);
      await document.destroy();
      throw err;
    }

    const [company, technician, otherHolder] = await Promise.all([
      Company.findByPk(user.companyId),
      technicianId ? Technician.findByPk(technicianId) : null,
      duplicateForOtherHolder(sha256, document.id, user.companyId, technicianId ?? null),
    ]);
    const fields = extraction.proposal?.fields ?? {};
    const workStates = type.fieldSet === "exemption" ? await workStatesOf(user.companyId) : [];
    const warningsFor = (proposed: object) =>
      reviewerWarnings({
        fieldSet: type.fieldSet,
        fields: proposed as never,
        companyLegalName: company?.name ?? "",
        technicianName: technician?.name,
        duplicateOfOtherHolder: otherHolder,
        workStates,
      });
    return {
      document: { id: document.id, name: document.originalName, mime, sizeBytes: file.size, sha256 },
      extraction: {
        method: extraction.method,
        ocrAvailable: extraction.ocrAvailable,
        fields,
        found: extraction.proposal?.found ?? [],
        evidence: extraction.evidence?.[type.code] ?? {},
      },
      warnings: warningsFor(fields),
      certificate: extraction.certificate
        ? await certificateCoverages(extraction.certificate, warningsFor, extraction.evidence ?? {})
        : null,
    };
  } finally {
    if (pending) await rm(pending, { force: true });
  }
}

/**
 * Every coverage read from a certificate that the catalogue offers (an admin may retire a type), each with its own
 * proposed fields and warnings, so the uploader confirms all of them on one form.
 */
async function certificateCoverages(
  certificate: CertificateProposal,
  warningsFor: (fields: object) => ReviewerWarning[],
  evidence: Record<string, Evidence>,
) {
  const types = await CredentialType.findAll({
    where: { code: certificate.coverages.map((c) => c.typeCode), active: true, fieldSet: "insurance" },
  });
  const name = new Map(types.map((t) => [t.code, t.name]));
  return {
    parties: certificate.parties,
    coverages: certificate.coverages
      .filter((coverage) => name.has(coverage.typeCode))
      .map(({ typeCode, proposal }) => ({
        typeCode,
        typeName: name.get(typeCode) ?? typeCode,
        fields: proposal.fields,
        found: proposal.found,
        evidence: evidence[typeCode] ?? {},
        warnings: warningsFor(proposal.fields),
      })),
  };
}

/** The same bytes already sit on a credential of a different holder (a copied card or certificate). */
export async function duplicateForOtherHolder(
  sha256: string,
  documentId: number,
  companyId: number,
  technicianId: number | null,
): Promise<boolean> {
  const others = await Document.findAll({ where: { sha256 }, attributes: ["id"] });
  const ids = others.map((d) => d.id).filter((id) => id !== documentId);
  if (ids.length === 0) return false;
  const credentials = await Credential.findAll({
    where: { documentId: ids },
    attributes: ["companyId", "technicianId"],
  });
  return credentials.some((c) => c.companyId !== companyId || c.technicianId !== technicianId);
}
