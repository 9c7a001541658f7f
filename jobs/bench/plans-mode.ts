import { writeFileSync } from "node:fs";
import pg from "pg";
import { Sequelize } from "sequelize";
import { migrate } from "../../server/db/migrate.ts";
import { benchSettings } from "./bench-settings.ts";
import { startBenchCluster, withDatabase } from "./bench-cluster.ts";
import { readSeedInfo, seedLargeDataSet } from "./seed-large-data.ts";
import { connectDatabase, db, PLANNER_OPTIONS } from "../../server/db/sequelize.ts";
import { initModels } from "../../server/db/associations.ts";
import { captureDirectoryStatements, type CapturedStatement } from "./directory-searches.ts";

/** Mean and worst of `runs` sequential executions of one statement on one connection (no concurrency). */
export async function timeStatement(client: pg.Client, s: CapturedStatement, runs: number) {
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    await client.query(s.sql, s.bind);
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  const mean = times.reduce((a, b) => a + b, 0) / times.length;
  return { mean, p95: times[Math.min(times.length - 1, Math.floor(times.length * 0.95))]! };
}

/**
 * `npm run bench -- --plans`: the directory statements the server sends, captured from its own search code, with
 * their EXPLAIN (ANALYZE, BUFFERS) plans and one-connection timings; no HTTP load. Prints and returns the text.
 */
export async function directoryPlans(url: string, runs = 30): Promise<string> {
  initModels(connectDatabase(url));
  let statements: Record<string, CapturedStatement>;
  try {
    statements = await captureDirectoryStatements(db());
  } finally {
    await db().close();
  }
  const client = new pg.Client({ connectionString: url, options: PLANNER_OPTIONS });
  await client.connect();
  const parts: string[] = [];
  try {
    for (const [name, s] of Object.entries(statements)) {
      await client.query(`EXPLAIN (ANALYZE) ${s.sql}`, s.bind);
      const { rows } = await client.query<{ "QUERY PLAN": string }>(
        `EXPLAIN (ANALYZE, BUFFERS) ${s.sql}`,
        s.bind,
      );
      const t = await timeStatement(client, s, runs);
      parts.push(
        `### ${name}: ${runs} runs on one connection, mean ${t.mean.toFixed(2)} ms, p95 ${t.p95.toFixed(2)} ms\n` +
          `${rows.map((r) => r["QUERY PLAN"]).join("\n")}\n`,
      );
    }
  } finally {
    await client.end();
  }
  return parts.join("\n");
}

/** The whole `--plans` run: the bench's cluster, the large data set (loaded when absent), migrations, the plans. */
export async function runPlansOnly(say: (line: string) => void, file: string): Promise<void> {
  const cluster = await startBenchCluster(say);
  try {
    const url = withDatabase(cluster.url, benchSettings.database);
    if (!(await readSeedInfo(cluster.url, benchSettings.database)))
      await seedLargeDataSet(cluster.url, benchSettings.database, say);
    const migrator = new Sequelize(url, { dialect: "postgres", logging: false });
    await migrate(migrator);
    await migrator.close();
    const text = await directoryPlans(url);
    writeFileSync(file, text);
    say(text);
    say(`Written to ${file}`);
  } finally {
    cluster.stop();
  }
}
