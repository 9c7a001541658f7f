import { AxeBuilder } from "@axe-core/playwright";
import type { Page } from "playwright-core";

/** WCAG 2 A and AA problems that axe rates serious or critical, as "rule: target" lines (empty when clean). */
export async function seriousAccessibilityProblems(page: Page): Promise<string[]> {
  const { violations } = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa"]).analyze();
  return violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .flatMap((v) => v.nodes.map((n) => `${v.id}: ${n.target.join(" ")}`));
}
