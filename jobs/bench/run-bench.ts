import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { Sequelize } from "sequelize";
import { connectDatabase, db } from "../../server/db/sequelize.ts";
import { initModels } from "../../server/db/associations.ts";
import { migrate } from "../../server/db/migrate.ts";
import { configureLog } from "../../server/log.ts";
import { benchSettings } from "./bench-settings.ts";
import { startBenchCluster, withDatabase } from "./bench-cluster.ts";
import { machineInfo, renderMarkdown, type BenchResults } from "./bench-report.ts";
import { startChildServer } from "./child-server.ts";
import { BENCH_GATE_SECRET, benchServerEnv } from "./bench-server-env.ts";
import { runHotPaths } from "./hot-paths.ts";
import { buildClient, measureClientSize } from "./client-size.ts";
import {
  BENCH_BUYER,
  captureDirectoryStatements,
  DIRECTORY_SEARCHES,
  explainStatements,
  explainFile,
  seqScansOfLargeTables,
} from "./directory-searches.ts";
import { measureFirstResults } from "./first-results.ts";
import { measureLoad, type LoadResult } from "./http-load.ts";
import { benchLapseJob } from "./lapse-bench.ts";
import { LARGE } from "./large-data-sql.ts";
import { sampleRss } from "./rss-sampler.ts";
import { LARGE_PASSWORD, readSeedInfo, seedLargeDataSet } from "./seed-large-data.ts";
import { BEHIND_TLS_PROXY, signIn } from "./session-client.ts";
import { benchUploads } from "./upload-bench.ts";
import { prepareComparison, routingRequestBody } from "./service-request-bench.ts";
import { runPlansOnly } from "./plans-mode.ts";
import { runGrowth } from "./growth.ts";
import { busiestMachine } from "./machine-history-bench.ts";
import { issueBadgeToken, siteGateCode } from "../../server/gate/token.ts";

// `npm run bench`: its own PostgreSQL cluster, the large data set (loaded when absent), the server in production mode
// as a child process, and every figure in one run. Writes bench/results/latest.json and latest.md.
const say = (line: string) => process.stdout.write(`${line}\n`);
const started = performance.now();
configureLog("warn");
mkdirSync(benchSettings.resultsDir, { recursive: true });
const out = (name: string) => path.join(benchSettings.resultsDir, name);
const DAY = 86_400_000;

if (process.argv.includes("--plans")) {
  // `npm run bench -- --plans`: the directory statements' plans and one-connection timings only, no HTTP load.
  await runPlansOnly(say, out("plans-directory.txt"));
  process.exit(0);
}
if (process.argv.includes("--growth")) {
  // `npm run bench -- --growth`: the directory, routing, queue and lapse job at each scale, and how each grows.
  mkdirSync(benchSettings.resultsDir, { recursive: true });
  await runGrowth(say, benchSettings.resultsDir);
  process.exit(0);
}

if (process.argv.includes("--help")) {
  say(
    [
      "npm run bench [-- MODE]: every figure in one run (bench/results/latest.json and latest.md) when no mode is given.",
      "  --plans   the directory statements' plans and one-connection timings, no HTTP load",
      "  --growth  the directory, routing, queue and lapse job at scales 0.3, 1 and 3 (BENCH_GROWTH_SCALES)",
      "  --lapse   the lapse job against its floor only (bench/results/lapse.json, explain-lapse-job.txt)",
      "  --hot     B0, B1, the directory API, technician page, queue and gate check with CPU per request (hot.json);",
      "            --only TEXT measures only the scenarios whose name contains TEXT",
      "  --scale X the data set at that scale (with --lapse or --plans; seed:large takes it too)",
    ].join("\n"),
  );
  process.exit(0);
}

