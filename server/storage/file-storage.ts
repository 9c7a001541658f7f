import type { Readable } from "node:stream";

/**
 * Where uploaded files live, by content key (their SHA-256). The folder driver is the default; an
 * object-storage driver can replace it without the use cases changing.
 */
export interface FileStorage {
  /** Folder on local disk where incoming uploads are written before they are committed. */
  readonly incomingDir: string;
  /** Moves a finished temporary file into place under `key`; a second copy of the same key is dropped. */
  commit(tempPath: string, key: string): Promise<void>;
  open(key: string): Promise<Readable>;
  exists(key: string): Promise<boolean>;
  remove(key: string): Promise<void>;
  /** Every stored key, for the start-up sweep of orphans. */
  keys(): AsyncIterable<string>;
}
