import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { execFileSync } from "node:child_process";
import { startEmbeddedPostgres } from "/work/main/server/db/embedded-postgres.ts";
import { connectDatabase } from "/work/main/server/db/sequelize.ts";
import { migrate } from "/work/main/server/db/migrate.ts";
import { initModels } from "/work/main/server/db/associations.ts";
import { loadDemoScenarioOnce } from "/work/main/server/db/demo-scenario/index.ts";
import { freePort } from "/work/main/tests/support/free-port.ts";

const root = mkdtempSync(path.join(tmpdir(), "clearbench-manual-"));
const pg = await startEmbeddedPostgres({ root, port: await freePort(), database: "clearbench", throwAway: true });
const s = connectDatabase(pg.url);
initModels(s);
await migrate(s);
await loadDemoScenarioOnce({ uploadsDir: path.join(root, "uploads"), today: new Date("2027-02-01T12:00:00Z") });
await s.close();
const run = (args: string[]) => {
  try {
    return execFileSync(process.execPath, ["--import", "tsx", "jobs/cli.ts", ...args], { env: { ...process.env, DATABASE_URL: pg.url, SMTP_URL: "smtp://127.0.0.1:1" }, encoding: "utf8" });
  } catch (e) {
    return `exit ${(e as { status: number }).status}: ${(e as { stdout: string }).stdout}`;
  }
};
process.stdout.write(run(["lapse", "--check"]));
process.stdout.write(run(["lapse", "--as-of", "2027-03-01T06:00:00Z"]));
process.stdout.write(run(["lapse", "--check"]));
process.stdout.write(run(["lapse", "--as-of", "2027-03-01T06:00:00Z", "--no-send"]));
pg.stop();
