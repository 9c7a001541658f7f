import { describe, expect, it } from "vitest";
import { evaluateRequirement } from "../../../shared/standing/evaluate-requirement.ts";
import type { Requirement } from "../../../shared/standing/requirements.ts";
import { buildInsuranceCredential } from "./build-standing-credential.ts";

const options = { timeZone: "America/Chicago", asOf: new Date("2027-01-10T15:00:00Z") };
const generalLiability: Requirement = { label: "General liability", typeCodes: ["general_liability"] };

describe("requirement details read by buyers", () => {
  it("name a credential by its type and printed number, never by an internal id", () => {
    const policy = buildInsuranceCredential({ id: 987_654 }, { policyNumber: "GL-4471" });

    const met = evaluateRequirement(generalLiability, [policy], options);
    const lapsed = evaluateRequirement(generalLiability, [{ ...policy, state: "lapsed" }], options);

    for (const result of [met, lapsed]) {
      expect(result.detail).toContain("Commercial general liability GL-4471");
      expect(result.detail).not.toContain("987654");
      expect(result.detail).not.toMatch(/credential \d/);
    }
  });
});
