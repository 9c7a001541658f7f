import { execFileSync, spawnSync } from "node:child_process";
import { chmodSync, existsSync, mkdirSync, readdirSync } from "node:fs";
import path from "node:path";
import pg from "pg";

/**
 * A PostgreSQL cluster of the project's own, from Debian's packages, on loopback. PostgreSQL refuses
 * to run as root, so as root the cluster belongs to the `postgres` user and its commands run through runuser.
 */
export interface EmbeddedPostgres {
  url: string;
  port: number;
  dataDir: string;
  stop(): void;
}

const isRoot = () => process.getuid?.() === 0;

export function findBinDir(): string | undefined {
  const base = "/usr/lib/postgresql";
  if (!existsSync(base)) return undefined;
  const versions = readdirSync(base)
    .filter((v) => existsSync(path.join(base, v, "bin", "initdb")))
    .sort((a, b) => Number(a) - Number(b));
  const newest = versions.at(-1);
  return newest ? path.join(base, newest, "bin") : undefined;
}

export function ensurePostgresInstalled(say: (line: string) => void): string {
  let bin = findBinDir();
  if (bin) return bin;
  if (!isRoot()) {
    throw new Error(
      "PostgreSQL is not installed. Install Debian's package (sudo apt-get install -y postgresql) or set DATABASE_URL.",
    );
  }
  say("PostgreSQL not found: installing Debian's postgresql package (one time)...");
  execFileSync("apt-get", ["update", "-qq"], { stdio: "inherit" });
  execFileSync("apt-get", ["install", "-y", "-qq", "postgresql"], {
    stdio: "inherit",
    env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" },
  });
  bin = findBinDir();
  if (!bin) throw new Error("PostgreSQL installation did not provide initdb");
  return bin;
}

function runAsOwner(bin: string, args: string[]): void {
  const command = isRoot() ? "runuser" : bin;
  const fullArgs = isRoot() ? ["-u", "postgres", "--", bin, ...args] : args;
  const result = spawnSync(command, fullArgs, { encoding: "utf8" });
  if (result.status !== 0) throw new Error(`${path.basename(bin)} failed: ${result.stderr || result.stdout}`);
}

function isRunning(bin: string, dataDir: string): boolean {
  const command = isRoot() ? "runuser" : path.join(bin, "pg_ctl");
  const args = isRoot()
    ? ["-u", "postgres", "--", path.join(bin, "pg_ctl"), "-D", dataDir, "status"]
    : ["-D", dataDir, "status"];
  return spawnSync(command, args).status === 0;
}

/** True when the postgres user can reach the folder (not so under a private 0700 parent). */
function reachableByPostgres(dir: string): boolean {
  if (!isRoot()) return true;
  return spawnSync("runuser", ["-u", "postgres", "--", "test", "-x", dir]).status === 0;
}

export interface StartOptions {
  root: string;
  port: number;
  database: string;
  say?: (line: string) => void;
  /** Tests trade durability for speed: a throw-away cluster needs no fsync. */
  throwAway?: boolean;
}

export async function startEmbeddedPostgres({
  root,
  port,
  database,
  say = () => undefined,
  throwAway = false,
}: StartOptions): Promise<EmbeddedPostgres> {
  const bin = ensurePostgresInstalled(say);
  mkdirSync(root, { recursive: true });
  chmodSync(root, 0o755);
  if (!reachableByPostgres(root)) {
    throw new Error(
      `The postgres user cannot reach ${root}; a parent folder is private. Clone into a folder others can traverse, or set DATABASE_URL.`,
    );
  }
  const dataDir = path.join(root, "data");
  if (isRoot()) execFileSync("chown", ["postgres:postgres", root]);
  if (!existsSync(path.join(dataDir, "PG_VERSION"))) {
    say(`Creating a PostgreSQL cluster in ${dataDir}...`);
    runAsOwner(path.join(bin, "initdb"), [
      "-D",
      dataDir,
      "-U",
      "postgres",
      "--auth=trust",
      "--encoding=UTF8",
      "--locale=C.UTF-8",
      "--no-sync",
    ]);
  }
  if (isRunning(bin, dataDir)) {
    // Left running by an earlier run that was killed: take it over, so this run owns it and stops it at the end.
    say("Stopping a PostgreSQL left running by an earlier run...");
    runAsOwner(path.join(bin, "pg_ctl"), ["-D", dataDir, "-m", "fast", "-w", "stop"]);
  }
  runAsOwner(path.join(bin, "pg_ctl"), [
    "-D",
    dataDir,
    "-l",
    path.join(root, "server.log"),
    "-w",
    "-t",
    "60",
    "-o",
    `-c listen_addresses=127.0.0.1 -p ${port} -k ${root} -c max_connections=200${throwAway ? " -c fsync=off -c synchronous_commit=off -c full_page_writes=off" : ""}`,
    "start",
  ]);
  const stop = () => {
    try {
      runAsOwner(path.join(bin, "pg_ctl"), ["-D", dataDir, "-m", "fast", "-w", "stop"]);
    } catch {
      // already stopped
    }
  };
  try {
    const admin = new pg.Client({ host: "127.0.0.1", port, user: "postgres", database: "postgres" });
    await admin.connect();
    const exists = await admin.query("SELECT 1 FROM pg_database WHERE datname = $1", [database]);
    if (exists.rowCount === 0) await admin.query(`CREATE DATABASE "${database.replace(/"/g, "")}"`);
    await admin.end();
  } catch (err) {
    stop();
    throw err;
  }
  return { url: `postgres://postgres@127.0.0.1:${port}/${database}`, port, dataDir, stop };
}
