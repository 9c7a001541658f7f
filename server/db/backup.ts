import { execFile } from "node:child_process";
import { createHash } from "node:crypto";
import { cp, mkdir, readFile, readdir, writeFile } from "node:fs/promises";
import path from "node:path";
import { promisify } from "node:util";
import pg from "pg";
import { findBinDir } from "./embedded-postgres.ts";

const run = promisify(execFile);

export interface BackupManifest {
  createdAt: string;
  tables: Record<string, number>;
  files: Record<string, string>;
}

function bin(name: string): string {
  const dir = findBinDir();
  if (!dir) throw new Error("PostgreSQL client tools not found (install Debian's postgresql package)");
  return path.join(dir, name);
}

export async function countRows(databaseUrl: string): Promise<Record<string, number>> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    const tables = await client.query<{ table_name: string }>(
      "SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' AND table_type = 'BASE TABLE' ORDER BY table_name",
    );
    const counts: Record<string, number> = {};
    for (const { table_name } of tables.rows) {
      const r = await client.query<{ n: number }>(`SELECT count(*)::int AS n FROM "${table_name}"`);
      counts[table_name] = r.rows[0]!.n;
    }
    return counts;
  } finally {
    await client.end();
  }
}

async function hashFiles(storeDir: string): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  for (const shard of await readdir(storeDir).catch(() => [] as string[])) {
    for (const name of await readdir(path.join(storeDir, shard)).catch(() => [] as string[])) {
      out[`${shard}/${name}`] = createHash("sha256")
        .update(await readFile(path.join(storeDir, shard, name)))
        .digest("hex");
    }
  }
  return out;
}

/** pg_dump (custom format) of the database plus a copy of the stored files and a manifest of counts and hashes. */
export async function backup(
  databaseUrl: string,
  uploadsDir: string,
  outDir: string,
): Promise<BackupManifest> {
  await mkdir(outDir, { recursive: true });
  await run(
    bin("pg_dump"),
    ["--format=custom", "--no-owner", "--file", path.join(outDir, "database.dump"), databaseUrl],
    { maxBuffer: 64 * 1024 * 1024 },
  );
  await cp(path.join(uploadsDir, "store"), path.join(outDir, "store"), {
    recursive: true,
    force: true,
  }).catch((err: NodeJS.ErrnoException) => {
    if (err.code !== "ENOENT") throw err;
  });
  const manifest: BackupManifest = {
    createdAt: new Date().toISOString(),
    tables: await countRows(databaseUrl),
    files: await hashFiles(path.join(outDir, "store")),
  };
  await writeFile(path.join(outDir, "manifest.json"), JSON.stringify(manifest, null, 2));
  return manifest;
}

/** Restores a backup into an (empty or existing) database and uploads folder, then checks it against the manifest. */
export async function restore(
  databaseUrl: string,
  uploadsDir: string,
  fromDir: string,
): Promise<{ ok: boolean; problems: string[] }> {
  const manifest = JSON.parse(await readFile(path.join(fromDir, "manifest.json"), "utf8")) as BackupManifest;
  await run(
    bin("pg_restore"),
    ["--clean", "--if-exists", "--no-owner", "--dbname", databaseUrl, path.join(fromDir, "database.dump")],
    { maxBuffer: 64 * 1024 * 1024 },
  );
  await mkdir(path.join(uploadsDir, "store"), { recursive: true });
  await cp(path.join(fromDir, "store"), path.join(uploadsDir, "store"), {
    recursive: true,
    force: true,
  }).catch((err: NodeJS.ErrnoException) => {
    if (err.code !== "ENOENT") throw err;
  });
  const problems: string[] = [];
  const counts = await countRows(databaseUrl);
  for (const [table, n] of Object.entries(manifest.tables)) {
    // Sessions expire on their own; everything else must match exactly.
    if (table !== "session" && counts[table] !== n)
      problems.push(`${table}: ${counts[table]} rows, expected ${n}`);
  }
  const files = await hashFiles(path.join(uploadsDir, "store"));
  for (const [name, hash] of Object.entries(manifest.files)) {
    if (files[name] !== hash) problems.push(`file ${name} missing or changed`);
  }
  return { ok: problems.length === 0, problems };
}
