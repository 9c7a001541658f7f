import { describe, expect, it } from "vitest";
import { useTestApp } from "../support/test-app.ts";
import { buildClearedProvider, buildTechnician } from "../fixtures/build-credential-row.ts";
import { runLapseJob } from "../../jobs/lapse.ts";
import { checkStandingConsistency } from "../../server/standing/index.ts";
import { db } from "../../server/db/sequelize.ts";
import { JOB_DEPS, rows } from "./job-support.ts";

useTestApp();

const check = (technicianIds?: number[]) =>
  db().transaction((tx) => checkStandingConsistency(tx, { technicianIds }));

describe("standing consistency check", () => {
  it("finds no difference between the stored standings and the engine after the job", async () => {
    const a = await buildClearedProvider({ glExpires: "2027-10-01" });
    const b = await buildClearedProvider({ glExpires: "2027-10-20" });
    const extra = await buildTechnician(a.company.id);

    await runLapseJob({ asOf: new Date("2027-10-01T12:00:00Z") }, JOB_DEPS);
    const result = await check([a.technician.id, b.technician.id, extra.id]);
    const [sets] = await rows<{ n: number }>("SELECT count(*)::int AS n FROM requirement_sets WHERE active");

    // Each technician has a row for the baseline and one per active requirement set.
    expect(result.checked).toBe(3 * (1 + sets!.n));
    expect(result.differences).toEqual([]);
  });

  it("finds the one stored row that was corrupted", async () => {
    const a = await buildClearedProvider({ glExpires: "2027-11-01" });
    await runLapseJob({ asOf: new Date("2027-11-01T12:00:00Z") }, JOB_DEPS);
    await db().query(
      "UPDATE technician_standings SET standing = 'cleared' WHERE technician_id = $1 AND requirement_set_id IS NULL",
      {
        bind: [a.technician.id],
      },
    );

    const result = await check([a.technician.id]);

    expect(result.differences).toEqual([
      {
        technicianId: a.technician.id,
        requirementSetId: null,
        problem: "standing",
        stored: "cleared",
        computed: "not_cleared",
      },
    ]);
  });

  it("reports a technician with no stored standing as missing", async () => {
    const a = await buildClearedProvider();
    const added = await buildTechnician(a.company.id);

    const result = await check([added.id]);

    expect(result.differences.map((d) => d.problem)).toContain("missing");
  });
});
