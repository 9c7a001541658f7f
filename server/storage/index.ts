import { mkdirSync } from "node:fs";
import type { Request } from "express";
import type { FileStorage } from "./file-storage.ts";
import { createLocalFolderStorage } from "./local-folder-storage.ts";

export type { FileStorage } from "./file-storage.ts";

/** A hashed upload waiting for its row to commit: <sha256>.<uuid>.ready in the incoming folder. */
export const READY_SUFFIX = ".ready";

export function createStorage(uploadsDir: string): FileStorage {
  const storage = createLocalFolderStorage(uploadsDir);
  mkdirSync(storage.incomingDir, { recursive: true });
  return storage;
}

export function appStorage(req: Request): FileStorage {
  return req.app.locals.storage as FileStorage;
}
