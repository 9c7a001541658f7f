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
