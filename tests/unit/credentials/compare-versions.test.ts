import { describe, expect, it } from "vitest";
import { compareCredentialFields } from "../../../shared/credentials/compare-versions.ts";
import { returnReasonsFor } from "../../../shared/credentials/return-reasons.ts";
import { fieldSets } from "../../../shared/credentials/credential-fields.ts";
import { returnCredentialSchema } from "../../../shared/credentials/schemas.ts";

const lastYear = {
  insurerName: "Lantern Mutual Casualty",
  naic: "10234",
  policyNumber: "GL-4410",
  effectiveDate: "2026-03-01",
  expirationDate: "2027-03-01",
  limits: { eachOccurrence: 1_000_000, generalAggregate: 2_000_000 },
  additionalInsured: false,
  waiverOfSubrogation: false,
};

describe("comparing a renewal with the verified version before it", () => {
  it("names the changed dates, limits and insurer, in the order a reviewer reads a certificate", () => {
    // A renewal keeps the policy's shape and moves its term by a year (common practice for annual policies).
    const renewal = {
      ...lastYear,
      insurerName: "Harrowgate Indemnity Co.",
      effectiveDate: "2027-03-01",
      expirationDate: "2028-03-01",
      limits: { eachOccurrence: 1_000_000, generalAggregate: 3_000_000 },
    };

    const changes = compareCredentialFields(lastYear, renewal);

    expect(changes).toEqual([
      { path: "insurerName", before: "Lantern Mutual Casualty", after: "Harrowgate Indemnity Co." },
      { path: "effectiveDate", before: "2026-03-01", after: "2027-03-01" },
      { path: "expirationDate", before: "2027-03-01", after: "2028-03-01" },
      { path: "limits.generalAggregate", before: 2_000_000, after: 3_000_000 },
    ]);
  });

  it("reports a limit line that appears or disappears, with none on the missing side", () => {
    const changes = compareCredentialFields(lastYear, {
      ...lastYear,
      limits: { eachOccurrence: 1_000_000, medicalExpense: 10_000 },
    });

    expect(changes).toEqual([
      { path: "limits.generalAggregate", before: 2_000_000, after: null },
      { path: "limits.medicalExpense", before: null, after: 10_000 },
    ]);
  });

  it("sees no change in re-typed spacing or in an unticked box left out", () => {
    const { additionalInsured: _unused, ...withoutFlag } = lastYear;
    void _unused;

    const changes = compareCredentialFields(lastYear, {
      ...withoutFlag,
      insurerName: "  Lantern   Mutual Casualty ",
    });

    expect(changes).toEqual([]);
  });

  it("treats a change of letter case in the insurer's name as a change, since the legal name is printed exactly (common practice)", () => {
    expect(
      compareCredentialFields(lastYear, { ...lastYear, insurerName: "LANTERN MUTUAL CASUALTY" }),
    ).toHaveLength(1);
  });

  it("compares a card's expiry and number", () => {
    const card = {
      holderName: "Noor Achebe",
      issueDate: "2025-05-01",
      expiryDate: "2027-05-01",
      cardNumber: "A1",
    };

    const changes = compareCredentialFields(card, { ...card, expiryDate: "2029-05-01", cardNumber: "B7" });

    expect(changes.map((c) => c.path)).toEqual(["expiryDate", "cardNumber"]);
  });
});

describe("ready-made return reasons", () => {
  it("offers reasons for every kind of document, each one the return schema accepts as it stands", () => {
    for (const set of fieldSets) {
      const reasons = returnReasonsFor(set);
      expect(reasons.length).toBeGreaterThanOrEqual(4);
      for (const reason of reasons) expect(returnCredentialSchema.safeParse({ reason }).success).toBe(true);
    }
  });
});
