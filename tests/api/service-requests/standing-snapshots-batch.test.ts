import { describe, expect, it } from "vitest";
import { useTestApp } from "../../support/test-app.ts";
import {
  buildClearedProvider,
  buildCredentialRow,
  buildTechnician,
  trainingFields,
} from "../../fixtures/build-credential-row.ts";
import { refreshStandingsForHolder } from "../../../server/standing/index.ts";
import { standingSnapshotsNow } from "../../../server/work-orders/standing-now.ts";
import { db } from "../../../server/db/sequelize.ts";
import { storedStanding } from "../../jobs/job-support.ts";

// The estimate comparison builds every technician's snapshot in one batch; each must still be judged on its own
// credentials and its own company's, and agree with the standing the refresh code stores for the same instant.
useTestApp();

const AS_OF = new Date("2027-03-01T12:00:00Z");

describe("standing snapshots of several technicians at once", () => {
  it("judges each technician on their own and their company's credentials only", async () => {
    // One company insured until 2099, one whose general liability ended 2027-01-15 (before AS_OF).
    const insured = await buildClearedProvider({ glExpires: "2099-07-15", wcExpires: "2099-01-15" });
    const lapsed = await buildClearedProvider({ glExpires: "2027-01-15", wcExpires: "2099-01-15" });
    const colleague = await buildTechnician(insured.company.id);
    // A card held by one technician only (NFPA 70E arc-flash training, issued 2026-05-15).
    await buildCredentialRow({
      companyId: insured.company.id,
      submittedBy: insured.admin.id,
      timeZone: insured.company.timeZone,
      technicianId: insured.technician.id,
      typeCode: "arc_flash",
      fields: trainingFields({ issueDate: "2026-05-15" }),
    });
    const ids = [insured.technician.id, colleague.id, lapsed.technician.id];
    for (const companyId of [insured.company.id, lapsed.company.id])
      await db().transaction((tx) => refreshStandingsForHolder({ companyId, technicianId: null }, tx, AS_OF));

    const snapshots = await standingSnapshotsNow([...ids, 987_654_321], null, AS_OF, 30);

    expect([...snapshots.keys()].sort((a, b) => a - b)).toEqual([...ids].sort((a, b) => a - b));
    for (const id of ids) expect(snapshots.get(id)!.standing).toBe(await storedStanding(id));
    expect(snapshots.get(lapsed.technician.id)!.standing).toBe("not_cleared");
    const cited = (id: number) =>
      snapshots
        .get(id)!
        .targets.flatMap((target) => target.requirements.map((r) => r.credential?.typeName ?? null))
        .filter((n): n is string => n !== null);
    // The colleague shares the company's insurance but never the other technician's card.
    expect(cited(insured.technician.id).length).toBeGreaterThanOrEqual(cited(colleague.id).length);
    expect(snapshots.get(colleague.id)!.technicianName).toBe(colleague.name);
  });
});
