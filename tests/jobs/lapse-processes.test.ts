import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { spawn } from "node:child_process";
import { buildTestApp, type TestApp } from "../support/test-app.ts";
import { startTestMailCatcher } from "../support/mail-catcher.ts";
import {
  buildClearedProvider,
  buildCredentialRow,
  trainingFields,
} from "../fixtures/build-credential-row.ts";
import { runJobCli } from "./job-support.ts";

let t: TestApp;
let catcher: Awaited<ReturnType<typeof startTestMailCatcher>>;
beforeAll(async () => {
  t = buildTestApp();
  catcher = await startTestMailCatcher();
});
afterAll(async () => {
  await catcher.close();
  await t.close();
});

const runJobProcess = (args: string[]) =>
  runJobCli(["lapse", ...args], { DATABASE_URL: t.config.DATABASE_URL, SMTP_URL: catcher.url });

describe("lapse job in two processes at once", () => {
  it("sends each notice once when two processes run the job and deliver the outbox at the same time", async () => {
    const p = await buildClearedProvider({ glExpires: "2028-06-01" });
    await buildCredentialRow({
      companyId: p.company.id,
      technicianId: p.technician.id,
      typeCode: "arc_flash",
      fields: trainingFields({ issueDate: "2024-09-03" }),
      submittedBy: p.admin.id,
    });

    const [a, b] = await Promise.all([
      runJobProcess(["--as-of", "2027-09-02T12:00:00Z"]),
      runJobProcess(["--as-of", "2027-09-02T12:00:00Z"]),
    ]);

    expect([a.code, b.code]).toEqual([0, 0]);
    expect(a.out + b.out).toMatch(/lapse job as of 2027-09-02T12:00:00.000Z/);
    expect(catcher.to(p.admin.email)).toHaveLength(1);
    expect(catcher.to(p.technicianUser.email)).toHaveLength(1);
  }, 60_000);

  it("tells the user how to point the command at the running demo database when DATABASE_URL is unset", async () => {
    const result = await new Promise<{ code: number | null; out: string }>((resolve) => {
      const child = spawn(process.execPath, ["--import", "tsx", "jobs/cli.ts", "lapse"], {
        env: { ...process.env, DATABASE_URL: "" },
        stdio: ["ignore", "pipe", "pipe"],
      });
      let out = "";
      child.stdout.on("data", (d: Buffer) => (out += d.toString()));
      child.once("close", (code) => resolve({ code, out }));
    });

    expect(result.code).toBe(2);
    expect(result.out).toContain("npm start");
    expect(result.out).toContain("DATABASE_URL=postgres://postgres@127.0.0.1:54329/clearbench");
  }, 30_000);
});
