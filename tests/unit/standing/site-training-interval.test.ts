import { describe, expect, it } from "vitest";
import { evaluateRequirement } from "../../../shared/standing/evaluate-requirement.ts";
import type { Requirement } from "../../../shared/standing/requirements.ts";
import { buildTrainingCredential } from "./build-standing-credential.ts";

// Neither 29 CFR 1910.147(c)(7)(iii) (lockout/tagout retraining on changes or deviations) nor 29 CFR 1910.146(g)(2)
// (confined space training on changes of duties or hazards) sets a calendar interval; the catalog's 12 months are common
// practice, and a site's requirement set decides the interval it wants.
const options = { timeZone: "America/Chicago", asOf: new Date("2027-01-10T15:00:00Z") };

describe("a site's interval for training cards", () => {
  it.each(["lockout_tagout", "confined_space"])(
    "ends a %s card without printed expiry 12 months from issue by default (common practice)",
    (typeCode) => {
      const card = buildTrainingCredential({ typeCode }, { issueDate: "2025-12-15" });

      const result = evaluateRequirement({ label: "Card", typeCodes: [typeCode] }, [card], options);

      // Valid through 2026-12-15, so lapsed at the start of 2026-12-16 (CST, UTC-6).
      expect(result).toMatchObject({
        status: "unmet",
        reason: "lapsed",
        lapsesAt: "2026-12-16T06:00:00.000Z",
      });
    },
  );

  it.each(["lockout_tagout", "confined_space"])(
    "lets a site accept a %s card for 24 months instead",
    (typeCode) => {
      const requirement: Requirement = { label: "Card", typeCodes: [typeCode], maxAgeMonths: 24 };
      const card = buildTrainingCredential({ typeCode }, { issueDate: "2025-12-15" });

      const result = evaluateRequirement(requirement, [card], options);

      expect(result.status).toBe("met");
      expect(result.lapsesAt).toBe("2027-12-16T06:00:00.000Z");
    },
  );

  it("lets a site ask for 6 months instead", () => {
    const requirement: Requirement = { label: "LOTO", typeCodes: ["lockout_tagout"], maxAgeMonths: 6 };
    const card = buildTrainingCredential({ typeCode: "lockout_tagout" }, { issueDate: "2026-06-01" });

    const result = evaluateRequirement(requirement, [card], options);

    expect(result).toMatchObject({ status: "unmet", reason: "too_old" });
  });

  it("still ends a card at a printed expiry sooner than the site's interval", () => {
    const requirement: Requirement = { label: "LOTO", typeCodes: ["lockout_tagout"], maxAgeMonths: 36 };
    const card = buildTrainingCredential(
      { typeCode: "lockout_tagout" },
      { issueDate: "2026-06-01", expiryDate: "2026-12-31" },
    );

    const result = evaluateRequirement(requirement, [card], options);

    expect(result).toMatchObject({ status: "unmet", reason: "lapsed" });
  });
});
