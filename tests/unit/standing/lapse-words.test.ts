import { describe, expect, it } from "vitest";
import {
  credentialTypeByCode,
  type CredentialTypeDefinition,
} from "../../../shared/credentials/catalogue.ts";
import { credentialLapseInstant } from "../../../shared/standing/lapse-instant.ts";
import { lapseWords } from "../../../shared/standing/lapse-words.ts";

function type(code: string): CredentialTypeDefinition {
  const found = credentialTypeByCode.get(code);
  if (!found) throw new Error(`No type ${code}`);
  return found;
}

const cardType = [...credentialTypeByCode.values()].find((t) => t.fieldSet === "training");

describe("lapse words", () => {
  it("reads a card printed 'Expiration 11/30/2028' as valid through that day, in any zone", () => {
    if (!cardType) throw new Error("No training type in the catalogue");
    // A printed expiration date counts through the end of that local day (common practice).
    for (const zone of ["America/New_York", "America/Los_Angeles", "Pacific/Honolulu"]) {
      const lapse = credentialLapseInstant(
        cardType,
        { holderName: "Dana Quillfeather", issueDate: "2025-11-30", expiryDate: "2028-11-30" },
        zone,
      );
      if (!lapse) throw new Error("A card with a printed expiry must lapse");
      expect(lapseWords(lapse, cardType.fieldSet, zone)).toBe("valid through Nov 30, 2028");
    }
  });

  it("does not turn the lapse into the next day for a month-end card read in the holder's zone", () => {
    if (!cardType) throw new Error("No training type in the catalogue");
    const lapse = credentialLapseInstant(
      cardType,
      { holderName: "Dana Quillfeather", issueDate: "2026-01-01", expiryDate: "2026-12-31" },
      "America/Chicago",
    );
    if (!lapse) throw new Error("A card with a printed expiry must lapse");
    expect(lapseWords(lapse, "training", "America/Chicago")).toBe("valid through Dec 31, 2026");
  });

  it("reads a policy by its 12:01 a.m. standard-time end on the expiration date (ISO CG DS 01 wording, from memory)", () => {
    const policy = {
      insurerName: "Larkspur Mutual",
      policyNumber: "GL-7",
      effectiveDate: "2027-11-30",
      expirationDate: "2028-11-30",
      limits: {},
      additionalInsured: false,
      waiverOfSubrogation: false,
    };
    const lapse = credentialLapseInstant(type("workers_comp"), policy, "America/New_York");
    if (!lapse) throw new Error("A policy must lapse");
    expect(lapseWords(lapse, "insurance", "America/New_York")).toBe(
      "in force until 12:01 a.m., Nov 30, 2028",
    );
  });

  it("rejects an instant that is not a date", () => {
    expect(() => lapseWords("not a date", "training", "UTC")).toThrow(RangeError);
  });
});
