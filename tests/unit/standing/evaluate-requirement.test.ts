import { describe, expect, it } from "vitest";
import { evaluateRequirement } from "../../../shared/standing/evaluate-requirement.ts";
import type { Requirement } from "../../../shared/standing/requirements.ts";
import {
  buildInsuranceCredential,
  buildOemCredential,
  buildTrainingCredential,
} from "./build-standing-credential.ts";

const CHICAGO = "America/Chicago";
const asOf = new Date("2027-01-10T15:00:00Z");
const options = { timeZone: CHICAGO, asOf };
const generalLiability: Requirement = { label: "General liability", typeCodes: ["general_liability"] };

describe("requirement evaluation", () => {
  it("is unmet as missing when no credential of the type is on file", () => {
    const result = evaluateRequirement(generalLiability, [buildTrainingCredential()], options);

    expect(result).toMatchObject({ status: "unmet", reason: "missing", credentialId: null });
    expect(result.detail).toContain("Commercial general liability");
  });

  it("is met by a verified policy in force, until its cut-off instant", () => {
    const policy = buildInsuranceCredential();

    const result = evaluateRequirement(generalLiability, [policy], options);

    expect(result).toMatchObject({ status: "met", reason: null, credentialId: policy.id });
    expect(result.lapsesAt).toBe("2027-07-15T06:01:00.000Z"); // 12:01 a.m. CST even in July: CGL declarations' "standard time" (from memory)
  });

  it("is unmet while the only certificate awaits verification", () => {
    const result = evaluateRequirement(
      generalLiability,
      [buildInsuranceCredential({ state: "submitted" })],
      options,
    );

    expect(result).toMatchObject({ status: "unmet", reason: "awaiting_verification" });
  });

  it("is unmet when the only certificate was returned", () => {
    const result = evaluateRequirement(
      generalLiability,
      [buildInsuranceCredential({ state: "returned" })],
      options,
    );

    expect(result).toMatchObject({ status: "unmet", reason: "returned" });
  });

  it("is unmet as lapsed once the cut-off passed, even if the state still says verified", () => {
    const lapsedPolicy = buildInsuranceCredential(
      {},
      { effectiveDate: "2026-01-09", expirationDate: "2027-01-09" },
    );

    const result = evaluateRequirement(generalLiability, [lapsedPolicy], options);

    expect(result).toMatchObject({ status: "unmet", reason: "lapsed", lapsesAt: "2027-01-09T06:01:00.000Z" });
  });

  it("is unmet as lapsed exactly at the cut-off instant", () => {
    const policy = buildInsuranceCredential();

    const result = evaluateRequirement(generalLiability, [policy], {
      timeZone: CHICAGO,
      asOf: new Date("2027-07-15T06:01:00Z"),
    });

    expect(result.reason).toBe("lapsed"); // half-open policy period: not in force at the cut-off itself
  });

  it("is unmet when a limit is below the site's minimum", () => {
    const requirement: Requirement = { ...generalLiability, minLimits: { eachOccurrence: 2_000_000 } };

    const result = evaluateRequirement(requirement, [buildInsuranceCredential()], options);

    expect(result).toMatchObject({ status: "unmet", reason: "below_limit" });
    expect(result.detail).toContain("each occurrence is 1,000,000");
  });

  it("is unmet when a required limit is not shown at all", () => {
    const requirement: Requirement = {
      ...generalLiability,
      minLimits: { productsCompletedOpsAggregate: 2_000_000 },
    };

    const result = evaluateRequirement(requirement, [buildInsuranceCredential()], options);

    expect(result.reason).toBe("below_limit");
  });

  it("is unmet when the additional-insured flag is absent", () => {
    const requirement: Requirement = { ...generalLiability, additionalInsured: true };

    const result = evaluateRequirement(
      requirement,
      [buildInsuranceCredential({}, { additionalInsured: false })],
      options,
    );

    expect(result).toMatchObject({ status: "unmet", reason: "flag_absent" });
  });

  it("is unmet when the waiver of subrogation is absent", () => {
    const requirement: Requirement = { ...generalLiability, waiverOfSubrogation: true };

    const result = evaluateRequirement(
      requirement,
      [buildInsuranceCredential({}, { waiverOfSubrogation: false })],
      options,
    );

    expect(result.reason).toBe("flag_absent");
  });

  it("accepts a state exemption for workers' compensation without asking it for limits", () => {
    const requirement: Requirement = {
      label: "Workers' compensation",
      typeCodes: ["workers_comp", "workers_comp_exemption"],
      minLimits: { employersLiabilityEachAccident: 500_000 },
    };
    const exemption = {
      id: 901,
      typeCode: "workers_comp_exemption",
      state: "verified" as const,
      holder: "company" as const,
      fields: {
        holderName: "Pell Rivera",
        state: "FL",
        certificateNumber: "EX-2201",
        issueDate: "2026-02-01",
        expiryDate: "2028-02-01",
        personsCovered: ["Pell Rivera"],
        technicianIds: [],
      },
    };

    const result = evaluateRequirement(requirement, [exemption], {
      ...options,
      technician: { id: 31, name: "Pell Rivera" },
      companyHeadcount: 1,
    });

    // Common practice: a sole proprietor's state exemption in place of a policy, for that person.
    expect(result).toMatchObject({ status: "met", credentialId: 901 });
  });

  it("is unmet when OEM training covers another control family", () => {
    const requirement: Requirement = {
      label: "Tessaline 12 service",
      typeCodes: ["oem_training"],
      controlFamily: "Tessaline 12",
    };

    const result = evaluateRequirement(requirement, [buildOemCredential()], options);

    expect(result).toMatchObject({ status: "unmet", reason: "wrong_control_family" });
  });

  it("is unmet when OEM training is from another builder", () => {
    const requirement: Requirement = {
      label: "Brannock training",
      typeCodes: ["oem_training"],
      builder: "Brannock Spindle Co.",
    };

    const result = evaluateRequirement(requirement, [buildOemCredential()], options);

    expect(result.reason).toBe("wrong_control_family");
  });

  it("is unmet when OEM training is below the required level", () => {
    const requirement: Requirement = {
      label: "Advanced service",
      typeCodes: ["oem_training"],
      controlFamily: "tessaline 9",
      minLevel: 3,
    };

    const result = evaluateRequirement(requirement, [buildOemCredential()], options);

    expect(result).toMatchObject({ status: "unmet", reason: "below_level" });
  });

  it("matches builder and control family regardless of letter case", () => {
    const requirement: Requirement = {
      label: "Service",
      typeCodes: ["oem_training"],
      builder: "orrin machine works",
      controlFamily: "TESSALINE 9",
    };

    const result = evaluateRequirement(requirement, [buildOemCredential()], options);

    expect(result.status).toBe("met");
  });

  it("is unmet as too old when a card without expiry is older than the site allows", () => {
    const requirement: Requirement = {
      label: "OSHA 10 within 5 years",
      typeCodes: ["osha_10"],
      maxAgeMonths: 60,
    };
    const card = buildTrainingCredential({ typeCode: "osha_10" }, { issueDate: "2021-12-01" });

    const result = evaluateRequirement(requirement, [card], options);

    // Employer practice: a card no older than 3-5 years (common practice; legalclarity.org on employer practice).
    expect(result).toMatchObject({ status: "unmet", reason: "too_old" });
  });

  it("lets a site require lockout/tagout training within 12 months", () => {
    const requirement: Requirement = { label: "Lockout/tagout", typeCodes: ["lockout_tagout"] };
    const card = buildTrainingCredential({ typeCode: "lockout_tagout" }, { issueDate: "2025-12-15" });

    const result = evaluateRequirement(requirement, [card], options);

    // Common practice that a site may require (29 CFR 1910.147 sets no calendar interval): 2025-12-15 + 12 months.
    expect(result).toMatchObject({ status: "unmet", reason: "lapsed", lapsesAt: "2026-12-16T06:00:00.000Z" });
  });

  it("is lapsing when met but the lapse falls inside the warning window", () => {
    const policy = buildInsuranceCredential(
      {},
      { effectiveDate: "2026-02-20", expirationDate: "2027-02-20" },
    );

    const result = evaluateRequirement(generalLiability, [policy], options);

    expect(result).toMatchObject({ status: "lapsing", reason: null, lapsesAt: "2027-02-20T06:01:00.000Z" });
    expect(result.detail).toContain("lapsing in 41 days");
  });

  it("is met, not lapsing, when the lapse is just outside a custom warning window", () => {
    const policy = buildInsuranceCredential(
      {},
      { effectiveDate: "2026-02-20", expirationDate: "2027-02-20" },
    );

    const result = evaluateRequirement(generalLiability, [policy], { ...options, warningDays: 30 });

    expect(result.status).toBe("met");
  });

  it("is not lapsing when a verified renewal starts at the old policy's cut-off", () => {
    const current = buildInsuranceCredential(
      {},
      { effectiveDate: "2026-02-20", expirationDate: "2027-02-20" },
    );
    const renewal = buildInsuranceCredential(
      {},
      { effectiveDate: "2027-02-20", expirationDate: "2028-02-20" },
    );

    const result = evaluateRequirement(generalLiability, [current, renewal], options);

    expect(result).toMatchObject({
      status: "met",
      credentialId: current.id,
      lapsesAt: "2028-02-20T06:01:00.000Z",
    });
  });

  it("reports a renewal that has not started yet when the old policy lapsed", () => {
    const old = buildInsuranceCredential({}, { effectiveDate: "2026-01-05", expirationDate: "2027-01-05" });
    const renewal = buildInsuranceCredential(
      {},
      { effectiveDate: "2027-01-20", expirationDate: "2028-01-20" },
    );

    const result = evaluateRequirement(generalLiability, [old, renewal], options);

    expect(result).toMatchObject({ status: "unmet", reason: "not_yet_in_force", credentialId: renewal.id });
  });

  it("prefers the verified credential in force over a returned or pending one", () => {
    const returned = buildInsuranceCredential({ state: "returned" }, { expirationDate: "2028-07-15" });
    const pending = buildInsuranceCredential({ state: "submitted" }, { expirationDate: "2028-07-15" });
    const verified = buildInsuranceCredential();

    const result = evaluateRequirement(generalLiability, [returned, pending, verified], options);

    expect(result).toMatchObject({ status: "met", credentialId: verified.id });
  });

  it("prefers the credential with the latest lapse among those that meet it", () => {
    const shorter = buildInsuranceCredential(
      {},
      { effectiveDate: "2026-03-01", expirationDate: "2027-03-01" },
    );
    const longer = buildInsuranceCredential(
      {},
      { effectiveDate: "2026-09-01", expirationDate: "2027-09-01" },
    );

    const result = evaluateRequirement(generalLiability, [shorter, longer], options);

    expect(result).toMatchObject({ status: "met", credentialId: longer.id });
  });

  it("shows the pending renewal rather than the lapsed policy when nothing meets it", () => {
    const lapsed = buildInsuranceCredential(
      { state: "lapsed" },
      { effectiveDate: "2026-01-01", expirationDate: "2027-01-01" },
    );
    const pending = buildInsuranceCredential(
      { state: "submitted" },
      { effectiveDate: "2027-01-01", expirationDate: "2028-01-01" },
    );

    const result = evaluateRequirement(generalLiability, [lapsed, pending], options);

    expect(result).toMatchObject({ reason: "awaiting_verification", credentialId: pending.id });
  });

  it("ignores superseded credentials", () => {
    const superseded = buildInsuranceCredential({ state: "superseded" });

    const result = evaluateRequirement(generalLiability, [superseded], options);

    expect(result.reason).toBe("missing");
  });
});
