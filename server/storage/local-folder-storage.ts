import { createReadStream } from "node:fs";
import { access, mkdir, readdir, rename, rm } from "node:fs/promises";
import path from "node:path";
import type { FileStorage } from "./file-storage.ts";

const KEY = /^[a-f0-9]{64}$/;

function checkedKey(key: string): string {
  // Keys are hashes we computed; anything else would be a path-traversal attempt.
  if (!KEY.test(key)) throw new Error("Invalid storage key");
  return key;
}

/** Files under <root>/store/<first two hex>/<sha256>, outside any static folder. */
export function createLocalFolderStorage(root: string): FileStorage {
  const storeDir = path.resolve(root, "store");
  const incomingDir = path.resolve(root, "incoming");
  const fileFor = (key: string) => path.join(storeDir, checkedKey(key).slice(0, 2), key);
  const exists = async (key: string) =>
    access(fileFor(key)).then(
      () => true,
      () => false,
    );

  return {
    incomingDir,
    async commit(tempPath, key) {
      const target = fileFor(key);
      if (await exists(key)) {
        await rm(tempPath, { force: true });
        return;
      }
      await mkdir(path.dirname(target), { recursive: true });
      await rename(tempPath, target);
    },
    async open(key) {
      return createReadStream(fileFor(key));
    },
    exists,
    async remove(key) {
      await rm(fileFor(key), { force: true });
    },
    async *keys() {
      const shards = await readdir(storeDir).catch(() => [] as string[]);
      for (const shard of shards) {
        for (const name of await readdir(path.join(storeDir, shard)).catch(() => [] as string[])) {
          if (KEY.test(name)) yield name;
        }
      }
    },
  };
}
