import { describe, expect, it } from "vitest";
import { useTestApp } from "../../support/test-app.ts";
import { useDirectoryWorld } from "../../support/directory-suite.ts";
import { db } from "../../../server/db/sequelize.ts";
import { evaluateRequirement } from "../../../shared/standing/evaluate-requirement.ts";
import type { Requirement } from "../../../shared/standing/requirements.ts";
import { buildInsuranceCredential } from "../../unit/standing/build-standing-credential.ts";
import { readAllPages } from "./directory-pages.ts";

const t = useTestApp();
const { world, buyer } = useDirectoryWorld(t, { seed: 11 });

// Common practice: an umbrella of $4,000,000 over general liability of $1,000,000 meets $5,000,000 each occurrence.
const fiveMillion: Requirement = {
  label: "Liability $5M each occurrence",
  typeCodes: ["general_liability"],
  minLimits: { eachOccurrence: 5_000_000 },
};

describe("directory: how each requirement was met", () => {
  it("shows, per listed technician, the stacked limits stored with the standing for the chosen set", async () => {
    const listed = world.technicians.find(
      (x) =>
        x.active &&
        (x.baseline === "cleared" || x.baseline === "lapsing") &&
        (x.setStanding === "cleared" || x.setStanding === "lapsing"),
    )!;
    const asOf = new Date("2027-01-10T15:00:00Z");
    const result = evaluateRequirement(
      fiveMillion,
      [
        buildInsuranceCredential(),
        buildInsuranceCredential(
          { typeCode: "umbrella_liability" },
          {
            policyNumber: "UMB-88",
            limits: { umbrellaEachOccurrence: 4_000_000, umbrellaAggregate: 4_000_000 },
          },
        ),
      ],
      { timeZone: "America/Chicago", asOf },
    );
    await db().query(
      "UPDATE technician_standings SET results = $1::jsonb WHERE technician_id = $2 AND requirement_set_id = $3",
      { bind: [JSON.stringify([result]), listed.id, world.requirementSetId] },
    );

    const withSet = await readAllPages(buyer, {
      requirementSetId: String(world.requirementSetId),
      limit: "50",
    });
    const row = withSet.rows.find((r) => r.technicianId === listed.id)!;
    expect(row.requirementsMet).toEqual([
      {
        label: "Liability $5M each occurrence",
        metBy: "GL $1M + umbrella $4M each occurrence",
        detail: result.detail,
        lapsing: false,
      },
    ]);
    expect(row.requirementsMet![0]!.detail).toContain("Jul 15, 2027");

    const withoutSet = await readAllPages(buyer, { limit: "50" });
    expect(withoutSet.rows.find((r) => r.technicianId === listed.id)!.requirementsMet).toBeNull();
  });
});
