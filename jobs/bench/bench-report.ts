import { cpus, totalmem } from "node:os";
import type { LoadResult } from "./http-load.ts";
import type { LapseBenchResult } from "./lapse-bench.ts";
import type { UploadBenchResult } from "./upload-bench.ts";
import type { ClientSize } from "./client-size.ts";
import type { FirstResultsTiming } from "./first-results.ts";

export interface BenchResults {
  finishedAt: string;
  machine: { cpus: number; cpuModel: string; memoryGb: number; node: string; postgres: string };
  settings: { seconds: number; warmupSeconds: number; connections: number };
  dataSet: Record<string, number | string>;
  http: LoadResult[];
  ratios: { name: string; b2OverB0: number; b2OverB1: number }[];
  lapse: LapseBenchResult;
  upload: UploadBenchResult;
  client: ClientSize;
  firstResults: FirstResultsTiming;
  serverPeakRssMb: number;
  seqScansOnHotPath: string[];
  durationSeconds: number;
}

export function machineInfo(postgres: string) {
  return {
    cpus: cpus().length,
    cpuModel: cpus()[0]?.model.trim() ?? "unknown",
    memoryGb: Math.round((totalmem() / 1024 ** 3) * 10) / 10,
    node: process.version,
    postgres,
  };
}

const ms = (n: number) => (Number.isFinite(n) ? `${Math.round(n * 10) / 10}` : "-");

interface Target {
  figure: string;
  value: string;
  target: string;
  met: boolean;
}

export function targetsOf(r: BenchResults): Target[] {
  const directory = r.http.filter((h) => h.name.startsWith("B2 "));
  const worstDirectoryP95 = Math.max(...directory.map((h) => h.p95));
  const worstRatio = Math.min(...r.ratios.map((x) => x.b2OverB1));
  const page = r.http.find((h) => h.name.startsWith("technician page"))!;
  const queue = r.http.find((h) => h.name.startsWith("verification queue"));
  const gate = r.http.find((h) => h.name.startsWith("anonymous gate check"));
  return [
    {
      figure: "directory API p95 (worst of 3)",
      value: `${ms(worstDirectoryP95)} ms`,
      target: "<= 50 ms",
      met: worstDirectoryP95 <= 50,
    },
    {
      figure: "B2/B1 requests/s (worst of 3)",
      value: worstRatio.toFixed(2),
      target: ">= 0.80",
      met: worstRatio >= 0.8,
    },
    { figure: "technician page p95", value: `${ms(page.p95)} ms`, target: "<= 30 ms", met: page.p95 <= 30 },
    ...(queue
      ? [
          {
            figure: "verification queue p95",
            value: `${ms(queue.p95)} ms`,
            target: "<= 50 ms",
            met: queue.p95 <= 50,
          },
        ]
      : []),
    ...(gate
      ? [
          {
            figure: "anonymous gate check p95",
            value: `${ms(gate.p95)} ms`,
            target: "<= 30 ms",
            met: gate.p95 <= 30,
          },
        ]
      : []),
    {
      figure: "lapse job",
      value: `${(r.lapse.jobMs / 1000).toFixed(1)} s`,
      target: "<= 10 s",
      met: r.lapse.jobMs <= 10_000,
    },
    { figure: "lapse job / floor", value: `${r.lapse.ratio}x`, target: "<= 3x", met: r.lapse.ratio <= 3 },
    {
      figure: "upload-and-extract p95",
      value: `${r.upload.p95} ms`,
      target: "<= 300 ms",
      met: r.upload.p95 <= 300,
    },
    {
      figure: "sign-in route JS (gzip)",
      value: `${r.client.signInRouteGzipKb} KB`,
      target: "<= 150 KB",
      met: r.client.signInRouteGzipKb <= 150,
    },
    {
      figure: "all JS (gzip)",
      value: `${r.client.allJsGzipKb} KB`,
      target: "<= 450 KB",
      met: r.client.allJsGzipKb <= 450,
    },
    {
      figure: "first directory results (LCP)",
      value: `${r.firstResults.lcpMs} ms`,
      target: "<= 1500 ms",
      met: r.firstResults.lcpMs <= 1500,
    },
    {
      figure: "server peak RSS",
      value: `${r.serverPeakRssMb} MB`,
      target: "<= 300 MB",
      met: r.serverPeakRssMb <= 300,
    },
  ];
}

