import { describe, expect, it } from "vitest";
import { computeStanding, underlyingTypeCodesFor } from "../../../shared/standing/compute-standing.ts";
import { evaluateRequirement } from "../../../shared/standing/evaluate-requirement.ts";
import type { Requirement } from "../../../shared/standing/requirements.ts";
import { buildInsuranceCredential } from "./build-standing-credential.ts";

// Every value here is common practice: an umbrella or excess policy pays above the scheduled underlying policies, so a
// site's $5,000,000 each occurrence is met by general liability $1,000,000 plus an umbrella of $4,000,000 in force at
// the same instant, and an umbrella without its underlying policy pays nothing below its attachment point.
const CHICAGO = "America/Chicago";
const asOf = new Date("2027-01-10T15:00:00Z");
const options = { timeZone: CHICAGO, asOf };

const fiveMillion: Requirement = {
  label: "Liability $5M each occurrence",
  typeCodes: ["general_liability"],
  minLimits: { eachOccurrence: 5_000_000 },
};
const umbrellaLine: Requirement = {
  label: "Umbrella $4M",
  typeCodes: ["umbrella_liability"],
  minLimits: { umbrellaEachOccurrence: 4_000_000 },
};

const gl = (fields = {}, overrides = {}) => buildInsuranceCredential({ ...overrides }, fields);
const umbrella = (fields = {}, overrides = {}) =>
  buildInsuranceCredential(
    { typeCode: "umbrella_liability", ...overrides },
    {
      policyNumber: "UMB-88",
      limits: { umbrellaEachOccurrence: 4_000_000, umbrellaAggregate: 4_000_000 },
      ...fields,
    },
  );

describe("umbrella and excess limits stacked over the primary policy", () => {
  it("meets $5M each occurrence with GL $1M + umbrella $4M, and says so", () => {
    const primary = gl();
    const over = umbrella();

    const result = evaluateRequirement(fiveMillion, [primary, over], options);

    expect(result.status).toBe("met");
    expect(result.metBy).toBe("GL $1M + umbrella $4M each occurrence");
    expect(result.credentialId).toBe(primary.id);
    expect(result.alsoCredentialIds).toEqual([over.id]);
    expect(result.limitLines).toEqual([
      {
        limit: "eachOccurrence",
        required: 5_000_000,
        shown: 5_000_000,
        met: true,
        how: "GL $1M + umbrella $4M",
      },
    ]);
    expect(result.detail).toContain("GL $1M + umbrella $4M");
  });

  it("stacks the aggregate too: GL $2M aggregate + umbrella $4M aggregate meets $6M", () => {
    const requirement: Requirement = { ...fiveMillion, minLimits: { generalAggregate: 6_000_000 } };

    const result = evaluateRequirement(requirement, [gl(), umbrella()], options);

    expect(result.status).toBe("met");
    expect(result.metBy).toBe("GL $2M + umbrella $4M general aggregate");
  });

  it("stays below limit when the two together fall short ($1M + $3M < $5M)", () => {
    const result = evaluateRequirement(
      fiveMillion,
      [gl(), umbrella({ limits: { umbrellaEachOccurrence: 3_000_000 } })],
      options,
    );

    expect(result).toMatchObject({ status: "unmet", reason: "below_limit", metBy: null });
    expect(result.detail).toContain("4,000,000 (GL $1M + umbrella $3M)");
  });

  it("does not stack an umbrella that is not in force at the same instant", () => {
    const later = umbrella({ effectiveDate: "2027-02-01", expirationDate: "2028-02-01" });
    const lapsed = umbrella({ effectiveDate: "2025-12-01", expirationDate: "2026-12-01" });

    const result = evaluateRequirement(fiveMillion, [gl(), later, lapsed], options);

    expect(result).toMatchObject({ status: "unmet", reason: "below_limit" });
  });

  it("ends the stacked line when the first of the two policies ends", () => {
    const over = umbrella({ effectiveDate: "2026-05-01", expirationDate: "2027-05-01" });

    const result = evaluateRequirement(fiveMillion, [gl(), over], options);

    // Umbrella ends 12:01 a.m. standard time 2027-05-01 (CST, UTC-6) before the GL's 2027-07-15: the standard
    // policy-period wording of the CGL declarations (ISO CG DS 01), "12:01 A.M. standard time at your mailing address" (wording from memory).
    expect(result.lapsesAt).toBe("2027-05-01T06:01:00.000Z");
  });

  it("waits for verification when the umbrella is only submitted", () => {
    const result = evaluateRequirement(fiveMillion, [gl(), umbrella({}, { state: "submitted" })], options);

    expect(result).toMatchObject({ status: "unmet", reason: "awaiting_verification" });
  });

  it("prefers a single policy that meets the limit on its own", () => {
    const big = gl({ limits: { eachOccurrence: 5_000_000, generalAggregate: 10_000_000 } });

    const result = evaluateRequirement(fiveMillion, [gl(), umbrella(), big], options);

    expect(result.credentialId).toBe(big.id);
    expect(result.alsoCredentialIds).toEqual([]);
    expect(result.metBy).toBe("GL $5M each occurrence");
  });
});

