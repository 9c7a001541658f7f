import { readdir } from "node:fs/promises";
import path from "node:path";
import { Credential, Document } from "../../server/credentials/model.ts";

async function countFiles(dir: string): Promise<number> {
  const entries = await readdir(dir, { withFileTypes: true }).catch(() => []);
  let n = 0;
  for (const e of entries) n += e.isDirectory() ? await countFiles(path.join(dir, e.name)) : 1;
  return n;
}

/** Rows and files, counted before and after a request, to prove nothing was half-saved. */
export async function countStored(uploadsDir: string) {
  return {
    documents: await Document.count(),
    credentials: await Credential.count(),
    stored: await countFiles(path.join(uploadsDir, "store")),
    incoming: await countFiles(path.join(uploadsDir, "incoming")),
  };
}
