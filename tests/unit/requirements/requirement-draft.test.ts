import { describe, expect, it } from "vitest";
import {
  emptyRequirementDraft,
  fromRequirementDraft,
  toRequirementDraft,
} from "../../../src/components/requirements/requirement-draft.ts";
import { requirementSetInputSchema } from "../../../shared/standing/schemas.ts";

describe("the requirement editor's draft", () => {
  it("reaches the shared schema's refusal of additional insured on workers' compensation at the checkbox's path", () => {
    const draft = {
      ...emptyRequirementDraft(),
      label: "Workers' comp",
      typeCodes: ["workers_comp"],
      additionalInsured: true,
    };

    const parsed = requirementSetInputSchema.safeParse({
      name: "Plant 2",
      requirements: [fromRequirementDraft(draft)],
    });

    // Common practice: no certificate can show additional insured on the workers' compensation line.
    expect(parsed.error?.issues.map((i) => i.path.join("."))).toEqual(["requirements.0.additionalInsured"]);
  });

  it("keeps statutory limits and the employer's liability disease limits through a round trip", () => {
    const requirement = {
      label: "WC statutory, EL 500/500/500",
      typeCodes: ["workers_comp"],
      statutory: true,
      minLimits: {
        employersLiabilityEachAccident: 500_000,
        employersLiabilityDiseaseEachEmployee: 500_000,
        employersLiabilityDiseasePolicyLimit: 500_000,
      },
    };

    const back = fromRequirementDraft(toRequirementDraft(requirement));

    expect(back).toMatchObject(requirement);
    expect(toRequirementDraft(requirement).limits.employersLiabilityDiseasePolicyLimit).toBe("500000");
  });
});
