import { createHash, randomUUID } from "node:crypto";
import { rm, writeFile } from "node:fs/promises";
import path from "node:path";
import type { FileStorage } from "../../storage/index.ts";
import type { DemoCredential } from "./demo-world-types.ts";
import { renderDemoDocument } from "./render-demo-document.ts";

export interface StagedFile {
  tempPath: string;
  sha256: string;
  sizeBytes: number;
}

/** Renders each credential's PDF into the storage's incoming folder, keyed by credential; nothing is committed yet. */
export async function stageDemoFiles(
  credentials: DemoCredential[],
  storage: FileStorage,
): Promise<Map<string, StagedFile>> {
  const staged = await Promise.all(
    credentials.map(async (credential) => {
      const bytes = await renderDemoDocument(credential.document);
      const tempPath = path.join(storage.incomingDir, `demo-${randomUUID()}.pdf`);
      await writeFile(tempPath, bytes);
      const sha256 = createHash("sha256").update(bytes).digest("hex");
      return [credential.key, { tempPath, sha256, sizeBytes: bytes.byteLength }] as const;
    }),
  );
  return new Map(staged);
}

/** Moves staged files into place, only after their rows committed (as an upload does). */
export async function commitStagedFiles(files: Iterable<StagedFile>, storage: FileStorage): Promise<void> {
  for (const file of files) await storage.commit(file.tempPath, file.sha256);
}

export async function discardStagedFiles(files: Iterable<StagedFile>): Promise<void> {
  await Promise.all([...files].map((file) => rm(file.tempPath, { force: true })));
}
