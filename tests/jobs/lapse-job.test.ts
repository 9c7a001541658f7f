import { describe, expect, it } from "vitest";
import { useTestApp } from "../support/test-app.ts";
import {
  buildClearedProvider,
  buildCredentialRow,
  trainingFields,
} from "../fixtures/build-credential-row.ts";
import { runLapseJob, type LapseJobReport } from "../../jobs/lapse.ts";
import { onStandingsChanged, type ChangedStanding } from "../../server/standing/index.ts";
import { Credential } from "../../server/credentials/model.ts";
import { dueThreshold } from "../../shared/standing/warning-windows.ts";
import { DAY, JOB_DEPS, noticeThresholds, rows, storedStanding } from "./job-support.ts";

useTestApp();

async function run(asOf: string | Date): Promise<LapseJobReport> {
  const result = await runLapseJob({ asOf: new Date(asOf) }, JOB_DEPS);
  if (result.skipped) throw new Error("lapse job unexpectedly skipped");
  return result;
}

describe("daily lapse job: the policy period", () => {
  it("lapses a Chicago policy at 12:01 a.m. standard time on its expiration date, not a second earlier", async () => {
    const provider = await buildClearedProvider({ glExpires: "2027-07-15" });

    await run("2027-07-15T06:00:59Z");
    const before = await Credential.findByPk(provider.generalLiability.id);
    await run("2027-07-15T06:01:00Z");
    const after = await Credential.findByPk(provider.generalLiability.id);

    // America/Chicago, expiring 2027-07-15 (summer) → cut-off 2027-07-15T06:01:00Z (01:01 CDT),
    // from the standard CGL declarations' "12:01 A.M. standard time" (ISO CG DS 01 wording, from memory).
    expect(provider.generalLiability.lapsesAt?.toISOString()).toBe("2027-07-15T06:01:00.000Z");
    expect(before?.state).toBe("verified");
    expect(after?.state).toBe("lapsed");
  });

  it("rejects the local-time reading: at 05:01 UTC in July the Chicago policy is still in force", async () => {
    const provider = await buildClearedProvider({ glExpires: "2027-07-15" });

    await run("2027-07-15T05:01:00Z");

    // 00:01 CDT would be 05:01Z, one hour early: the declarations say standard time.
    expect((await Credential.findByPk(provider.generalLiability.id))?.state).toBe("verified");
  });

  it("turns the technician's stored baseline standing from lapsing to not cleared and reports the change", async () => {
    const provider = await buildClearedProvider({ glExpires: "2027-07-15" });
    const heard: ChangedStanding[] = [];
    const stop = onStandingsChanged((changes) => {
      heard.push(...changes);
    });

    await run("2027-07-15T06:00:59Z");
    const lapsingBefore = await storedStanding(provider.technician.id);
    const report = await run("2027-07-15T06:01:00Z");
    stop();

    expect(lapsingBefore).toBe("lapsing");
    expect(await storedStanding(provider.technician.id)).toBe("not_cleared");
    const change = report.changedStandings.find(
      (c) => c.technicianId === provider.technician.id && c.requirementSetId === null,
    );
    expect(change).toMatchObject({ companyId: provider.company.id, before: "lapsing", after: "not_cleared" });
    expect(heard.some((c) => c.technicianId === provider.technician.id && c.after === "not_cleared")).toBe(
      true,
    );
  });

  it("writes one audit event per lapsed credential", async () => {
    const provider = await buildClearedProvider({ glExpires: "2027-07-15" });

    await run("2027-07-15T06:01:00Z");
    await run("2027-07-16T06:01:00Z");

    const events = await rows<{ action: string }>(
      "SELECT action FROM audit_events WHERE subject_type = 'credential' AND subject_id = $1",
      [provider.generalLiability.id],
    );
    expect(events.map((e) => e.action)).toEqual(["credential.lapsed"]);
  });
});

describe("daily lapse job: warning windows", () => {
  it("creates a notice at 60, 30, 14, 7 and 1 days before a lapse and on the lapse, each exactly once", async () => {
    const provider = await buildClearedProvider({ glExpires: "2028-06-01" });
    // Arc-flash card issued 2024-05-15 counts through 2027-05-15 (NFPA 70E 110.6(A)(3): 36 months), so it stops
    // counting at the start of 2027-05-16 in Chicago (05:00Z, CDT).
    const card = await buildCredentialRow({
      companyId: provider.company.id,
      technicianId: provider.technician.id,
      typeCode: "arc_flash",
      fields: trainingFields({ issueDate: "2024-05-15" }),
      submittedBy: provider.admin.id,
    });
    const lapse = card.lapsesAt!.getTime();
    const offsets = [61, 59.5, 59, 29.5, 29, 13.5, 6.5, 6, 0.5, 0.25, 0, -1];
    const expected: (number | string | null)[] = [];

    for (const days of offsets) {
      const asOf = new Date(lapse - days * DAY);
      expected.push(dueThreshold(card.lapsesAt, asOf, JOB_DEPS.warningDays));
      await run(asOf);
    }

    expect(card.lapsesAt?.toISOString()).toBe("2027-05-16T05:00:00.000Z");
    expect(await noticeThresholds(card.id)).toEqual([60, 30, 14, 7, 1, 0]);
    // The job picks the same window the shared rule names for each instant.
    expect(expected).toEqual([null, 60, 60, 30, 30, 14, 7, 7, 1, 1, "lapsed", "lapsed"]);
  });

  it("sends only the smallest due warning when runs were missed", async () => {
    const provider = await buildClearedProvider({ glExpires: "2028-06-01" });
    const card = await buildCredentialRow({
      companyId: provider.company.id,
      technicianId: provider.technician.id,
      typeCode: "lockout_tagout",
      fields: trainingFields({ issueDate: "2026-09-10" }),
      submittedBy: provider.admin.id,
    });

    await run(new Date(card.lapsesAt!.getTime() - 10 * DAY));

    expect(await noticeThresholds(card.id)).toEqual([14]);
  });

  it("records each run with its counts", async () => {
    const report = await run("2027-02-01T12:00:00Z");

    const [record] = await rows<{
      job: string;
      as_of: Date;
      finished_at: Date | null;
      counts: Record<string, number>;
    }>("SELECT job, as_of, finished_at, counts FROM job_runs WHERE id = $1", [report.jobRunId]);
    expect(record?.job).toBe("lapse");
    expect(new Date(record!.as_of).toISOString()).toBe("2027-02-01T12:00:00.000Z");
    expect(record?.finished_at).not.toBeNull();
    expect(record?.counts).toMatchObject({
      lapsed: report.lapsed,
      noticesCreated: report.noticesCreated,
      statements: report.statements,
    });
  });
});
