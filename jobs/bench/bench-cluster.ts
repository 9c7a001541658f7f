import { spawnSync } from "node:child_process";
import { existsSync } from "node:fs";
import path from "node:path";
import {
  findBinDir,
  startEmbeddedPostgres,
  type EmbeddedPostgres,
} from "../../server/db/embedded-postgres.ts";
import { benchSettings } from "./bench-settings.ts";

/** A cluster left running by an interrupted bench (Ctrl-C, kill) is stopped first, so the next run starts cleanly. */
function stopLeftOverCluster(dataDir: string): void {
  const bin = findBinDir();
  if (!bin || !existsSync(path.join(dataDir, "postmaster.pid"))) return;
  const asOwner =
    process.getuid?.() === 0
      ? (["runuser", ["-u", "postgres", "--", path.join(bin, "pg_ctl")]] as const)
      : ([path.join(bin, "pg_ctl"), []] as const);
  spawnSync(asOwner[0], [...asOwner[1], "-D", dataDir, "-m", "fast", "-w", "stop"], { encoding: "utf8" });
}

/** The bench's own PostgreSQL cluster (a folder and port of its own), started from Debian's packages. */
export async function startBenchCluster(say: (line: string) => void): Promise<EmbeddedPostgres> {
  say(`PostgreSQL for the bench: ${benchSettings.pgRoot} on 127.0.0.1:${benchSettings.pgPort}`);
  stopLeftOverCluster(path.join(benchSettings.pgRoot, "data"));
  return startEmbeddedPostgres({
    root: benchSettings.pgRoot,
    port: benchSettings.pgPort,
    database: "postgres",
    say,
  });
}

/** The same cluster URL with another database name. */
export function withDatabase(url: string, database: string): string {
  const u = new URL(url);
  u.pathname = `/${database}`;
  return u.toString();
}
