import { spawnSync } from "node:child_process";
import { existsSync } from "node:fs";
import path from "node:path";
import { loadConfig } from "../../server/config.ts";
import { startServer, type RunningServer } from "../../server/main.ts";
import { loadDemoScenarioOnce } from "../../server/db/demo-scenario/index.ts";
import { createTestDatabase } from "./test-database.ts";

/** Builds the production client once per test run into the run's temporary folder. */
export function ensureClientBuild(): string {
  const dist = process.env.CLEARBENCH_TEST_DIST!;
  if (!existsSync(path.join(dist, "index.html"))) {
    const built = spawnSync(
      path.resolve("node_modules/.bin/vite"),
      ["build", "--outDir", dist, "--logLevel", "warn"],
      { stdio: "inherit" },
    );
    if (built.status !== 0) throw new Error("vite build failed");
  }
  return dist;
}

/**
 * The real server, serving the production build, on a database of its own in the test cluster with
 * the demo scenario loaded, so browser journeys sign in with the demo accounts.
 */
export async function startBrowserServer(
  env: Record<string, string> = {},
): Promise<RunningServer & { url: string; databaseUrl: string }> {
  const { name, url: databaseUrl } = await createTestDatabase("browser");
  // A database and an uploads folder of its own: the start-up sweep must not see other tests' files.
  const uploadsDir = path.join(path.dirname(process.env.UPLOADS_DIR!), `uploads-${name}`);
  const config = loadConfig({
    CHECK_RESPONSE_SHAPES: "true",
    ...process.env,
    DATABASE_URL: databaseUrl,
    UPLOADS_DIR: uploadsDir,
    PORT: "0",
    RUN_SCHEDULE: "false",
    ...env,
  });
  const running = await startServer(config, { clientDir: ensureClientBuild() });
  await loadDemoScenarioOnce({ uploadsDir: config.UPLOADS_DIR, today: new Date() });
  return { ...running, url: `http://127.0.0.1:${running.port}`, databaseUrl };
}
