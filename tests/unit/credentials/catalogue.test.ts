import { describe, expect, it } from "vitest";
import { credentialTypeByCode, credentialTypes } from "../../../shared/credentials/catalogue.ts";
import { fieldSets } from "../../../shared/credentials/credential-fields.ts";

describe("credential catalogue", () => {
  it("has unique snake_case codes, each found by the lookup", () => {
    const codes = credentialTypes.map((t) => t.code);

    expect(new Set(codes).size).toBe(codes.length);
    expect(codes.every((code) => /^[a-z][a-z0-9_]*$/.test(code))).toBe(true);
    expect(codes.every((code) => credentialTypeByCode.get(code)?.code === code)).toBe(true);
  });

  it("holds insurance at company level with policy fields, and training at technician level", () => {
    const insurance = credentialTypes.filter((t) => t.category === "insurance");
    const safety = credentialTypes.filter((t) => t.category === "safety");

    expect(insurance.every((t) => t.holder === "company")).toBe(true);
    expect(safety.every((t) => t.holder === "technician" && t.fieldSet === "training")).toBe(true);
    expect(credentialTypes.every((t) => (fieldSets as readonly string[]).includes(t.fieldSet))).toBe(true);
  });

  it.each([
    { code: "arc_flash", months: 36 }, // NFPA 70E (2024) 110.6(A)(3): not to exceed 3 years
    { code: "powered_truck", months: 36 }, // 29 CFR 1910.178(l)(4)(iii): at least once every 3 years
    // Common practice: 29 CFR 1910.147(c)(7)(iii) retrains on changes, with no calendar interval; a yearly refresher
    // matches the at-least-annual periodic inspection of 1910.147(c)(6)(i).
    { code: "lockout_tagout", months: 12 },
    // Common practice, the same regulatory shape: 29 CFR 1910.146(g)(2) retrains on changes, with no calendar interval.
    { code: "confined_space", months: 12 },
    { code: "first_aid_cpr", months: 24 }, // common practice (American Heart Association course cards last 2 years)
    // Common practice, varies by state: an exemption with no printed expiry counts 24 months from issue.
    { code: "workers_comp_exemption", months: 24 },
  ])("renews $code every $months months from issue", ({ code, months }) => {
    const validity = credentialTypeByCode.get(code)?.validity;

    expect(validity).toEqual({ kind: "months_from_issue", months });
  });

  it.each(["osha_10", "osha_30"])("gives %s no calendar expiry", (code) => {
    const validity = credentialTypeByCode.get(code)?.validity;

    // osha.gov Outreach Training Program FAQ: the federal outreach cards do not expire
    expect(validity).toEqual({ kind: "no_expiry" });
  });

  it.each(["lockout_tagout", "confined_space"])(
    "says in %s's catalog text that its 12 months are common practice and that the site decides",
    (code) => {
      const description = credentialTypeByCode.get(code)?.description ?? "";

      expect(description).toContain("common practice");
      expect(description).toContain("requirement set decides");
      expect(description).toMatch(/29 CFR 1910\.14[67]/);
    },
  );

  it("takes policy dates from the document and accepts a state exemption as its own type", () => {
    const exemption = credentialTypeByCode.get("workers_comp_exemption");

    expect(credentialTypeByCode.get("general_liability")?.validity).toEqual({ kind: "document_dates" });
    expect(exemption).toMatchObject({
      holder: "company",
      fieldSet: "exemption",
      validity: { kind: "months_from_issue", months: 24 },
    });
  });
});
