import { describe, expect, it } from "vitest";
import { computeStanding } from "../../../shared/standing/compute-standing.ts";
import type { Requirement } from "../../../shared/standing/requirements.ts";
import { typesReadFor } from "../../../server/standing/standing-inputs.ts";
import {
  buildInsuranceCredential,
  buildOemCredential,
  buildTrainingCredential,
} from "./build-standing-credential.ts";

// Limits and lines are common practice: an umbrella sits over general liability (and auto and employer's liability
// when the set asks for those on their own), so a $5M each-occurrence line can be met by GL $1M + umbrella $4M.
const options = { timeZone: "America/Chicago", asOf: new Date("2027-01-10T15:00:00Z") };
const baseline: Requirement[] = [
  { label: "General liability", typeCodes: ["general_liability"] },
  { label: "Workers' compensation", typeCodes: ["workers_comp", "workers_comp_exemption"] },
];
const stacked: Requirement[] = [
  { label: "Liability $5M", typeCodes: ["general_liability"], minLimits: { eachOccurrence: 5_000_000 } },
  { label: "Arc flash", typeCodes: ["arc_flash"] },
];
const umbrellaLine: Requirement[] = [
  {
    label: "Umbrella $4M",
    typeCodes: ["umbrella_liability"],
    minLimits: { umbrellaEachOccurrence: 4_000_000 },
  },
  { label: "Auto", typeCodes: ["auto_liability"] },
];
const umbrella = buildInsuranceCredential(
  { typeCode: "umbrella_liability" },
  { policyNumber: "UMB-88", limits: { umbrellaEachOccurrence: 4_000_000, umbrellaAggregate: 4_000_000 } },
);
const credentials = [
  buildInsuranceCredential(),
  buildInsuranceCredential(
    { typeCode: "auto_liability" },
    { policyNumber: "AU-12", limits: { combinedSingleLimit: 1_000_000 } },
  ),
  umbrella,
  buildTrainingCredential(),
  buildTrainingCredential({ typeCode: "lockout_tagout" }),
  buildOemCredential(),
];

describe("the credential types a standing can read", () => {
  it("are the lines' own types, the umbrella's underlying policies, and umbrellas where limits may stack", () => {
    expect(new Set(typesReadFor([{ id: null, name: "Platform baseline", requirements: baseline }]))).toEqual(
      new Set(["general_liability", "workers_comp", "workers_comp_exemption"]),
    );
    expect(new Set(typesReadFor([{ id: 1, name: "Stacked", requirements: stacked }]))).toEqual(
      new Set(["general_liability", "umbrella_liability", "arc_flash"]),
    );
    expect(new Set(typesReadFor([{ id: 2, name: "Umbrella", requirements: umbrellaLine }]))).toEqual(
      new Set(["umbrella_liability", "auto_liability", "general_liability"]),
    );
  });

  it("give the same standing as every credential on file, for each kind of set", () => {
    for (const requirements of [baseline, stacked, umbrellaLine]) {
      const read = new Set(typesReadFor([{ id: null, name: "set", requirements }]));
      const all = computeStanding(requirements, credentials, options);
      const only = computeStanding(
        requirements,
        credentials.filter((c) => read.has(c.typeCode)),
        options,
      );
      expect(only).toEqual(all);
      expect(credentials.some((c) => !read.has(c.typeCode))).toBe(true);
    }
  });
});
