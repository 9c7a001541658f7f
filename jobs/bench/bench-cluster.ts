import { startEmbeddedPostgres, type EmbeddedPostgres } from "../../server/db/embedded-postgres.ts";
import { benchSettings } from "./bench-settings.ts";

/** The bench's own PostgreSQL cluster (a folder and port of its own), started from Debian's packages. */
export async function startBenchCluster(say: (line: string) => void): Promise<EmbeddedPostgres> {
  say(`PostgreSQL for the bench: ${benchSettings.pgRoot} on 127.0.0.1:${benchSettings.pgPort}`);
  return startEmbeddedPostgres({ root: benchSettings.pgRoot, port: benchSettings.pgPort, database: "postgres", say });
}

/** The same cluster URL with another database name. */
export function withDatabase(url: string, database: string): string {
  const u = new URL(url);
  u.pathname = `/${database}`;
  return u.toString();
}
