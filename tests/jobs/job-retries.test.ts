import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { buildTestApp, type TestApp } from "../support/test-app.ts";
import { buildCompany } from "../support/build-company.ts";
import {
  buildClearedProvider,
  buildCredentialRow,
  trainingFields,
} from "../fixtures/build-credential-row.ts";
import { runLapseJob } from "../../jobs/lapse.ts";
import { claimTick, TICK_LEASE_MS } from "../../jobs/claim-tick.ts";
import { retryDueTicks, runScheduledTick, type TickDeps } from "../../jobs/run-tick.ts";
import { listJobRuns } from "../../server/standing/job-runs.ts";
import { DAY, rows } from "./job-support.ts";

let t: TestApp;
let adminEmail: string;
let adminId: number;
beforeAll(async () => {
  t = buildTestApp();
  const { users } = await buildCompany("platform", ["admin"]);
  adminEmail = users.admin!.email;
  adminId = users.admin!.id;
});
afterAll(() => t.close());

const MINUTE = 60_000;

function clockAt(start: Date) {
  let now = start.getTime();
  return { now: () => new Date(now), advance: (ms: number) => (now += ms) };
}

function depsWith(clock: { now: () => Date }, retryDelaysMs = [1, 5, 15].map((m) => m * MINUTE)): TickDeps {
  return { retryDelaysMs, publicUrl: "https://clearbench.test", now: clock.now };
}

const uniqueJob = () => `test_${randomUUID().slice(0, 12)}`;

async function adminAlerts(job: string) {
  const notes = await rows<{ title: string; body: string }>(
    "SELECT title, body FROM notifications WHERE user_id = $1 AND kind = 'job_failed' AND body LIKE $2",
    [adminId, `%"${job}"%`],
  );
  const mails = await rows<{ subject: string }>(
    "SELECT subject FROM outbox_messages WHERE to_address = $1 AND text_body LIKE $2",
    [adminEmail, `%"${job}"%`],
  );
  return { notes: notes.length, mails: mails.length };
}

async function tickState(job: string) {
  const [row] = await rows<{ status: string; attempts: number; next_attempt_at: Date | null }>(
    "SELECT status, attempts, next_attempt_at FROM job_ticks WHERE job = $1",
    [job],
  );
  return row;
}

