import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { credentialTypeByCode } from "../../../shared/credentials/catalogue.ts";
import { computeStanding, computeTechnicianStanding } from "../../../shared/standing/compute-standing.ts";
import { credentialLapseInstant } from "../../../shared/standing/lapse-instant.ts";
import { defaultBaseline, type Requirement } from "../../../shared/standing/requirements.ts";
import { credentialStates } from "../../../shared/standing/standing-types.ts";
import { addCalendarDays } from "../../../shared/standing/iso-date.ts";
import { buildInsuranceCredential, buildTrainingCredential } from "./build-standing-credential.ts";

const CHICAGO = "America/Chicago";
const technician = { id: 7, name: "Dana Quillfeather" };
const asOf = new Date("2027-01-10T15:00:00Z");
const siteRequirements: Requirement[] = [
  ...defaultBaseline.requirements,
  { label: "Arc-flash training", typeCodes: ["arc_flash"] },
];

describe("technician standing", () => {
  it("is cleared when the company's insurance and the technician's training all meet the requirements", () => {
    const companyCredentials = [
      buildInsuranceCredential(),
      buildInsuranceCredential({ typeCode: "workers_comp" }),
    ];
    const technicianCredentials = [buildTrainingCredential()];

    const result = computeTechnicianStanding({
      companyCredentials,
      technicianCredentials,
      requirements: siteRequirements,
      companyTimeZone: CHICAGO,
      technician,
      companyHeadcount: 1,
      asOf,
    });

    expect(result.standing).toBe("cleared");
    expect(result.results.map((r) => r.status)).toEqual(["met", "met", "met"]);
  });

  it("is lapsing with the earliest lapse when one requirement ends inside the window", () => {
    const companyCredentials = [
      buildInsuranceCredential(),
      buildInsuranceCredential(
        { typeCode: "workers_comp" },
        { effectiveDate: "2026-02-01", expirationDate: "2027-02-01" },
      ),
    ];
    const technicianCredentials = [buildTrainingCredential()];

    const result = computeTechnicianStanding({
      companyCredentials,
      technicianCredentials,
      requirements: siteRequirements,
      companyTimeZone: CHICAGO,
      technician,
      companyHeadcount: 1,
      asOf,
    });

    expect(result.standing).toBe("lapsing");
    expect(result.earliestLapse).toBe("2027-02-01T06:01:00.000Z"); // 12:01 a.m. CST: CGL declarations' "standard time" (from memory)
  });

  it("is not cleared when any requirement is unmet, and names it", () => {
    const companyCredentials = [buildInsuranceCredential()];

    const result = computeTechnicianStanding({
      companyCredentials,
      technicianCredentials: [buildTrainingCredential()],
      requirements: siteRequirements,
      companyTimeZone: CHICAGO,
      technician,
      companyHeadcount: 1,
      asOf,
    });

    expect(result.standing).toBe("not_cleared");
    expect(result.results.filter((r) => r.status === "unmet").map((r) => r.reason)).toEqual(["missing"]);
  });

  it("does not let another technician's training count for the company", () => {
    const companyCredentials = [
      buildInsuranceCredential(),
      buildInsuranceCredential({ typeCode: "workers_comp" }),
    ];
    const misfiled = buildTrainingCredential({ holder: "company" });

    const result = computeTechnicianStanding({
      companyCredentials: [...companyCredentials, misfiled],
      technicianCredentials: [],
      requirements: siteRequirements,
      companyTimeZone: CHICAGO,
      technician,
      companyHeadcount: 1,
      asOf,
    });

    expect(result.results[2]?.reason).toBe("missing");
  });

  it("never says cleared or lapsing when every required credential's lapse instant is at or before asOf", () => {
    const generalLiability: Requirement = { label: "General liability", typeCodes: ["general_liability"] };
    const type = credentialTypeByCode.get("general_liability")!;
    const policy = fc.record({
      state: fc.constantFrom(...credentialStates),
      effectiveOffsetDays: fc.integer({ min: -800, max: 400 }),
      termDays: fc.integer({ min: 1, max: 800 }),
    });
    const zone = fc.constantFrom(
      "America/Chicago",
      "America/New_York",
      "America/Phoenix",
      "Pacific/Honolulu",
      "America/Anchorage",
    );
    const instant = fc.date({
      min: new Date("2026-01-01T00:00:00Z"),
      max: new Date("2028-12-31T00:00:00Z"),
      noInvalidDate: true,
    });

    fc.assert(
      fc.property(
        fc.array(policy, { minLength: 1, maxLength: 4 }),
        zone,
        instant,
        (policies, timeZone, at) => {
          const base = at.toISOString().slice(0, 10);
          const credentials = policies.map((p) =>
            buildInsuranceCredential(
              { state: p.state },
              {
                effectiveDate: addCalendarDays(base, p.effectiveOffsetDays),
                expirationDate: addCalendarDays(base, p.effectiveOffsetDays + p.termDays),
              },
            ),
          );
          const allEnded = credentials.every(
            (c) => credentialLapseInstant(type, c.fields, timeZone)!.getTime() <= at.getTime(),
          );

          const result = computeStanding([generalLiability], credentials, { timeZone, asOf: at });

          if (allEnded) expect(result.standing).toBe("not_cleared");
          if (result.standing !== "not_cleared")
            expect(Date.parse(result.earliestLapse!)).toBeGreaterThan(at.getTime());
        },
      ),
      { numRuns: 1000 },
    );
  });
});
