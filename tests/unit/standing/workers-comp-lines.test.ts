import { describe, expect, it } from "vitest";
import { evaluateRequirement } from "../../../shared/standing/evaluate-requirement.ts";
import type { Requirement } from "../../../shared/standing/requirements.ts";
import { buildInsuranceCredential } from "./build-standing-credential.ts";

const options = { timeZone: "America/Chicago", asOf: new Date("2027-01-10T15:00:00Z") };

// Workers' compensation Part One pays the benefits set by state statute, shown as "Per statute" on a certificate;
// Part Two (employer's liability) shows three limits: each accident, disease each employee, disease policy limit.
// $500,000 / $500,000 / $500,000 is a common site minimum (common practice).
const workersComp = (fields = {}) =>
  buildInsuranceCredential(
    { typeCode: "workers_comp" },
    {
      policyNumber: "WC-310",
      statutory: true,
      limits: {
        employersLiabilityEachAccident: 1_000_000,
        employersLiabilityDiseaseEachEmployee: 500_000,
        employersLiabilityDiseasePolicyLimit: 1_000_000,
      },
      ...fields,
    },
  );

const elLimits: Requirement = {
  label: "WC statutory, EL 500/500/500",
  typeCodes: ["workers_comp"],
  statutory: true,
  minLimits: {
    employersLiabilityEachAccident: 500_000,
    employersLiabilityDiseaseEachEmployee: 500_000,
    employersLiabilityDiseasePolicyLimit: 500_000,
  },
};

describe("workers' compensation: statutory limits and employer's liability lines", () => {
  it("is met with statutory benefits and each employer's liability limit at or above the minimum", () => {
    const result = evaluateRequirement(elLimits, [workersComp()], options);

    expect(result.status).toBe("met");
    expect(result.limitLines?.map((l) => [l.limit, l.shown, l.met])).toEqual([
      ["employersLiabilityEachAccident", 1_000_000, true],
      ["employersLiabilityDiseaseEachEmployee", 500_000, true],
      ["employersLiabilityDiseasePolicyLimit", 1_000_000, true],
    ]);
    expect(result.metBy).toContain("WC/EL $500K employers liability disease each employee");
  });

  it("is unmet when the certificate does not show statutory limits", () => {
    const result = evaluateRequirement(elLimits, [workersComp({ statutory: false })], options);

    expect(result).toMatchObject({ status: "unmet", reason: "flag_absent" });
    expect(result.detail).toContain("statutory");
  });

  it("compares each employer's liability limit on its own line and names every one that falls short", () => {
    const low = workersComp({
      limits: {
        employersLiabilityEachAccident: 1_000_000,
        employersLiabilityDiseaseEachEmployee: 100_000,
        employersLiabilityDiseasePolicyLimit: 100_000,
      },
    });

    const result = evaluateRequirement(elLimits, [low], options);

    expect(result.reason).toBe("below_limit");
    expect(result.limitLines?.map((l) => l.met)).toEqual([true, false, false]);
    expect(result.detail).toContain("disease each employee is 100,000");
    expect(result.detail).toContain("disease policy limit is 100,000");
  });
});
