import { describe, expect, it } from "vitest";
import {
  credentialTypeByCode,
  type CredentialTypeDefinition,
} from "../../../shared/credentials/catalogue.ts";
import { credentialLapseInstant } from "../../../shared/standing/lapse-instant.ts";

function type(code: string): CredentialTypeDefinition {
  const found = credentialTypeByCode.get(code);
  if (!found) throw new Error(`No type ${code}`);
  return found;
}

const policyFields = {
  insurerName: "Larkspur Mutual",
  policyNumber: "WC-88",
  effectiveDate: "2026-07-15",
  expirationDate: "2027-07-15",
  limits: {},
  additionalInsured: false,
  waiverOfSubrogation: false,
};

describe("credential lapse instant", () => {
  it("ends a policy at 12:01 a.m. standard time on its expiration date", () => {
    const lapse = credentialLapseInstant(type("workers_comp"), policyFields, "America/New_York");

    expect(lapse?.toISOString()).toBe("2027-07-15T05:01:00.000Z"); // 12:01 a.m. EST in summer: CGL declarations' "standard time" (from memory)
  });

  it("ends a license at the local midnight after its printed expiry", () => {
    const fields = {
      holderName: "Dana Quillfeather",
      licenseNumber: "EL-5521",
      issuingAuthority: "State board",
      issueDate: "2025-06-01",
      expiryDate: "2027-05-31",
    };

    const lapse = credentialLapseInstant(type("trade_license"), fields, "America/Phoenix");

    expect(lapse?.toISOString()).toBe("2027-06-01T07:00:00.000Z"); // common practice: valid through the printed date (MST, no DST)
  });

  it("ends an exemption without a printed expiry after the usual 24-month term, and a printed expiry wins", () => {
    const fields = {
      holderName: "Pell Rivera",
      state: "TX",
      certificateNumber: "NC-1",
      issueDate: "2026-01-01",
      personsCovered: [],
      technicianIds: [],
    };

    const usual = credentialLapseInstant(type("workers_comp_exemption"), fields, "America/Chicago");
    const printed = credentialLapseInstant(
      type("workers_comp_exemption"),
      { ...fields, expiryDate: "2026-12-31" },
      "America/Chicago",
    );

    // Common practice, varies by state: 24 months from issue, counted through 2028-01-01 (start of 01-02, CST).
    expect(usual?.toISOString()).toBe("2028-01-02T06:00:00.000Z");
    expect(printed?.toISOString()).toBe("2027-01-01T06:00:00.000Z");
  });

  it("ends a powered-truck evaluation 3 years after it was done", () => {
    const fields = { holderName: "Dana Quillfeather", issueDate: "2024-02-29" };

    const lapse = credentialLapseInstant(type("powered_truck"), fields, "America/Chicago");

    expect(lapse?.toISOString()).toBe("2027-03-01T06:00:00.000Z"); // 29 CFR 1910.178(l)(4)(iii): due 2027-02-28 (OSHA letter 2005-08-01), counts through it
  });
});
