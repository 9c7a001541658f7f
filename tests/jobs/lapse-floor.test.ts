import { describe, expect, it } from "vitest";
import pg from "pg";
import { useTestApp } from "../support/test-app.ts";
import { buildClearedProvider } from "../fixtures/build-credential-row.ts";
import { runLapseJob } from "../../jobs/lapse.ts";
import { measureLapseFloor } from "../../jobs/bench/lapse-floor.ts";
import { JOB_DEPS } from "./job-support.ts";

const t = useTestApp();

// The bench's floor must do the job's work, no less, or its ratio flatters nobody: same lapses, notices and e-mails.
describe("lapse job floor", () => {
  it("lapses, warns and queues the same rows as the job does on the same data", async () => {
    // Lapsing on the run's day, and inside the 7-day warning window, respectively (common practice: warn before a lapse).
    await buildClearedProvider({ glExpires: "2031-07-15", wcExpires: "2031-07-20" });
    await buildClearedProvider({ glExpires: "2031-07-15", wcExpires: "2031-09-01" });
    const asOf = new Date("2031-07-15T12:00:00Z");
    const client = new pg.Client({ connectionString: t.config.DATABASE_URL! });
    await client.connect();
    const floor = await measureLapseFloor(client, { ...JOB_DEPS, asOf, changed: [], rollback: true }).finally(
      () => client.end(),
    );

    const job = await runLapseJob({ asOf }, JOB_DEPS);
    if (job.skipped) throw new Error("lapse job unexpectedly skipped");

    expect(job.lapsed).toBeGreaterThan(0);
    expect(floor.rows.warned).toBeGreaterThan(0);
    expect(floor.rows.lapsed).toBe(job.lapsed);
    expect(floor.rows.lapsed! + floor.rows.warned!).toBe(job.noticesCreated);
    expect(floor.rows.emails).toBe(job.emailsQueued);
  });
});
