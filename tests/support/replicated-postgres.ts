import { spawnSync } from "node:child_process";
import { mkdirSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import pg from "pg";
import { findBinDir, startEmbeddedPostgres } from "../../server/db/embedded-postgres.ts";
import { connectDatabase } from "../../server/db/sequelize.ts";
import { migrate } from "../../server/db/migrate.ts";
import { freePort } from "./free-port.ts";

/**
 * A primary and a hot-standby streaming replica from Debian's PostgreSQL, for the replica read tests. The standby is
 * a base backup of the primary taken with `pg_basebackup -R`, which writes standby.signal and primary_conninfo
 * (PostgreSQL 16 docs, "pg_basebackup" and §27.2 "Log-Shipping Standby Servers").
 */
export interface ReplicatedPostgres {
  primaryUrl: string;
  replicaUrl: string;
  /** Stops replaying the primary's changes, so the replica is visibly behind (pg_wal_replay_pause()). */
  pauseReplay(): Promise<void>;
  resumeReplay(): Promise<void>;
  /** Waits until the replica has replayed everything the primary has written so far. */
  catchUp(): Promise<void>;
  stopReplica(): void;
  stop(): void;
}

const isRoot = () => process.getuid?.() === 0;

function run(binary: string, args: string[]): void {
  const [command, fullArgs] = isRoot()
    ? ["runuser", ["-u", "postgres", "--", binary, ...args]]
    : [binary, args];
  const result = spawnSync(command, fullArgs, { encoding: "utf8" });
  if (result.status !== 0)
    throw new Error(`${path.basename(binary)} failed: ${result.stderr || result.stdout}`);
}

async function onReplica<T>(url: string, sql: string): Promise<T[]> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return (await client.query(sql)).rows as T[];
  } finally {
    await client.end();
  }
}

export async function startReplicatedPostgres(database = "clearbench_replica"): Promise<ReplicatedPostgres> {
  const bin = findBinDir();
  if (!bin) throw new Error("PostgreSQL is not installed (Debian's postgresql package)");
  const base = mkdtempSync(path.join(tmpdir(), "clearbench-replica-"));
  spawnSync("chmod", ["755", base]);
  const primaryRoot = path.join(base, "primary");
  const primary = await startEmbeddedPostgres({
    root: primaryRoot,
    port: await freePort(),
    database,
    throwAway: true,
  });
  const sequelize = connectDatabase(primary.url);
  await migrate(sequelize);
  await sequelize.close();

  const replicaRoot = path.join(base, "replica");
  mkdirSync(replicaRoot);
  if (isRoot()) spawnSync("chown", ["postgres:postgres", replicaRoot]);
  const replicaData = path.join(replicaRoot, "data");
  const replicaPort = await freePort();
  // initdb --auth=trust lets loopback replication connections in; -R writes standby.signal beside the data.
  run(path.join(bin, "pg_basebackup"), [
    "-h",
    "127.0.0.1",
    "-p",
    String(primary.port),
    "-U",
    "postgres",
    "-D",
    replicaData,
    "-R",
    "-X",
    "stream",
    "-c",
    "fast",
  ]);
  const pgCtl = path.join(bin, "pg_ctl");
  // A hot standby needs max_connections at least the primary's (PostgreSQL docs §27.4.5).
  run(pgCtl, [
    "-D",
    replicaData,
    "-l",
    path.join(replicaRoot, "server.log"),
    "-w",
    "-t",
    "60",
    "-o",
    `-c listen_addresses=127.0.0.1 -p ${replicaPort} -k ${replicaRoot} -c max_connections=200 -c hot_standby=on -c fsync=off`,
    "start",
  ]);
  let replicaRunning = true;
  const replicaUrl = `postgres://postgres@127.0.0.1:${replicaPort}/${database}`;
  const stopReplica = () => {
    if (!replicaRunning) return;
    replicaRunning = false;
    try {
      run(pgCtl, ["-D", replicaData, "-m", "fast", "-w", "stop"]);
    } catch {
      // already stopped
    }
  };

  return {
    primaryUrl: primary.url,
    replicaUrl,
    pauseReplay: async () => void (await onReplica(replicaUrl, "SELECT pg_wal_replay_pause()")),
    resumeReplay: async () => void (await onReplica(replicaUrl, "SELECT pg_wal_replay_resume()")),
    async catchUp() {
      const lsn = (
        await onReplica<{ lsn: string }>(primary.url, "SELECT pg_current_wal_lsn()::text AS lsn")
      )[0]!.lsn;
      for (let i = 0; i < 300; i++) {
        const behind = (
          await onReplica<{ behind: boolean }>(
            replicaUrl,
            `SELECT pg_last_wal_replay_lsn() < '${lsn}'::pg_lsn AS behind`,
          )
        )[0]!.behind;
        if (!behind) return;
        await new Promise((r) => setTimeout(r, 50));
      }
      throw new Error("the replica did not catch up with the primary within 15 s");
    },
    stopReplica,
    stop() {
      stopReplica();
      primary.stop();
      rmSync(base, { recursive: true, force: true });
    },
  };
}
