import { readFile } from "node:fs/promises";
import type { FieldSet } from "../../shared/credentials/credential-fields.ts";
import { AppError } from "../http/app-error.ts";
import { DocumentUnreadableError } from "./extraction/document-unreadable-error.ts";
import { extractDocument, type ExtractableMime } from "./extraction/extract-document.ts";
import { isOcrAvailable } from "./extraction/ocr.ts";

const UNREADABLE: Record<string, string> = {
  empty: "The PDF has no pages or no content",
  corrupt: "The PDF is damaged and cannot be read; export or scan it again",
  timeout: "The PDF took too long to read; upload a simpler copy (print to PDF, or a scan)",
  encrypted: "The PDF is password-protected; upload an unprotected copy",
};

/** Reads the staged file's text and proposes fields for the chosen type; an unreadable PDF is the uploader's 422. */
export async function readStagedUpload(
  stagedPath: string,
  mime: ExtractableMime,
  credentialType: { code: string; fieldSet: FieldSet },
) {
  // The bytes are read only when something reads them: the PDF text layer (and OCR of a scan), or OCR of an image.
  // Without OCR an image yields no text whatever its bytes, so it is not read into memory at all.
  const needsBytes = mime === "application/pdf" || (await isOcrAvailable());
  const bytes = needsBytes ? await readFile(stagedPath) : Buffer.alloc(0);
  // The file's own memory rather than a second copy when it has an ArrayBuffer to itself (pdf.js may transfer it;
  // nothing reads it after extraction); a slice of a shared pool is copied, as before.
  const ownMemory = bytes.byteOffset === 0 && bytes.buffer.byteLength === bytes.byteLength;
  return extractDocument({
    bytes: ownMemory ? new Uint8Array(bytes.buffer) : new Uint8Array(bytes),
    mime,
    credentialType,
  }).catch((err: unknown) => {
    if (err instanceof DocumentUnreadableError) {
      throw new AppError("invalid_input", UNREADABLE[err.reason] ?? "The file cannot be read", [
        { path: "file", message: err.reason },
      ]);
    }
    throw err;
  });
}

export type UploadReading = Awaited<ReturnType<typeof readStagedUpload>>;