describe("an umbrella line needs its underlying policy", () => {
  it("is unmet with an umbrella alone and no general liability on file", () => {
    const result = evaluateRequirement(umbrellaLine, [umbrella()], options);

    expect(result).toMatchObject({ status: "unmet", reason: "underlying_missing" });
    expect(result.detail).toContain("Commercial general liability");
  });

  it("is unmet when the general liability beneath it has lapsed", () => {
    const lapsedGl = gl({ effectiveDate: "2025-12-01", expirationDate: "2026-12-01" });

    const result = evaluateRequirement(umbrellaLine, [umbrella(), lapsedGl], options);

    expect(result.reason).toBe("underlying_missing");
  });

  it("is met over verified general liability and ends when the underlying ends", () => {
    const shortGl = gl({ effectiveDate: "2026-03-01", expirationDate: "2027-03-01" });

    const result = evaluateRequirement(umbrellaLine, [umbrella(), shortGl], options);

    expect(result).toMatchObject({ status: "lapsing", metBy: "umbrella over GL" });
    expect(result.lapsesAt).toBe("2027-03-01T06:01:00.000Z"); // the GL's 12:01 a.m. CST cut-off (ISO CG DS 01 wording, from memory)
  });

  it("needs auto and employer's liability beneath it when the set requires those policies", () => {
    const set: Requirement[] = [
      umbrellaLine,
      { label: "Auto", typeCodes: ["auto_liability"] },
      { label: "Workers' compensation", typeCodes: ["workers_comp"] },
    ];
    const auto = buildInsuranceCredential({ typeCode: "auto_liability" });

    const withoutWc = computeStanding(set, [gl(), umbrella(), auto], options);

    expect(underlyingTypeCodesFor(set)).toEqual(["general_liability", "auto_liability", "workers_comp"]);
    expect(withoutWc.results[0]).toMatchObject({ status: "unmet", reason: "underlying_missing" });
    expect(withoutWc.results[0]?.detail).toContain("Workers' compensation");
  });

  it("does not ask for employer's liability when the set accepts a state exemption instead", () => {
    const set: Requirement[] = [
      umbrellaLine,
      { label: "WC or exemption", typeCodes: ["workers_comp", "workers_comp_exemption"] },
    ];

    expect(underlyingTypeCodesFor(set)).toEqual(["general_liability"]);
  });
});

describe("how a line was met, kept on the work order's proof", () => {
  it("carries 'GL $1M + umbrella $4M' into the standing snapshot", async () => {
    const { buildStandingSnapshot } = await import("../../../shared/work-orders/standing-snapshot.ts");
    const primary = gl();
    const over = umbrella();
    const result = computeStanding([fiveMillion], [primary, over], options);

    const snapshot = buildStandingSnapshot({
      takenAt: asOf,
      technician: { id: 1, name: "Dana Quillfeather", companyName: "Harrowgate Field Service LLC" },
      targets: [{ requirementSetId: 9, name: "Plant 2", result }],
      credentials: new Map([
        [primary.id, { id: primary.id, typeCode: primary.typeCode, fields: primary.fields }],
      ]),
      typeNames: new Map([["general_liability", "Commercial general liability"]]),
    });

    expect(snapshot.targets[0]?.requirements[0]).toMatchObject({
      status: "met",
      metBy: "GL $1M + umbrella $4M each occurrence",
    });
  });
});
