import { writeFileSync } from "node:fs";
import path from "node:path";
import { connectDatabase, db } from "../../server/db/sequelize.ts";
import { initModels } from "../../server/db/associations.ts";
import { issueBadgeToken, siteGateCode } from "../../server/gate/token.ts";
import { benchSettings } from "./bench-settings.ts";
import { BENCH_GATE_SECRET, benchServerEnv } from "./bench-server-env.ts";
import { startChildServer, type ChildServer } from "./child-server.ts";
import { clusterCpuSeconds, processCpuSeconds } from "./cpu-time.ts";
import { BENCH_BUYER, captureDirectoryStatements, DIRECTORY_SEARCHES } from "./directory-searches.ts";
import { measureLoad, type LoadResult, type LoadTarget } from "./http-load.ts";
import { LARGE_PASSWORD } from "./seed-large-data.ts";
import { sampleRss } from "./rss-sampler.ts";
import { signIn } from "./session-client.ts";

export interface HotPathResult extends LoadResult {
  /** CPU milliseconds per answered request, in the server process and in PostgreSQL (every backend), measured run only. */
  serverCpuMsPerRequest: number;
  postgresCpuMsPerRequest: number;
}

/**
 * `npm run bench -- --hot`: only the request paths with throughput targets (B0, B1, the three directory searches, the
 * technician page, the verification queue, the gate check), each with the CPU it costs per request in the server and in
 * PostgreSQL, so a change can be judged on a shared machine where requests per second move with the neighbours' load.
 */
export async function runHotPaths(
  largeUrl: string,
  scratch: string,
  say: (line: string) => void,
): Promise<HotPathResult[]> {
  const pgData = path.join(benchSettings.pgRoot, "data");
  initModels(connectDatabase(largeUrl));
  const statements = await captureDirectoryStatements(db());
  await db().close();
  const statementsFile = path.join(scratch, "directory-statements.json");
  writeFileSync(statementsFile, JSON.stringify(statements));

  const results: HotPathResult[] = [];
  // `--only technician`: only the scenarios whose name contains that text (the others are skipped, not measured).
  const only = process.argv.includes("--only") ? process.argv[process.argv.indexOf("--only") + 1] : undefined;
  const measure = async (server: ChildServer, target: LoadTarget) => {
    if (only && !target.name.includes(only)) return;
    let cpu0 = 0;
    let pg0 = 0;
    let cpu = 0;
    let pgCpu = 0;
    const r = await measureLoad(target, {
      start: () => {
        cpu0 = processCpuSeconds(server.pid);
        pg0 = clusterCpuSeconds(pgData);
      },
      stop: () => {
        cpu = processCpuSeconds(server.pid) - cpu0;
        pgCpu = clusterCpuSeconds(pgData) - pg0;
      },
    });
    const perRequest = (s: number) => Math.round(((s * 1000) / Math.max(1, r.requests)) * 100) / 100;
    const result = {
      ...r,
      serverCpuMsPerRequest: perRequest(cpu),
      postgresCpuMsPerRequest: perRequest(pgCpu),
    };
    results.push(result);
    say(
      `  ${r.name}: ${r.requestsPerSecond} req/s, p50 ${r.p50} ms, p95 ${r.p95} ms, errors ${r.errors}; ` +
        `CPU per request: server ${result.serverCpuMsPerRequest} ms, PostgreSQL ${result.postgresCpuMsPerRequest} ms`,
    );
    return result;
  };

  const baseline = await startChildServer(
    "jobs/bench/baseline-server.ts",
    { DATABASE_URL: largeUrl, DIRECTORY_SQL_FILE: statementsFile },
    "/health",
  );
  try {
    await measure(baseline, { name: "B0 bare Express, constant JSON", url: `${baseline.url}/constant` });
    for (const s of DIRECTORY_SEARCHES)
      await measure(baseline, { name: `B1 pg only: ${s.label}`, url: `${baseline.url}/directory/${s.name}` });
  } finally {
    await baseline.stop();
  }

  const server = await startChildServer(
    "jobs/bench/bench-server-entry.ts",
    benchServerEnv(largeUrl, scratch),
    "/api/health",
    benchSettings.serverNodeFlags,
  );
  const rss = sampleRss(server.pid, 100);
  try {
    const buyer = await signIn(server.url, BENCH_BUYER.email, LARGE_PASSWORD);
    const reviewer = await signIn(server.url, "reviewer@large.test", LARGE_PASSWORD);
    for (const s of DIRECTORY_SEARCHES) {
      const query = new URLSearchParams(s.query).toString();
      await measure(server, {
        name: `B2 directory API: ${s.label}`,
        url: `${server.url}/api/directory?${query}`,
        headers: buyer,
      });
    }
    const firstPage = (await (
      await fetch(`${server.url}/api/directory?siteId=${BENCH_BUYER.siteId}&limit=20`, { headers: buyer })
    ).json()) as { rows: { technicianId: number }[] };
    await measure(server, {
      name: "technician page API",
      url: server.url,
      headers: buyer,
      paths: firstPage.rows.map((r) => `/api/directory/technicians/${r.technicianId}`),
    });
    await measure(server, {
      name: "verification queue API",
      url: `${server.url}/api/review/queue`,
      headers: reviewer,
    });
    const gateSite = siteGateCode(BENCH_GATE_SECRET, BENCH_BUYER.siteId);
    await measure(server, {
      name: "anonymous gate check API",
      url: server.url,
      paths: firstPage.rows.map(
        (r) =>
          `/api/gate/check?token=${encodeURIComponent(issueBadgeToken(BENCH_GATE_SECRET, r.technicianId))}&site=${gateSite}`,
      ),
    });
  } finally {
    say(`  server peak RSS: ${Math.round(rss.stop())} MB`);
    await server.stop();
  }
  const b1 = results.filter((r) => r.name.startsWith("B1 "));
  const b2 = results.filter((r) => r.name.startsWith("B2 "));
  for (const s of DIRECTORY_SEARCHES) {
    const one = b1.find((r) => r.name.endsWith(s.label));
    const two = b2.find((r) => r.name.endsWith(s.label));
    if (one && two) say(`  B2/B1 ${s.label}: ${(two.requestsPerSecond / one.requestsPerSecond).toFixed(2)}`);
  }
  return results;
}