export function renderMarkdown(r: BenchResults): string {
  const lines = [
    `# Clearbench bench, ${r.finishedAt}`,
    "",
    `Machine: ${r.machine.cpus} CPUs (${r.machine.cpuModel}), ${r.machine.memoryGb} GB, Node ${r.machine.node}, PostgreSQL ${r.machine.postgres}.`,
    `Load: autocannon, ${r.settings.connections} connections, ${r.settings.seconds} s each after ${r.settings.warmupSeconds} s of warm-up. Whole run ${Math.round(r.durationSeconds)} s.`,
    `Data set: ${Object.entries(r.dataSet)
      .map(([k, v]) => `${v} ${k}`)
      .join(", ")}.`,
    "",
    "| scenario | requests/s | p50 ms | p95 ms | p99 ms | non-2xx/errors |",
    "|---|---:|---:|---:|---:|---:|",
    ...r.http.map(
      (h) =>
        `| ${h.name} | ${h.requestsPerSecond} | ${ms(h.p50)} | ${ms(h.p95)} | ${ms(h.p99)} | ${h.errors} |`,
    ),
    "",
    "| directory search | B2/B0 | B2/B1 |",
    "|---|---:|---:|",
    ...r.ratios.map((x) => `| ${x.name} | ${x.b2OverB0.toFixed(3)} | ${x.b2OverB1.toFixed(2)} |`),
    "",
    `Lapse job as of ${r.lapse.asOf}: ${r.lapse.lapsed} lapsed, ${r.lapse.noticesCreated} notices, ${r.lapse.emailsQueued} e-mails queued, ` +
      `${r.lapse.changedStandings} standings changed, ${r.lapse.statements} statements, ${r.lapse.jobMs} ms ` +
      `(steps ms: ${Object.entries(r.lapse.jobSteps)
        .map(([k, v]) => `${k} ${v}`)
        .join(
          ", ",
        )}); floor (${r.lapse.floor.statements} statements, BEGIN and COMMIT included: lapse, warn, queue, standings; steps ms: ${Object.entries(
        r.lapse.floor.steps,
      )
        .map(([k, v]) => `${k} ${v}`)
        .join(", ")}; rows: ${Object.entries(r.lapse.floor.rows)
        .map(([k, v]) => `${k} ${v}`)
        .join(", ")}) ${r.lapse.floorMs} ms; ratio ${r.lapse.ratio}x.`,
    `Upload and extract (two-page certificate, ${r.upload.uploads} uploads one at a time): p50 ${r.upload.p50} ms, p95 ${r.upload.p95} ms. ` +
      `A ${(r.upload.bigFileBytes / 1024 / 1024).toFixed(2)} MB upload (answer ${r.upload.bigFileStatus}): server RSS ${r.upload.rssBeforeMb} MB -> peak ${r.upload.rssPeakMb} MB (+${r.upload.rssGrowthMb} MB).`,
    `Client: sign-in route JS ${r.client.signInRouteGzipKb} KB gzip (${r.client.signInFiles.length} files), all JS ${r.client.allJsGzipKb} KB gzip. ` +
      `First directory results in Chromium: LCP ${r.firstResults.lcpMs} ms, first result visible ${r.firstResults.resultsVisibleMs} ms.`,
    `Server peak RSS over the run: ${r.serverPeakRssMb} MB. Sequential scans of large tables in the saved directory plans: ${r.seqScansOnHotPath.length ? r.seqScansOnHotPath.join(", ") : "none"}.`,
    "",
    "| target | measured | target | met |",
    "|---|---:|---:|:---:|",
    ...targetsOf(r).map((t) => `| ${t.figure} | ${t.value} | ${t.target} | ${t.met ? "yes" : "**no**"} |`),
    "",
  ];
  return lines.join("\n");
}