const cluster = await startBenchCluster(say);
// An unexpected crash still stops the cluster and the child servers.
process.on("uncaughtException", (err) => {
  say(`bench failed: ${err.stack ?? String(err)}`);
  void Promise.allSettled(stopAll.map((stop) => stop())).then(() => process.exit(1));
});
const scratch = mkdtempSync(path.join(tmpdir(), "clearbench-bench-"));
const stopAll: (() => Promise<void> | void)[] = [
  () => cluster.stop(),
  () => rmSync(scratch, { recursive: true, force: true }),
];
try {
  const largeUrl = withDatabase(cluster.url, benchSettings.database);
  const info =
    (await readSeedInfo(cluster.url, benchSettings.database)) ??
    (await seedLargeDataSet(cluster.url, benchSettings.database, say));
  const migrator = new Sequelize(largeUrl, { dialect: "postgres", logging: false });
  const applied = await migrate(migrator);
  await migrator.close();
  if (applied.length) say(`Applied migrations to the large data set: ${applied.join(", ")}`);
  if (process.argv.includes("--hot")) {
    // `npm run bench -- --hot`: the paths with throughput targets and the CPU each request costs, nothing else.
    const hot = await runHotPaths(largeUrl, scratch, say);
    writeFileSync(
      out("hot.json"),
      `${JSON.stringify({ finishedAt: new Date().toISOString(), hot }, null, 2)}\n`,
    );
    for (const stop of stopAll) await stop();
    process.exit(0);
  }

  // The job first: its copies need the template database free of connections.
  const lapseAsOf = new Date(info.anchor.getTime() + 7 * DAY + 6 * 3_600_000);
  say(
    `Lapse job against its floor (as of ${lapseAsOf.toISOString()}: a week of lapses on the large data set)...`,
  );
  const lapse = await benchLapseJob(
    cluster.url,
    benchSettings.database,
    lapseAsOf,
    out("explain-lapse-job.txt"),
    say,
  );
  if (process.argv.includes("--lapse")) {
    // `npm run bench -- --lapse`: only the job against its floor, on the same data set as a full run.
    writeFileSync(out("lapse.json"), `${JSON.stringify(lapse, null, 2)}\n`);
    say(
      `  job ${lapse.jobMs} ms, floor ${lapse.floorMs} ms: ${lapse.ratio}x (steps ms: ${JSON.stringify(lapse.jobSteps)})`,
    );
    for (const stop of stopAll) await stop();
    process.exit(0);
  }

  say("Directory SQL captured from the server's search code; EXPLAIN (ANALYZE, BUFFERS)...");
  initModels(connectDatabase(largeUrl));
  const statements = await captureDirectoryStatements(db());
  const plans = await explainStatements(
    largeUrl,
    statements,
    explainFile(benchSettings.resultsDir, "directory"),
  );
  const [pgVersion] = await db().query<{ server_version: string }>("SHOW server_version", {
    type: "SELECT" as never,
  });
  await db().close();
  const seqScans = seqScansOfLargeTables(plans);
  const statementsFile = path.join(scratch, "directory-statements.json");
  writeFileSync(statementsFile, JSON.stringify(statements));

  const clientDir = path.join(scratch, "client");
  buildClient(benchSettings.root, clientDir, say);
  const client = measureClientSize(clientDir);

  const http: LoadResult[] = [];
  const measure = async (target: Parameters<typeof measureLoad>[0]) => {
    say(`  ${target.name}...`);
    const r = await measureLoad(target);
    http.push(r);
    say(
      `    ${r.requestsPerSecond} req/s, p50 ${r.p50} ms, p95 ${r.p95} ms, p99 ${r.p99} ms, errors ${r.errors}`,
    );
    return r;
  };

  say("Ceilings: B0 bare Express, B1 the directory SQL with pg alone...");
  const baseline = await startChildServer(
    "jobs/bench/baseline-server.ts",
    { DATABASE_URL: largeUrl, DIRECTORY_SQL_FILE: statementsFile },
    "/health",
  );
  stopAll.unshift(() => baseline.stop());
  const b0 = await measure({ name: "B0 bare Express, constant JSON", url: `${baseline.url}/constant` });
  const b1: Record<string, LoadResult> = {};
  for (const s of DIRECTORY_SEARCHES)
    b1[s.name] = await measure({
      name: `B1 pg only: ${s.label}`,
      url: `${baseline.url}/directory/${s.name}`,
    });
  await baseline.stop();

  say("The server in production mode...");
  const server = await startChildServer(
    "jobs/bench/bench-server-entry.ts",
    benchServerEnv(largeUrl, scratch, clientDir),
    "/api/health",
    benchSettings.serverNodeFlags,
  );
  stopAll.unshift(() => server.stop());
  const rss = sampleRss(server.pid, 100);
  const buyer = await signIn(server.url, BENCH_BUYER.email, LARGE_PASSWORD);
  const reviewer = await signIn(server.url, "reviewer@large.test", LARGE_PASSWORD);
  const office = await signIn(server.url, "office-1@service.large.test", LARGE_PASSWORD);

  const ratios: BenchResults["ratios"] = [];
  for (const s of DIRECTORY_SEARCHES) {
    const query = new URLSearchParams(s.query).toString();
    const b2 = await measure({
      name: `B2 directory API: ${s.label}`,
      url: `${server.url}/api/directory?${query}`,
      headers: buyer,
    });
    ratios.push({
      name: s.label,
      b2OverB0: b2.requestsPerSecond / b0.requestsPerSecond,
      b2OverB1: b2.requestsPerSecond / b1[s.name]!.requestsPerSecond,
    });
  }
  const firstPage = (await (
    await fetch(`${server.url}/api/directory?siteId=${BENCH_BUYER.siteId}&limit=20`, { headers: buyer })
  ).json()) as { rows: { technicianId: number }[] };
  await measure({
    name: "technician page API",
    url: server.url,
    headers: buyer,
    paths: firstPage.rows.map((r) => `/api/directory/technicians/${r.technicianId}`),
  });
  await measure({ name: "verification queue API", url: `${server.url}/api/review/queue`, headers: reviewer });
  // Routing: the invited-set preview a buyer sees before sending, for a machine-down mill repair at the bench site.
  await measure({
    name: "service-request routing preview API",
    url: `${server.url}/api/service-requests/preview`,
    method: "POST",
    headers: { ...buyer, "content-type": "application/json" },
    bodies: [JSON.stringify(routingRequestBody(BENCH_BUYER.siteId))],
  });
  const comparison = await prepareComparison(server.url, largeUrl, buyer, BENCH_BUYER.siteId, say);
  await measure({
    name: `estimates comparison API (${comparison.estimates} estimates, ${comparison.invited} invited)`,
    url: `${server.url}/api/service-requests/${comparison.requestId}/comparison`,
    headers: buyer,
  });
  // The anonymous gate check: fresh badge codes (they live five minutes) of the first page's technicians, scanned at
  // the bench site's gate sign.
  const gateSecret = BENCH_GATE_SECRET;
  const gateSite = siteGateCode(gateSecret, BENCH_BUYER.siteId);
  await measure({
    name: "anonymous gate check API",
    url: server.url,
    paths: firstPage.rows.map(
      (r) =>
        `/api/gate/check?token=${encodeURIComponent(issueBadgeToken(gateSecret, r.technicianId))}&site=${gateSite}`,
    ),
  });
  // A machine's history page: the bench buyer's machine with the most confirmed work orders.
  const machine = await busiestMachine(largeUrl, BENCH_BUYER.email);
  await measure({
    name: `machine history API (${machine.confirmed} confirmed work orders)`,
    url: `${server.url}/api/machines/${machine.id}/history`,
    headers: buyer,
  });
  await measure({
    name: "sign-in (bcrypt cost 12)",
    url: `${server.url}/api/auth/sign-in`,
    method: "POST",
    headers: { "content-type": "application/json", "x-clearbench-csrf": "1", ...BEHIND_TLS_PROXY },
    bodies: Array.from({ length: LARGE.shops }, (_v, i) =>
      JSON.stringify({ email: `buyer-${i + 1}@shop.large.test`, password: LARGE_PASSWORD }),
    ),
  });

  say("Uploads...");
  const upload = await benchUploads(server.url, office, server.pid, benchSettings.uploads);
  say(`  p50 ${upload.p50} ms, p95 ${upload.p95} ms; 10 MB upload: +${upload.rssGrowthMb} MB RSS`);
  say("Chromium: first directory results...");
  const firstResults = await measureFirstResults(
    server.url,
    BENCH_BUYER.email,
    LARGE_PASSWORD,
    BENCH_BUYER.siteId,
  );
  const serverPeakRssMb = Math.round(rss.stop());
  await server.stop();

  const results: BenchResults = {
    finishedAt: new Date().toISOString(),
    machine: machineInfo(pgVersion?.server_version ?? "unknown"),
    settings: {
      seconds: benchSettings.seconds,
      warmupSeconds: benchSettings.warmupSeconds,
      connections: benchSettings.connections,
    },
    dataSet: {
      "service companies": LARGE.serviceCompanies,
      technicians: LARGE.technicians,
      credentials: LARGE.credentials,
      shops: LARGE.shops,
      sites: LARGE.sites,
      "work orders": LARGE.workOrders,
      reviews: LARGE.reviews,
      anchor: info.anchor.toISOString().slice(0, 10),
    },
    http,
    ratios,
    lapse,
    upload,
    client,
    firstResults,
    serverPeakRssMb,
    seqScansOnHotPath: seqScans,
    durationSeconds: (performance.now() - started) / 1000,
  };
  const markdown = renderMarkdown(results);
  writeFileSync(out("latest.json"), `${JSON.stringify(results, null, 2)}\n`);
  writeFileSync(out("latest.md"), markdown);
  say(`\n${markdown}`);
} finally {
  for (const stop of stopAll) await stop();
}
