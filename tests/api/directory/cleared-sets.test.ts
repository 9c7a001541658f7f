import { describe, expect, it } from "vitest";
import { useTestApp } from "../../support/test-app.ts";
import {
  buildClearedProvider,
  buildCredentialRow,
  insuranceFields,
} from "../../fixtures/build-credential-row.ts";
import { runLapseJob } from "../../../jobs/lapse.ts";
import { refreshStandingsForHolder } from "../../../server/standing/index.ts";
import { db } from "../../../server/db/sequelize.ts";
import { JOB_DEPS, rows, storedStanding } from "../../jobs/job-support.ts";

// The directory reads "listed by the baseline / by set N" from technicians.cleared_sets, kept by a trigger on
// technician_standings; these checks hold it to the stored standing it mirrors through a lapse and a renewal.
useTestApp();

async function clearedSets(technicianId: number): Promise<number[]> {
  const [row] = await rows<{ cleared_sets: number[] }>("SELECT cleared_sets FROM technicians WHERE id = $1", [
    technicianId,
  ]);
  return row!.cleared_sets;
}

const refresh = (companyId: number, asOf: Date) =>
  db().transaction((tx) => refreshStandingsForHolder({ companyId, technicianId: null }, tx, asOf));

describe("stored cleared-now fact on the technician's row", () => {
  it("leaves the baseline when the general liability lapses and returns when a renewal is verified", async () => {
    // General liability ends 2027-07-15 in the company's zone (the policy's expiration date, common practice).
    const p = await buildClearedProvider({ glExpires: "2027-07-15", wcExpires: "2099-01-15" });
    await refresh(p.company.id, new Date("2027-03-01T12:00:00Z"));
    expect(await storedStanding(p.technician.id)).not.toBe("not_cleared");
    expect(await clearedSets(p.technician.id)).toContain(0);

    await runLapseJob({ asOf: new Date("2027-07-20T12:00:00Z") }, JOB_DEPS);
    expect(await storedStanding(p.technician.id)).toBe("not_cleared");
    expect(await clearedSets(p.technician.id)).not.toContain(0);

    await buildCredentialRow({
      companyId: p.company.id,
      submittedBy: p.admin.id,
      timeZone: p.company.timeZone,
      typeCode: "general_liability",
      fields: insuranceFields({ effectiveDate: "2027-07-16", expirationDate: "2028-07-16" }),
    });
    await refresh(p.company.id, new Date("2027-07-20T13:00:00Z"));
    expect(await storedStanding(p.technician.id)).not.toBe("not_cleared");
    expect(await clearedSets(p.technician.id)).toContain(0);
  });

  it("matches the stored standings of every technician, sets included, and empties when the rows are removed", async () => {
    const p = await buildClearedProvider({ glExpires: "2099-07-15", wcExpires: "2099-01-15" });
    await refresh(p.company.id, new Date("2027-03-01T12:00:00Z"));
    const mismatched = await rows<{ id: number }>(
      `SELECT t.id FROM technicians t
        WHERE t.cleared_sets IS DISTINCT FROM coalesce((SELECT array_agg(coalesce(s.requirement_set_id, 0)
                ORDER BY coalesce(s.requirement_set_id, 0)) FROM technician_standings s
               WHERE s.technician_id = t.id AND s.standing IN ('cleared','lapsing')), '{}')`,
    );
    expect(mismatched).toEqual([]);

    await db().query("DELETE FROM technician_standings WHERE technician_id = $1", {
      bind: [p.technician.id],
    });
    expect(await clearedSets(p.technician.id)).toEqual([]);
  });
});
