import { describe, expect, it } from "vitest";
import { computeTechnicianStanding } from "../../../shared/standing/compute-standing.ts";
import { evaluateRequirement } from "../../../shared/standing/evaluate-requirement.ts";
import type { Requirement } from "../../../shared/standing/requirements.ts";
import type { StandingCredential } from "../../../shared/standing/standing-types.ts";

// Common practice, varies by state: a state exempts named persons (a sole proprietor, or corporate officers or LLC
// members) from carrying workers' compensation for themselves, never the company's employees.
const options = { timeZone: "America/Chicago", asOf: new Date("2027-01-10T15:00:00Z") };
const workersComp: Requirement = {
  label: "Workers' compensation or a state exemption",
  typeCodes: ["workers_comp", "workers_comp_exemption"],
};

const exemption = (fields: Record<string, unknown> = {}): StandingCredential => ({
  id: 501,
  typeCode: "workers_comp_exemption",
  state: "verified",
  holder: "company",
  fields: {
    holderName: "Rowan Ashgrove",
    state: "TX",
    certificateNumber: "EX-77",
    issueDate: "2026-03-01",
    personsCovered: ["Ashgrove, Rowan T."],
    technicianIds: [],
    ...fields,
  } as StandingCredential["fields"],
});

const rowan = { id: 11, name: "Rowan Ashgrove" };
const imke = { id: 12, name: "Imke Vossberg" };

describe("workers' compensation exemptions", () => {
  it("clears the person it names, matching the name whatever its order and punctuation", () => {
    const result = evaluateRequirement(workersComp, [exemption()], {
      ...options,
      technician: rowan,
      companyHeadcount: 1,
    });

    expect(result).toMatchObject({ status: "met", metBy: "TX exemption" });
  });

  it("does not clear a technician it does not name", () => {
    const result = evaluateRequirement(workersComp, [exemption()], {
      ...options,
      technician: imke,
      companyHeadcount: 1,
    });

    expect(result).toMatchObject({ status: "unmet", reason: "exemption_does_not_cover" });
    expect(result.detail).toContain("not Imke Vossberg");
  });

  it("clears a technician ticked on the form even when the printed name is spelled otherwise", () => {
    const result = evaluateRequirement(
      workersComp,
      [exemption({ personsCovered: ["R. T. Ashgrove-Lyle"], technicianIds: [rowan.id] })],
      { ...options, technician: rowan, companyHeadcount: 1 },
    );

    expect(result.status).toBe("met");
  });

  it("cannot stand in for a policy when the company has more people than the exemption names", () => {
    const result = evaluateRequirement(workersComp, [exemption()], {
      ...options,
      technician: rowan,
      companyHeadcount: 3,
    });

    expect(result.reason).toBe("exemption_does_not_cover");
    expect(result.detail).toContain("3 technicians");
  });

  it("clears two officers named on one exemption in a company of two", () => {
    const officers = exemption({ personsCovered: ["Rowan Ashgrove", "Imke Vossberg"] });

    const standing = computeTechnicianStanding({
      companyCredentials: [officers],
      technicianCredentials: [],
      requirements: [workersComp],
      companyTimeZone: "America/Chicago",
      technician: imke,
      companyHeadcount: 2,
      asOf: options.asOf,
    });

    expect(standing.standing).toBe("cleared");
  });

  it("lapses 24 months from issue when no expiry is printed (common practice, varies by state)", () => {
    const result = evaluateRequirement(workersComp, [exemption({ issueDate: "2024-12-01" })], {
      ...options,
      technician: rowan,
      companyHeadcount: 1,
    });

    // Issued 2024-12-01 + 24 months = valid through 2026-12-01, before asOf 2027-01-10.
    expect(result).toMatchObject({ status: "unmet", reason: "lapsed" });
  });

  it("uses the holder's name as the one person covered on an exemption stored without a list", () => {
    const result = evaluateRequirement(
      workersComp,
      [exemption({ personsCovered: [], holderName: "Rowan Ashgrove" })],
      { ...options, technician: rowan, companyHeadcount: 1 },
    );

    expect(result.status).toBe("met");
  });
});
