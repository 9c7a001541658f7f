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

describe("dates in requirement details", () => {
  const isoDigits = /\d{4}-\d{2}-\d{2}/;

  it("print the day a policy ends as a readable local date, not ISO digits", () => {
    const policy = buildInsuranceCredential({}, { expirationDate: "2027-07-15" });
    const met = evaluateRequirement(generalLiability, [policy], options);
    const later = { ...options, asOf: new Date("2027-08-01T15:00:00Z") };
    const lapsed = evaluateRequirement(generalLiability, [policy], later);

    expect(met.detail).toContain("Jul 15, 2027");
    expect(lapsed.detail).toMatch(/lapsed on Jul 15, 2027\.$/);
    for (const result of [met, lapsed]) expect(result.detail).not.toMatch(isoDigits);
  });

  it("print a policy that has not started yet with its readable first day", () => {
    const policy = buildInsuranceCredential(
      {},
      { effectiveDate: "2027-02-03", expirationDate: "2028-02-03" },
    );
    const result = evaluateRequirement(generalLiability, [policy], options);

    expect(result.detail).toMatch(/starts on Feb 3, 2027\.$/);
  });
});
