import { mkdirSync } from "node:fs";
import type { Request } from "express";
import type { FileStorage } from "./file-storage.ts";
import path from "node:path";
import { loadConfig, type Config } from "../config.ts";
import { createLocalFolderStorage } from "./local-folder-storage.ts";
import { createS3Storage } from "./s3-storage.ts";

export type { FileStorage } from "./file-storage.ts";

/** A hashed upload waiting for its row to commit: <sha256>.<uuid>.ready in the incoming folder. */
export const READY_SUFFIX = ".ready";

export type StorageConfig = Pick<
  Config,
  | "STORAGE_DRIVER"
  | "S3_ENDPOINT"
  | "S3_BUCKET"
  | "S3_REGION"
  | "S3_ACCESS_KEY_ID"
  | "S3_SECRET_ACCESS_KEY"
  | "S3_FORCE_PATH_STYLE"
>;

/**
 * The driver config names (STORAGE_DRIVER): the local folder by default, or an S3-compatible bucket. With S3, uploads
 * still arrive in <uploadsDir>/incoming on this machine before they are committed.
 */
export function createStorage(uploadsDir: string, config: StorageConfig = loadConfig()): FileStorage {
  const storage =
    config.STORAGE_DRIVER === "s3"
      ? createS3Storage({
          endpoint: config.S3_ENDPOINT,
          bucket: config.S3_BUCKET!,
          region: config.S3_REGION,
          accessKeyId: config.S3_ACCESS_KEY_ID,
          secretAccessKey: config.S3_SECRET_ACCESS_KEY,
          forcePathStyle: config.S3_FORCE_PATH_STYLE,
          incomingDir: path.join(uploadsDir, "incoming"),
        })
      : createLocalFolderStorage(uploadsDir);
  mkdirSync(storage.incomingDir, { recursive: true });
  return storage;
}

export function appStorage(req: Request): FileStorage {
  return req.app.locals.storage as FileStorage;
}
