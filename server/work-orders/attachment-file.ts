import { createHash } from "node:crypto";
import { readFile, rm } from "node:fs/promises";
import type { Response } from "express";
import { safeFileName, sniffUpload } from "../credentials/index.ts";
import { AppError } from "../http/app-error.ts";
import { contentDisposition } from "../http/file-names.ts";
import type { FileStorage } from "../storage/index.ts";
import { makeThumbnail, type Thumbnail } from "./attachment-thumbnail.ts";

export interface UploadedFile {
  path: string;
  originalname: string;
  size: number;
}

export interface CheckedAttachment {
  tempPath: string;
  sha256: string;
  mime: string;
  sizeBytes: number;
  name: string;
  thumbnail: Thumbnail | null;
}

export async function checkAttachment(
  file: UploadedFile,
  sniff: (bytes: Buffer, originalName: string) => Promise<string> = sniffUpload,
): Promise<CheckedAttachment> {
  if (file.size === 0)
    throw new AppError("invalid_input", "The file is empty", [{ path: "file", message: "0 bytes" }]);
  const bytes = await readFile(file.path);
  // The same three types and the same checks as credential documents: the type is read from the bytes, and the
  // file's name must agree with it.
  const mime = await sniff(bytes, file.originalname);
  return {
    tempPath: file.path,
    sha256: createHash("sha256").update(bytes).digest("hex"),
    mime,
    sizeBytes: file.size,
    name: safeFileName(file.originalname),
    thumbnail: await makeThumbnail(bytes, mime),
  };
}

/** Removes multer's temporary file (already moved into place when the upload was kept). */
export async function removeUpload(file: UploadedFile | undefined): Promise<void> {
  if (file) await rm(file.path, { force: true });
}

/** Sends a stored attachment as data, never as a page: no sniffing, no scripts, a download unless it is an image. */
export async function sendAttachment(
  res: Response,
  storage: FileStorage,
  file: { sha256: string; mime: string; originalName: string },
) {
  const disposition = file.mime.startsWith("image/") ? "inline" : "attachment";
  res.setHeader("Content-Type", file.mime);
  res.setHeader("X-Content-Type-Options", "nosniff");
  res.setHeader("Content-Security-Policy", "default-src 'none'; sandbox");
  res.setHeader("Cache-Control", "private, no-store");
  res.setHeader("Content-Disposition", contentDisposition(disposition, file.originalName));
  const stream = await storage.open(file.sha256);
  await new Promise<void>((resolve, reject) => {
    stream.on("error", reject);
    res.on("finish", resolve);
    stream.pipe(res);
  });
}
