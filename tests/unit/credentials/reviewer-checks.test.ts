import { describe, expect, it } from "vitest";
import { reviewerWarnings, type ReviewerCheckInput } from "../../../shared/credentials/reviewer-checks.ts";

const soundCertificate: ReviewerCheckInput = {
  fieldSet: "insurance",
  companyLegalName: "Brightline Spindle Services, LLC",
  fields: {
    namedInsured: "BRIGHTLINE SPINDLE SERVICES L.L.C.",
    naic: "24816",
    effectiveDate: "2026-01-15",
    expirationDate: "2027-01-15",
    limits: {
      eachOccurrence: 1_000_000,
      generalAggregate: 2_000_000,
      employersLiabilityDiseaseEachEmployee: 500_000,
      employersLiabilityDiseasePolicyLimit: 500_000,
    },
  },
};
const soundCard: ReviewerCheckInput = {
  fieldSet: "training",
  companyLegalName: "Brightline Spindle Services LLC",
  technicianName: "Desmond J. Thorne",
  fields: { holderName: "THORNE, DESMOND", issueDate: "2025-03-01", expiryDate: "2026-03-01" },
};
const codes = (input: ReviewerCheckInput) => reviewerWarnings(input).map((warning) => warning.code);

describe("reviewer warnings", () => {
  it("raise nothing for a sound certificate whose names differ only in case, punctuation and legal form", () => {
    const input = soundCertificate;

    const warnings = reviewerWarnings(input);

    expect(warnings).toEqual([]);
  });

  it("raise nothing for a card whose name differs only in order, case and a middle initial", () => {
    const input = soundCard;

    const warnings = reviewerWarnings(input);

    expect(warnings).toEqual([]);
  });

  it("warn when the named insured is another company", () => {
    const input = {
      ...soundCertificate,
      fields: { ...soundCertificate.fields, namedInsured: "Brightline Spindle Holdings LLC" },
    };

    const found = codes(input);

    expect(found).toEqual(["named_insured_differs"]);
  });

  it("warn when the expiration date is not after the effective date", () => {
    const input = {
      ...soundCertificate,
      fields: { ...soundCertificate.fields, expirationDate: "2026-01-15" },
    };

    const found = codes(input);

    expect(found).toEqual(["expiration_not_after_effective"]);
  });

  it("warn when the general aggregate is below each occurrence", () => {
    const limits = { ...soundCertificate.fields.limits, generalAggregate: 500_000 };
    const input = { ...soundCertificate, fields: { ...soundCertificate.fields, limits } };

    const found = codes(input);

    // general aggregate >= each occurrence: common practice
    expect(found).toEqual(["aggregate_below_each_occurrence"]);
  });

  it("warn when the disease policy limit is below disease each employee", () => {
    const limits = { ...soundCertificate.fields.limits, employersLiabilityDiseasePolicyLimit: 100_000 };
    const input = { ...soundCertificate, fields: { ...soundCertificate.fields, limits } };

    const found = codes(input);

    // EL disease policy limit >= disease each employee: common practice
    expect(found).toEqual(["disease_policy_limit_below_each_employee"]);
  });

  it("warn when the NAIC code is not five digits, and not when it is", () => {
    const naics = ["1234", "123456", "12a45", "12345"];

    const found = naics.map((naic) =>
      codes({ ...soundCertificate, fields: { ...soundCertificate.fields, naic } }),
    );

    // five digits: NAIC company code (from memory)
    expect(found).toEqual([["naic_not_five_digits"], ["naic_not_five_digits"], ["naic_not_five_digits"], []]);
  });

  it("warn when the name on a training card is another person's", () => {
    const input = { ...soundCard, fields: { ...soundCard.fields, holderName: "Desiree Thorne" } };

    const found = codes(input);

    expect(found).toEqual(["holder_name_differs"]);
  });

  it("warn when the card's expiry is not after its issue date", () => {
    const input = { ...soundCard, fields: { ...soundCard.fields, expiryDate: "2025-02-01" } };

    const found = codes(input);

    expect(found).toEqual(["expiration_not_after_effective"]);
  });

  it("warn when the same document was submitted for another holder", () => {
    const inputs = [
      { ...soundCard, duplicateOfOtherHolder: true },
      { ...soundCertificate, duplicateOfOtherHolder: true },
    ];

    const found = inputs.map(codes);

    expect(found).toEqual([["submitted_for_another_holder"], ["submitted_for_another_holder"]]);
  });

  it("warns when an each-occurrence limit is implausibly small, as a misread $1M or thousands table would be", () => {
    const input = {
      ...soundCertificate,
      fields: { ...soundCertificate.fields, limits: { eachOccurrence: 1_000, generalAggregate: 2_000_000 } },
    };

    const found = codes(input);

    // Commercial liability limits start in the hundreds of thousands (common practice).
    expect(found).toContain("limit_implausibly_small");
    expect(codes(soundCertificate)).not.toContain("limit_implausibly_small");
  });
});
