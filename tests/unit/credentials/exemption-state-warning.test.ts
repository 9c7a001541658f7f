import { describe, expect, it } from "vitest";
import { reviewerWarnings, type ReviewerCheckInput } from "../../../shared/credentials/reviewer-checks.ts";

// Common practice, rules vary by state: a state's workers' compensation exemption is granted under that state's law,
// so work at a site in another state needs the reviewer's second look.
const exemption: ReviewerCheckInput = {
  fieldSet: "exemption",
  companyLegalName: "Harrowgate Field Service LLC",
  fields: { holderName: "Rowan Ashgrove", state: "TX", issueDate: "2026-03-01" },
};

describe("reviewer warning on an exemption from another state", () => {
  it("warns when the company's address or a work-order site is in another state, naming it", () => {
    const warnings = reviewerWarnings({
      ...exemption,
      workStates: [
        { state: "TX", where: "the company's address" },
        { state: "OK", where: "site Plant 4" },
      ],
    });

    expect(warnings.map((w) => w.code)).toEqual(["exemption_from_another_state"]);
    expect(warnings[0]?.message).toContain("site Plant 4 (OK)");
    expect(warnings[0]?.message).not.toContain("(TX)");
  });

  it("stays quiet when every place is in the issuing state", () => {
    const warnings = reviewerWarnings({
      ...exemption,
      workStates: [{ state: "TX", where: "the company's address" }],
    });

    expect(warnings).toEqual([]);
  });
});
