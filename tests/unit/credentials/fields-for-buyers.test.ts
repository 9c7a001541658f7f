import { describe, expect, it } from "vitest";
import { fieldsForBuyers } from "../../../shared/credentials/fields-for-buyers.ts";

describe("fields a buyer may read", () => {
  it("keeps dates, limits and flags of a certificate but not the other customer named as certificate holder", () => {
    const fields = {
      insurerName: "Bluestem Mutual",
      policyNumber: "GL-1",
      effectiveDate: "2026-01-01",
      expirationDate: "2027-01-01",
      limits: { eachOccurrence: 1_000_000 },
      additionalInsured: true,
      certificateHolder: "Another Shop Inc.",
      namedInsured: "Kestrel Ridge",
    };

    const visible = fieldsForBuyers(fields);

    expect(visible).toEqual({
      insurerName: "Bluestem Mutual",
      policyNumber: "GL-1",
      effectiveDate: "2026-01-01",
      expirationDate: "2027-01-01",
      limits: { eachOccurrence: 1_000_000 },
      additionalInsured: true,
    });
  });

  it("keeps the course and dates of a training card but not the name and card number printed on it", () => {
    const visible = fieldsForBuyers({
      holderName: "Tobias Wren",
      cardNumber: "AF-99",
      course: "Arc flash",
      issueDate: "2026-03-01",
      trainer: "Northgate Safety",
    });

    expect(visible).toEqual({ course: "Arc flash", issueDate: "2026-03-01", trainer: "Northgate Safety" });
  });
});
