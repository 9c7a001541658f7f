import { writeFileSync } from "node:fs";
import path from "node:path";
import { Sequelize } from "sequelize";
import { configureLog } from "../../server/log.ts";
import { connectDatabase, db } from "../../server/db/sequelize.ts";
import { initModels } from "../../server/db/associations.ts";
import { migrate } from "../../server/db/migrate.ts";
import { findQueue } from "../../server/credentials/find-credentials.ts";
import { routeRequest } from "../../server/service-requests/routing.ts";
import { queueQuerySchema } from "../../shared/credentials/schemas.ts";
import { benchSettings } from "./bench-settings.ts";
import { startBenchCluster, withDatabase } from "./bench-cluster.ts";
import { captureDirectoryStatements, DIRECTORY_SEARCHES } from "./directory-searches.ts";
import { benchLapseJob } from "./lapse-bench.ts";
import { LARGE } from "./large-data-sql.ts";
import { directoryPlans } from "./plans-mode.ts";
import { readSeedInfo, seedLargeDataSet } from "./seed-large-data.ts";
import type { GrowthPoint } from "./growth.ts";

// One point of the growth mode: `--scale X <out.json>`. Timings are the mean of sequential runs on one connection,
// so they measure the work per call, not the machine's concurrency.
const say = (line: string) => process.stdout.write(`${line}\n`);
configureLog("warn");
const out = process.argv[process.argv.length - 1]!;
const RUNS = 20;
const DAY = 86_400_000;

async function meanMs(work: () => Promise<unknown>): Promise<number> {
  await work();
  const t0 = performance.now();
  for (let i = 0; i < RUNS; i++) await work();
  return (performance.now() - t0) / RUNS;
}

const cluster = await startBenchCluster(say);
try {
  const url = withDatabase(cluster.url, benchSettings.database);
  const info =
    (await readSeedInfo(cluster.url, benchSettings.database)) ??
    (await seedLargeDataSet(cluster.url, benchSettings.database, say));
  const migrator = new Sequelize(url, { dialect: "postgres", logging: false });
  await migrate(migrator);
  await migrator.close();
  const figures: Record<string, number> = {};

  initModels(connectDatabase(url));
  const statements = await captureDirectoryStatements(db());
  for (const s of DIRECTORY_SEARCHES) {
    const st = statements[s.name]!;
    figures[`directory SQL: ${s.label}`] = await meanMs(() => db().query(st.sql, { bind: st.bind }));
  }
  const [site] = await db().query<{ latitude: number; longitude: number }>(
    "SELECT latitude, longitude FROM sites WHERE id = 1",
    { type: "SELECT" as never },
  );
  figures["routing (mill, site 1)"] = await meanMs(() =>
    routeRequest({ asOf: new Date(), site: site!, technology: "mill", requirementSetId: null }),
  );
  figures["verification queue (first page and count)"] = await meanMs(() =>
    findQueue(queueQuerySchema.parse({})),
  );
  await db().close();
  writeFileSync(
    path.join(benchSettings.resultsDir, `plans-directory-x${benchSettings.scale}.txt`),
    await directoryPlans(url, 5),
  );
  const lapse = await benchLapseJob(
    cluster.url,
    benchSettings.database,
    new Date(info.anchor.getTime() + 7 * DAY + 6 * 3_600_000),
    path.join(benchSettings.resultsDir, `explain-lapse-job-x${benchSettings.scale}.txt`),
    say,
  );
  figures["lapse job (a week of lapses)"] = lapse.jobMs;
  const point: GrowthPoint = { scale: benchSettings.scale, technicians: LARGE.technicians, figures };
  writeFileSync(out, JSON.stringify(point));
  say(JSON.stringify(point));
} finally {
  cluster.stop();
}
