import { describe, expect, it } from "vitest";
import { useTestApp } from "../../support/test-app.ts";
import { buildClearedProvider, buildTechnician } from "../../fixtures/build-credential-row.ts";
import {
  onStandingsChanged,
  refreshStandingsForHolder,
  type ChangedStanding,
} from "../../../server/standing/index.ts";
import { Credential } from "../../../server/credentials/model.ts";
import { db } from "../../../server/db/sequelize.ts";

useTestApp();

const AS_OF = new Date("2027-03-01T12:00:00Z");

describe("refreshStandingsForHolder", () => {
  it("recomputes every technician of the company when a company-held policy changes, and returns the changes", async () => {
    const p = await buildClearedProvider({ glExpires: "2099-01-01", wcExpires: "2099-01-01" });
    const second = await buildTechnician(p.company.id);
    await db().transaction((tx) =>
      refreshStandingsForHolder({ companyId: p.company.id, technicianId: null }, tx, AS_OF),
    );
    await Credential.update(
      { state: "returned", returnReason: "Wrong insured name" },
      { where: { id: p.workersComp.id } },
    );

    const changes = await db().transaction((tx) =>
      refreshStandingsForHolder({ companyId: p.company.id, technicianId: null }, tx, AS_OF),
    );

    const baseline = changes
      .filter((c) => c.requirementSetId === null)
      .sort((a, b) => a.technicianId - b.technicianId);
    expect(baseline).toEqual([
      {
        technicianId: p.technician.id,
        companyId: p.company.id,
        requirementSetId: null,
        before: "cleared",
        after: "not_cleared",
        earliestLapse: expect.any(String),
      },
      {
        technicianId: second.id,
        companyId: p.company.id,
        requirementSetId: null,
        before: "cleared",
        after: "not_cleared",
        earliestLapse: expect.any(String),
      },
    ]);
  });

  it("returns nothing when nothing changed", async () => {
    const p = await buildClearedProvider({ glExpires: "2099-01-01", wcExpires: "2099-01-01" });
    await db().transaction((tx) =>
      refreshStandingsForHolder({ companyId: p.company.id, technicianId: p.technician.id }, tx, AS_OF),
    );

    const again = await db().transaction((tx) =>
      refreshStandingsForHolder({ companyId: p.company.id, technicianId: p.technician.id }, tx, AS_OF),
    );

    expect(again).toEqual([]);
  });

  it("tells onStandingsChanged listeners after commit, and never about a rolled-back change", async () => {
    const committed = await buildClearedProvider({ glExpires: "2099-01-01", wcExpires: "2099-01-01" });
    const rolledBack = await buildClearedProvider({ glExpires: "2099-01-01", wcExpires: "2099-01-01" });
    const heard: ChangedStanding[] = [];
    const stop = onStandingsChanged((changes) => {
      heard.push(...changes);
    });

    await db().transaction((tx) =>
      refreshStandingsForHolder(
        { companyId: committed.company.id, technicianId: committed.technician.id },
        tx,
        AS_OF,
      ),
    );
    await db()
      .transaction(async (tx) => {
        await refreshStandingsForHolder(
          { companyId: rolledBack.company.id, technicianId: rolledBack.technician.id },
          tx,
          AS_OF,
        );
        throw new Error("the credential decision failed");
      })
      .catch(() => undefined);
    stop();

    expect(heard.map((c) => c.technicianId)).toContain(committed.technician.id);
    expect(heard.map((c) => c.technicianId)).not.toContain(rolledBack.technician.id);
  });
});
