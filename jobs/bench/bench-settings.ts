import { tmpdir } from "node:os";
import path from "node:path";

// The bench's own settings; like server/config.ts for the product, the only bench file that reads process.env.
const root = path.resolve(import.meta.dirname, "..", "..");

function positive(name: string, fallback: number): number {
  const value = Number(process.env[name] ?? fallback);
  if (!Number.isFinite(value) || value <= 0) throw new Error(`${name} must be a positive number`);
  return value;
}

/** `--scale 0.3` (or BENCH_SCALE): the large data set's provider side times this factor; 1 is the usual set. */
function scaleOf(): number {
  const i = process.argv.indexOf("--scale");
  const raw = i >= 0 ? process.argv[i + 1] : process.env.BENCH_SCALE;
  const value = Number(raw ?? 1);
  if (!Number.isFinite(value) || value <= 0 || value > 10)
    throw new Error("--scale must be a number in (0, 10]");
  return value;
}
const scale = scaleOf();

/**
 * The heap limits of `npm run serve` (package.json; a unit test keeps the two the same). Without a limit V8 sizes the
 * old generation from the machine's memory (about 4 GB here) and lets it grow under load before collecting: the server
 * went from 200 MB idle to 340 MB under 20 connections. With 256 MB of old space and 2 MB semi-spaces it peaked at
 * 173 MB on the same load at the same throughput; the start-up heap is about 50 MB.
 */
export const PRODUCTION_NODE_FLAGS = "--max-old-space-size=256 --max-semi-space-size=2";

export const benchSettings = {
  root,
  /** Seconds of load per HTTP scenario (15 s by default); BENCH_SECONDS=3 for a quick run. */
  seconds: positive("BENCH_SECONDS", 15),
  /** Seconds of warm-up before each measured HTTP scenario. */
  warmupSeconds: positive("BENCH_WARMUP_SECONDS", 3),
  connections: positive("BENCH_CONNECTIONS", 20),
  /** Port of the bench's own PostgreSQL cluster (never the demo's 54329). */
  pgPort: positive("BENCH_PG_PORT", 54339),
  pgRoot: process.env.BENCH_PG_ROOT ?? path.join(tmpdir(), "clearbench-bench-pg"),
  /** A cluster to seed into instead of starting one (seed:large only); the database is always clearbench_large. */
  databaseUrl: process.env.DATABASE_URL,
  scale,
  /** One database per scale, so the growth mode can keep all of them: clearbench_large, clearbench_large_x0_3, ... */
  database: scale === 1 ? "clearbench_large" : `clearbench_large_x${String(scale).replace(".", "_")}`,
  resultsDir: path.join(root, "bench", "results"),
  uploads: positive("BENCH_UPLOADS", 30),
  /**
   * V8 flags for the production-mode server child: by default the ones `npm run serve` uses (PRODUCTION_NODE_FLAGS),
   * so the bench measures the server as deployed; BENCH_SERVER_NODE_FLAGS replaces them ("" for none).
   */
  serverNodeFlags: (process.env.BENCH_SERVER_NODE_FLAGS ?? PRODUCTION_NODE_FLAGS)
    .split(/\s+/)
    .filter(Boolean),
};
