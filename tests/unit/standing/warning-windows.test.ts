import { describe, expect, it } from "vitest";
import { DEFAULT_WARNING_DAYS, dueThreshold } from "../../../shared/standing/warning-windows.ts";

const lapse = new Date("2027-07-15T06:01:00Z");
const daysBefore = (days: number, extraMs = 0) => new Date(lapse.getTime() - days * 86_400_000 + extraMs);

describe("warning windows", () => {
  it("warns 60, 30, 14, 7 and 1 days before a lapse by default", () => {
    const thresholds = [...DEFAULT_WARNING_DAYS];

    expect(thresholds).toEqual([60, 30, 14, 7, 1]); // the product's warning days, also the WARNING_DAYS default
  });

  it.each([
    { days: 61, due: null },
    { days: 60, due: 60 },
    { days: 45, due: 60 },
    { days: 30, due: 30 },
    { days: 29, due: 30 },
    { days: 14, due: 14 },
    { days: 8, due: 14 },
    { days: 7, due: 7 },
    { days: 1, due: 1 },
  ])("is due for the $due-day notice $days days before the lapse", ({ days, due }) => {
    const threshold = dueThreshold(lapse, daysBefore(days));

    expect(threshold).toBe(due);
  });

  it("is due for the lapse notice at the lapse instant and after", () => {
    const atLapse = dueThreshold(lapse, lapse);
    const later = dueThreshold(lapse, daysBefore(-3));

    expect(atLapse).toBe("lapsed");
    expect(later).toBe("lapsed");
  });

  it("is due for the 1-day notice one millisecond before the lapse", () => {
    const threshold = dueThreshold(lapse, daysBefore(0, -1));

    expect(threshold).toBe(1);
  });

  it("is never due for a credential that does not lapse", () => {
    const threshold = dueThreshold(null, lapse);

    expect(threshold).toBeNull();
  });

  it("uses the thresholds it is given", () => {
    const threshold = dueThreshold(lapse, daysBefore(20), [90, 21]);

    expect(threshold).toBe(21);
  });
});
