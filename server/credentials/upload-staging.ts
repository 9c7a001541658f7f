import { createHash, randomUUID } from "node:crypto";
import { createReadStream } from "node:fs";
import { rename } from "node:fs/promises";
import path from "node:path";
import { pipeline } from "node:stream/promises";
import { READY_SUFFIX, type FileStorage } from "../storage/index.ts";
import type { ExtractableMime } from "./extraction/extract-document.ts";
import { refuseOversizedImage, refuseOversizedPages } from "./extraction/render-bounds.ts";

/** SHA-256 of a file read as a stream, so a large upload is never held whole just to be hashed. */
export async function sha256OfFile(filePath: string): Promise<string> {
  const hash = createHash("sha256");
  await pipeline(createReadStream(filePath), hash);
  return hash.digest("hex");
}

/**
 * Renames the temporary file to one named by its hash before the row commits, so the start-up sweep can finish a move
 * a crash interrupted; then refuses pages or images too large to render. Returns the staged path, which the caller
 * removes on any failure.
 */
export async function stageUpload(
  tempPath: string,
  sha256: string,
  mime: ExtractableMime,
  storage: FileStorage,
  onStaged: (stagedPath: string) => void,
): Promise<string> {
  const staged = path.join(storage.incomingDir, `${sha256}.${randomUUID()}${READY_SUFFIX}`);
  await rename(tempPath, staged);
  onStaged(staged);
  if (mime === "application/pdf") await refuseOversizedPages(staged);
  else await refuseOversizedImage(staged);
  return staged;
}
