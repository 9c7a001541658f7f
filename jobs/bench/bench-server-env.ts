import path from "node:path";

export const BENCH_GATE_SECRET = "bench-gate-secret-0123456789abcdef012345";

/** The environment of the server under test: production mode on the large data set (full run and `--hot` alike). */
export function benchServerEnv(
  databaseUrl: string,
  scratch: string,
  clientDir?: string,
): Record<string, string> {
  return {
    NODE_ENV: "production",
    SESSION_SECRET: "bench-session-secret-0123456789abcdef",
    GATE_SECRET: BENCH_GATE_SECRET,
    DATABASE_URL: databaseUrl,
    UPLOADS_DIR: path.join(scratch, "uploads"),
    ...(clientDir ? { CLIENT_DIR: clientDir } : {}),
    RUN_SCHEDULE: "false",
    LOG_LEVEL: "info",
    SMTP_URL: "",
    // The sign-in scenario's 20 connections all wait for a hash at once; a queue that holds them all measures
    // hashing throughput rather than the 503s that shed load beyond the default queue of 16.
    HASH_QUEUE: "32",
    // All load comes from one address: a shed sign-in (503) counts as a failure, and the address limit would then
    // refuse the browser's own sign-in later in the run. Non-2xx answers are still counted per scenario.
    SIGN_IN_FAILURES_PER_IP_PER_15_MIN: "1000000",
    // The same for the gate check's per-address limit: the load is one machine standing in for many gates.
    GATE_CHECKS_PER_IP_PER_MINUTE: "100000000",
  };
}
