import { configureLog } from "../../server/log.ts";
import { benchSettings } from "./bench-settings.ts";
import { startBenchCluster } from "./bench-cluster.ts";
import { seedLargeDataSet } from "./seed-large-data.ts";

// `npm run seed:large`: rebuilds clearbench_large in the cluster DATABASE_URL names, or in the bench's own cluster.
const say = (line: string) => process.stdout.write(`${line}\n`);
configureLog("warn");
const cluster = benchSettings.databaseUrl ? undefined : await startBenchCluster(say);
try {
  await seedLargeDataSet(benchSettings.databaseUrl ?? cluster!.url, benchSettings.database, say);
} finally {
  cluster?.stop();
}
