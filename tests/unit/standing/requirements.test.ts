import { describe, expect, it } from "vitest";
import { credentialTypeByCode } from "../../../shared/credentials/catalogue.ts";
import {
  defaultBaseline,
  requirementSchema,
  requirementSetSchema,
} from "../../../shared/standing/requirements.ts";

describe("requirement sets", () => {
  it("accept a site's requirements with limits, flags, age and OEM training", () => {
    const input = {
      name: "On-site spindle work",
      requirements: [
        {
          label: "General liability",
          typeCodes: ["general_liability"],
          minLimits: { eachOccurrence: 1_000_000, generalAggregate: 2_000_000 },
          additionalInsured: true,
        },
        { label: "OEM training", typeCodes: ["oem_training"], controlFamily: "Tessaline 9", minLevel: 2 },
        { label: "OSHA 10", typeCodes: ["osha_10"], maxAgeMonths: 60 },
      ],
    };

    const parsed = requirementSetSchema.safeParse(input);

    expect(parsed.success).toBe(true);
  });

  it("refuse a set without requirements", () => {
    const parsed = requirementSetSchema.safeParse({ name: "Empty", requirements: [] });

    expect(parsed.success).toBe(false);
  });

  it("refuse a requirement without credential types, an unknown limit or level 4", () => {
    const noTypes = requirementSchema.safeParse({ label: "x", typeCodes: [] });
    const unknownLimit = requirementSchema.safeParse({
      label: "x",
      typeCodes: ["general_liability"],
      minLimits: { perJob: 5 },
    });
    const levelFour = requirementSchema.safeParse({ label: "x", typeCodes: ["oem_training"], minLevel: 4 });

    expect(noTypes.success).toBe(false);
    expect(unknownLimit.success).toBe(false);
    expect(levelFour.success).toBe(false);
  });

  it("baseline asks for general liability and workers' comp or an exemption, all from the catalogue", () => {
    const codes = defaultBaseline.requirements.map((r) => r.typeCodes);

    expect(requirementSetSchema.safeParse(defaultBaseline).success).toBe(true);
    expect(codes).toEqual([["general_liability"], ["workers_comp", "workers_comp_exemption"]]);
    expect(codes.flat().every((code) => credentialTypeByCode.has(code))).toBe(true);
  });
});

describe("requirement flags that cannot apply", () => {
  // Common practice (from memory: the ACORD 25 certificate leaves "ADDL INSD" unused on the workers' compensation
  // line): workers' compensation covers the insured's own employees, so no certificate can name a site on it.
  it.each([["workers_comp"], ["workers_comp", "workers_comp_exemption"], ["workers_comp_exemption"]])(
    "refuse additional insured on workers' compensation (%s) and say why",
    (...typeCodes) => {
      const parsed = requirementSchema.safeParse({ label: "WC", typeCodes, additionalInsured: true });

      expect(parsed.success).toBe(false);
      expect(parsed.error?.issues[0]?.path).toEqual(["additionalInsured"]);
      expect(parsed.error?.issues[0]?.message).toContain("no certificate can show it");
    },
  );

  it("keep additional insured on general liability and a waiver of subrogation on workers' compensation", () => {
    const gl = requirementSchema.safeParse({
      label: "GL",
      typeCodes: ["general_liability"],
      additionalInsured: true,
    });
    const wc = requirementSchema.safeParse({
      label: "WC",
      typeCodes: ["workers_comp"],
      waiverOfSubrogation: true,
      statutory: true,
    });

    expect(gl.success).toBe(true);
    expect(wc.success).toBe(true);
  });

  it("refuse statutory limits on a line without a workers' compensation policy", () => {
    const parsed = requirementSchema.safeParse({
      label: "GL",
      typeCodes: ["general_liability"],
      statutory: true,
    });

    expect(parsed.error?.issues[0]?.path).toEqual(["statutory"]);
  });

  it("refuse the flag inside a whole set, at the requirement's path", () => {
    const parsed = requirementSetSchema.safeParse({
      name: "Plant 2",
      requirements: [
        { label: "GL", typeCodes: ["general_liability"] },
        { label: "WC", typeCodes: ["workers_comp"], additionalInsured: true },
      ],
    });

    expect(parsed.error?.issues[0]?.path).toEqual(["requirements", 1, "additionalInsured"]);
  });
});