describe("a failed scheduled run", () => {
  it("is retried after its backoff and succeeds, with the failure recorded and the admins told once", async () => {
    // A card that ended yesterday: the lapse job must take it out of "verified" on the retry, not tomorrow.
    const provider = await buildClearedProvider({ glExpires: "2028-06-01" });
    const clock = clockAt(new Date(Date.now() + DAY));
    const card = await buildCredentialRow({
      companyId: provider.company.id,
      technicianId: provider.technician.id,
      typeCode: "arc_flash",
      fields: trainingFields({
        issueDate: "2024-01-10",
        expiryDate: new Date(Date.now() - DAY).toISOString().slice(0, 10),
      }),
      submittedBy: provider.admin.id,
    });
    const job = uniqueJob();
    let calls = 0;
    const flaky = async (asOf: Date) => {
      calls += 1;
      if (calls === 1) throw new Error("connection terminated unexpectedly");
      return runLapseJob({ asOf });
    };
    const deps = depsWith(clock);

    const first = await runScheduledTick(job, clock.now(), flaky, deps);
    const afterFailure = await tickState(job);
    clock.advance(30_000);
    const tooSoon = await retryDueTicks({ [job]: flaky }, deps);
    clock.advance(31_000);
    const retried = await retryDueTicks({ [job]: flaky }, deps);

    expect(first).toBe("failed");
    expect(afterFailure?.status).toBe("retrying");
    expect(tooSoon).toBe(0);
    expect(retried).toBe(1);
    expect(calls).toBe(2);
    expect(await tickState(job)).toMatchObject({ status: "succeeded", attempts: 2 });
    const failures = await rows<{ attempt: number; error: string; finished_at: Date }>(
      "SELECT attempt, error, finished_at FROM job_runs WHERE job = $1",
      [job],
    );
    expect(failures).toEqual([
      { attempt: 1, error: "connection terminated unexpectedly", finished_at: expect.any(Date) },
    ]);
    expect(await adminAlerts(job)).toEqual({ notes: 1, mails: 1 });
    // The admins' job-runs page lists the failed attempt with its reason.
    expect((await listJobRuns(200)).find((r) => r.job === job)).toMatchObject({
      attempt: 1,
      error: "connection terminated unexpectedly",
    });
    const [lapsed] = await rows<{ state: string }>("SELECT state FROM credentials WHERE id = $1", [card.id]);
    expect(lapsed?.state).toBe("lapsed");
  });

  it("stops after the configured attempts, marked failed, and tells the admins that it gave up", async () => {
    const clock = clockAt(new Date(Date.now() + 2 * DAY));
    const job = uniqueJob();
    let calls = 0;
    const broken = async () => {
      calls += 1;
      throw new Error("disk full");
    };
    const deps = depsWith(clock, [MINUTE, 2 * MINUTE]);

    await runScheduledTick(job, clock.now(), broken, deps);
    for (let i = 0; i < 5; i += 1) {
      clock.advance(3 * MINUTE);
      await retryDueTicks({ [job]: broken }, deps);
    }

    expect(calls).toBe(3);
    expect(await tickState(job)).toMatchObject({ status: "failed", attempts: 3, next_attempt_at: null });
    const runs = await rows<{ attempt: number }>(
      "SELECT attempt FROM job_runs WHERE job = $1 ORDER BY attempt",
      [job],
    );
    expect(runs.map((r) => r.attempt)).toEqual([1, 2, 3]);
    expect(await adminAlerts(job)).toEqual({ notes: 2, mails: 2 });
  });

  it("retries a run that crashed without a word once its lease has run out", async () => {
    const clock = clockAt(new Date(Date.now() + 3 * DAY));
    const job = uniqueJob();
    let calls = 0;
    const work = async () => {
      calls += 1;
    };
    // Another instance claimed the tick and died before recording anything.
    await claimTick(job, clock.now(), clock.now());
    const deps = depsWith(clock);

    clock.advance(TICK_LEASE_MS - MINUTE);
    const whileLeased = await retryDueTicks({ [job]: work }, deps);
    clock.advance(2 * MINUTE);
    const afterLease = await retryDueTicks({ [job]: work }, deps);

    expect(whileLeased).toBe(0);
    expect(afterLease).toBe(1);
    expect(calls).toBe(1);
    expect(await tickState(job)).toMatchObject({ status: "succeeded", attempts: 2 });
    const runs = await rows<{ error: string }>("SELECT error FROM job_runs WHERE job = $1", [job]);
    expect(runs).toEqual([{ error: "the run stopped without finishing" }]);
  });
});

describe("two instances", () => {
  it("run each tick once, and each retry once", async () => {
    const clock = clockAt(new Date(Date.now() + 4 * DAY));
    const job = uniqueJob();
    let calls = 0;
    const failsOnce = async () => {
      calls += 1;
      await new Promise((r) => setTimeout(r, 50));
      if (calls === 1) throw new Error("lock timeout");
    };
    const deps = depsWith(clock);
    const tick = clock.now();

    const outcomes = await Promise.all([
      runScheduledTick(job, tick, failsOnce, deps),
      runScheduledTick(job, tick, failsOnce, deps),
    ]);
    clock.advance(2 * MINUTE);
    const retries = await Promise.all([
      retryDueTicks({ [job]: failsOnce }, deps),
      retryDueTicks({ [job]: failsOnce }, deps),
    ]);

    expect(outcomes.sort()).toEqual(["failed", "skipped"]);
    expect(retries.sort()).toEqual([0, 1]);
    expect(calls).toBe(2);
    expect(await adminAlerts(job)).toEqual({ notes: 1, mails: 1 });
  });
});
