import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { startEmbeddedPostgres } from "../../server/db/embedded-postgres.ts";
import { connectDatabase } from "../../server/db/sequelize.ts";
import { migrate } from "../../server/db/migrate.ts";
import { freePort } from "./free-port.ts";
import { BROWSER_TOOLS, ensureDebianTools, OCR_TOOLS } from "../../server/system/debian-packages.ts";

// One throw-away PostgreSQL cluster for the whole run, stopped even when tests fail.
export default async function setup() {
  ensureDebianTools([...OCR_TOOLS, ...BROWSER_TOOLS], (line) => process.stdout.write(`${line}\n`));
  const root = mkdtempSync(path.join(tmpdir(), "clearbench-test-"));
  const pg = await startEmbeddedPostgres({
    root,
    port: await freePort(),
    database: "clearbench_test",
    throwAway: true,
  });
  process.env.DATABASE_URL = pg.url;
  process.env.NODE_ENV = "test";
  process.env.LOG_LEVEL = "silent";
  // A low bcrypt cost keeps the suite fast; production's default of 12 is checked by a config test.
  process.env.BCRYPT_COST = "4";
  process.env.UPLOADS_DIR = path.join(root, "uploads");
  // Browser tests build the production client here once per run, on first use (tests/support/browser-server.ts).
  process.env.CLEARBENCH_TEST_DIST = path.join(root, "dist");
  const sequelize = connectDatabase(pg.url);
  await migrate(sequelize);
  await sequelize.close();
  return () => {
    pg.stop();
    rmSync(root, { recursive: true, force: true });
  };
}
