import type { RequirementSetInput } from "@shared/standing/schemas.ts";

export const requirementSetKeys = {
  all: ["requirement-sets"] as const,
  list: () => [...requirementSetKeys.all, "list"] as const,
  preview: (input: RequirementSetInput) => [...requirementSetKeys.all, "preview", input] as const,
};
