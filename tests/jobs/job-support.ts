import { spawn } from "node:child_process";
import { QueryTypes } from "sequelize";
import { db } from "../../server/db/sequelize.ts";

export const JOB_DEPS = { warningDays: [60, 30, 14, 7, 1], publicUrl: "https://clearbench.test" } as const;

export const HOUR = 3_600_000;
export const DAY = 24 * HOUR;

export async function rows<T extends object>(sql: string, bind: unknown[] = []): Promise<T[]> {
  return db().query<T>(sql, { bind, type: QueryTypes.SELECT });
}

export async function storedStanding(technicianId: number, requirementSetId: number | null = null) {
  const [row] = await rows<{ standing: string; computed_at: Date }>(
    "SELECT standing, computed_at FROM technician_standings WHERE technician_id = $1 AND coalesce(requirement_set_id, 0) = $2",
    [technicianId, requirementSetId ?? 0],
  );
  return row?.standing ?? null;
}

export async function noticeThresholds(credentialId: number): Promise<number[]> {
  const found = await rows<{ threshold_days: number }>(
    "SELECT threshold_days FROM notices WHERE credential_id = $1 ORDER BY threshold_days DESC",
    [credentialId],
  );
  return found.map((r) => r.threshold_days);
}

/** Delivers every due outbox row (the sender works in batches of 50; other tests may have left mail queued). */
export async function deliverAll(catcher: {
  deliver(now?: Date): Promise<{ sent: number; retried: number; failed: number }>;
}) {
  for (let round = 0; round < 200; round += 1) {
    const report = await catcher.deliver(new Date(Date.now() + 1_000));
    if (report.sent + report.retried + report.failed === 0) return;
  }
}

/** `npm run job:<name>` as its own process, exactly what a second server instance or an operator would run. */
export function runJobCli(
  args: string[],
  env: { DATABASE_URL: string | undefined; SMTP_URL: string | undefined },
): Promise<{ code: number | null; out: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ["--import", "tsx", "jobs/cli.ts", ...args], {
      env: { ...process.env, ...env, LOG_LEVEL: "silent" },
      stdio: ["ignore", "pipe", "pipe"],
    });
    let out = "";
    child.stdout.on("data", (d: Buffer) => (out += d.toString()));
    child.stderr.on("data", (d: Buffer) => (out += d.toString()));
    child.once("error", reject);
    child.once("close", (code) => resolve({ code, out }));
  });
}
