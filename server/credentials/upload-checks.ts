import path from "node:path";
import { fileTypeFromBuffer, fileTypeFromFile, type FileTypeResult } from "file-type";
import { withoutLoneSurrogates } from "../../shared/api/text.ts";
import { DOCUMENT_FILE_TYPES, DOCUMENT_TYPES_WORDS } from "../../shared/credentials/upload-limits.ts";
import { AppError } from "../http/app-error.ts";
import type { ExtractableMime } from "./extraction/extract-document.ts";

export interface UploadedFile {
  path: string;
  originalname: string;
  size: number;
}

const EXTENSIONS: Record<ExtractableMime, readonly string[]> = DOCUMENT_FILE_TYPES;

export function requireFile(file: UploadedFile | undefined): asserts file is UploadedFile {
  if (!file)
    throw new AppError("invalid_input", "Choose a file to upload", [{ path: "file", message: "required" }]);
}

export function requireNonEmpty(file: UploadedFile): void {
  if (file.size === 0)
    throw new AppError("invalid_input", "The file is empty", [{ path: "file", message: "0 bytes" }]);
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

/** A caller other than the documents page may take fewer types (a broker's link takes PDFs only). */
export function requireAccepted(
  mime: ExtractableMime,
  acceptOnly: readonly ExtractableMime[] | undefined,
): void {
  if (acceptOnly && !acceptOnly.includes(mime))
    throw new AppError("unsupported_type", `Only ${acceptOnly.join(" or ")} is accepted here`, [
      { path: "file", message: `${mime} is not accepted here` },
    ]);
}

function checkSniffed(detected: FileTypeResult | undefined, originalName: string): ExtractableMime {
  const mime = detected?.mime as ExtractableMime | undefined;
  if (!mime || !(mime in EXTENSIONS)) {
    throw new AppError(
      "unsupported_type",
      `Only ${DOCUMENT_TYPES_WORDS} files are accepted (checked from the file's content)`,
      [{ path: "file", message: `not a ${DOCUMENT_TYPES_WORDS}` }],
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
