import { describe, expect, it } from "vitest";
import { loadConfig } from "../../server/config.ts";
import { startSchedule } from "../../jobs/schedule.ts";
import type { Mailer } from "../../server/mail/index.ts";

const quietMailer: Mailer = { send: async () => undefined, close: () => undefined };

describe("job schedule", () => {
  it("runs the lapse job and the reviewer digest daily at 06:00 in the configured zone, and the outbox every minute", async () => {
    const config = loadConfig({ ...process.env, JOB_TIME_ZONE: "America/Chicago", JOB_CRON: "0 6 * * *" });

    const schedule = startSchedule(config, { mailer: quietMailer });
    const byName = new Map(schedule.tasks.map((task) => [task.name, task]));
    const nextLapse = byName.get("lapse")?.getNextRun();
    await schedule.stop();

    expect([...byName.keys()]).toEqual(["lapse", "reviewer-digest", "upload-sweep", "job-retries", "outbox"]);
    expect(byName.get("job-retries")?.getPattern()).toBe("* * * * *");
    expect(byName.get("outbox")?.getPattern()).toBe("* * * * *");
    // 06:00 in Chicago is 11:00Z in summer (CDT, UTC-5) and 12:00Z in winter (CST, UTC-6): IANA zone data.
    expect(nextLapse && [11, 12]).toContain(nextLapse?.getUTCHours());
    expect(nextLapse?.getUTCMinutes()).toBe(0);
  });
});
