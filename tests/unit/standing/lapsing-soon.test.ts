import { describe, expect, it } from "vitest";
import { evaluateRequirement } from "../../../shared/standing/evaluate-requirement.ts";
import { lapsingSoon } from "../../../shared/standing/lapsing-soon.ts";
import { OFFICE_LOOK_AHEAD_DAYS } from "../../../shared/standing/warning-windows.ts";
import { buildInsuranceCredential } from "./build-standing-credential.ts";

// A policy ending 2027-02-01 in Chicago ends at 12:01 a.m. standard time that day, 22 days after `asOf` (the standard
// CGL declarations' "12:01 A.M. standard time" at the insured's address, ISO CG DS 01 wording, from memory).
const timeZone = "America/Chicago";
const asOf = new Date("2027-01-10T15:00:00Z");
const requirement = { label: "General liability", typeCodes: ["general_liability"] };

function asListed(state: "verified" | "submitted") {
  const credential = buildInsuranceCredential({ state }, { expirationDate: "2027-02-01" });
  const result = evaluateRequirement(requirement, [credential], { timeZone, asOf });
  expect(result.lapsesAt).toBe("2027-02-01T06:01:00.000Z");
  const listed = lapsingSoon([{ state, lapsesAt: result.lapsesAt! }], asOf, 60);
  return { result, listed };
}

describe("what the office sees as lapsing agrees with the standing engine", () => {
  it("lists a verified policy ending in 22 days, which the engine calls lapsing", () => {
    const { result, listed } = asListed("verified");
    expect(result.status).toBe("lapsing");
    expect(listed).toHaveLength(1);
  });

  it("does not list a policy awaiting verification, which the engine counts as unmet, not as lapsing from met", () => {
    const { result, listed } = asListed("submitted");
    expect(result).toMatchObject({ status: "unmet", reason: "awaiting_verification" });
    expect(listed).toEqual([]);
  });

  it("keeps what has already lapsed and what ends beyond the look-ahead out of the list, soonest first inside it", () => {
    const at = (days: number) => new Date(asOf.getTime() + days * 86_400_000).toISOString();
    const rows = [at(-1), at(OFFICE_LOOK_AHEAD_DAYS + 1), at(40), at(3), at(OFFICE_LOOK_AHEAD_DAYS)].map(
      (lapsesAt) => ({ state: "verified" as const, lapsesAt }),
    );
    expect(lapsingSoon(rows, asOf, OFFICE_LOOK_AHEAD_DAYS).map((r) => r.lapsesAt)).toEqual([
      at(3),
      at(40),
      at(OFFICE_LOOK_AHEAD_DAYS),
    ]);
  });
});
