import { describe, expect, it } from "vitest";
import { countTicks, labelsShown } from "../../../src/features/credentials/components/lapse-chart-scale.ts";

// Chart axes (common practice): whole-number ticks from zero in 1-2-5 steps, reaching at least the tallest bar.
describe("lapse chart count ticks", () => {
  it("gives 0 and 1 for an empty timeline", () => {
    expect(countTicks(0)).toEqual([0, 1]);
  });
  it("steps by one for small counts and reaches the tallest bar", () => {
    expect(countTicks(3)).toEqual([0, 1, 2, 3]);
    expect(countTicks(4)).toEqual([0, 1, 2, 3, 4]);
  });
  it("steps by 2, 5 and 10 as counts grow, never below the maximum", () => {
    expect(countTicks(7)).toEqual([0, 2, 4, 6, 8]);
    expect(countTicks(17)).toEqual([0, 5, 10, 15, 20]);
    expect(countTicks(33)).toEqual([0, 10, 20, 30, 40]);
    for (let max = 1; max <= 500; max += 1) {
      const ticks = countTicks(max);
      expect(ticks[ticks.length - 1]).toBeGreaterThanOrEqual(max);
      expect(ticks.length).toBeLessThanOrEqual(6);
    }
  });
});

describe("lapse chart week labels", () => {
  it("shows every label when each bar is wider than a label", () => {
    expect(labelsShown(4, 60, 52)).toEqual([0, 1, 2, 3]);
  });
  it("shows every k-th label and always the last, without overlapping the one before it", () => {
    expect(labelsShown(12, 20, 52)).toEqual([0, 3, 6, 11]);
    expect(labelsShown(13, 20, 52)).toEqual([0, 3, 6, 9, 12]);
    for (const shown of [labelsShown(12, 20, 52), labelsShown(26, 11, 52)]) {
      for (let i = 1; i < shown.length; i += 1) {
        expect((shown[i]! - shown[i - 1]!) * 20).toBeGreaterThanOrEqual(52);
      }
    }
  });
  it("shows nothing for no weeks", () => {
    expect(labelsShown(0, 10, 52)).toEqual([]);
  });
});
