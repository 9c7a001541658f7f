import type { EventEmitter } from "node:events";
import autocannon from "autocannon";
import { benchSettings } from "./bench-settings.ts";

export interface LoadResult {
  name: string;
  requestsPerSecond: number;
  p50: number;
  p95: number;
  p99: number;
  requests: number;
  errors: number;
}

export interface LoadTarget {
  name: string;
  url: string;
  method?: "GET" | "POST";
  headers?: Record<string, string>;
  /** Paths (or bodies) to rotate through, one per request, e.g. several technicians' pages. */
  paths?: string[];
  bodies?: string[];
}

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return Number.NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;
}

function run(target: LoadTarget, seconds: number, record?: (ms: number, status: number) => void) {
  let i = 0;
  // Without a callback autocannon returns its instance (an EventEmitter for per-response events) that is also a promise.
  const instance = autocannon({
    url: target.url,
    method: target.method ?? "GET",
    headers: target.headers,
    connections: benchSettings.connections,
    duration: seconds,
    requests: [
      {
        setupRequest: (req) => {
          const n = i++;
          const path = target.paths?.[n % target.paths.length];
          const body = target.bodies?.[n % target.bodies.length];
          return { ...req, ...(path ? { path } : {}), ...(body ? { body } : {}) };
        },
      },
    ],
  }) as unknown as EventEmitter & Promise<autocannon.Result>;
  if (record)
    instance.on("response", (_client: unknown, status: number, _bytes: number, responseTime: number) =>
      record(responseTime, status),
    );
  return instance;
}

/**
 * A warm-up, then the measured run at the bench's connection count. Latency percentiles come from every response time
 * (autocannon's own summary has p97.5 but no p95); non-2xx answers count as errors.
 */
export async function measureLoad(
  target: LoadTarget,
  /** Called right before and right after the measured run (not the warm-up), e.g. to read CPU counters. */
  around?: { start(): void; stop(): void },
): Promise<LoadResult> {
  await run(target, benchSettings.warmupSeconds);
  const times: number[] = [];
  around?.start();
  let errors = 0;
  const result = await run(target, benchSettings.seconds, (ms, status) => {
    times.push(ms);
    if (status < 200 || status >= 300) errors += 1;
  });
  around?.stop();
  times.sort((a, b) => a - b);
  return {
    name: target.name,
    requestsPerSecond: Math.round((times.length / benchSettings.seconds) * 10) / 10,
    p50: percentile(times, 50),
    p95: percentile(times, 95),
    p99: percentile(times, 99),
    requests: times.length,
    errors: errors + result.errors + result.timeouts,
  };
}
