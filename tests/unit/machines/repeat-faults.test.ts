import { describe, expect, it } from "vitest";
import {
  findRepeatFaults,
  readPartLines,
  REPEAT_FAULT_WINDOW_DAYS,
  type FaultCandidate,
} from "../../../shared/machines/service-history.ts";

const repair = (key: string, date: string, problemArea: FaultCandidate["problemArea"] = "spindle") => ({
  key,
  date,
  kind: "repair" as const,
  problemArea,
});

describe("repeat faults on one machine", () => {
  it("uses a 90-day window (common practice for a repeat or callback repair)", () => {
    expect(REPEAT_FAULT_WINDOW_DAYS).toBe(90);
  });

  it("flags a repair in the same area on day 90 after the one before, but not on day 91 (common practice)", () => {
    // 2027-01-01 + 90 days = 2027-04-01; + 91 days = 2027-04-02.
    const onDay90 = findRepeatFaults([repair("a", "2027-01-01"), repair("b", "2027-04-01")]);
    const onDay91 = findRepeatFaults([repair("a", "2027-01-01"), repair("b", "2027-04-02")]);

    expect(onDay90.get("b")).toBe("a");
    expect(onDay90.get("a")).toBeNull();
    expect(onDay91.get("b")).toBeNull();
  });

  it("counts calendar days across a leap day (2028 is a leap year)", () => {
    // 2027-12-01 → 2028-02-29 is 90 days because February 2028 has 29 days.
    const result = findRepeatFaults([repair("a", "2027-12-01"), repair("b", "2028-02-29")]);

    expect(result.get("b")).toBe("a");
  });

  it("does not compare different problem areas, planned work, or faults filed under other", () => {
    const result = findRepeatFaults([
      repair("a", "2027-03-01", "spindle"),
      repair("b", "2027-03-10", "tool_changer"),
      { key: "c", date: "2027-03-12", kind: "preventive_maintenance", problemArea: "spindle" },
      repair("d", "2027-03-15", "other"),
      repair("e", "2027-03-20", "other"),
      repair("f", "2027-03-25", null),
    ]);

    expect([...result.values()]).toEqual([null, null, null, null, null, null]);
  });

  it("points each repeat at the latest earlier fault, whatever order the entries arrive in", () => {
    const result = findRepeatFaults([
      repair("c", "2027-05-20"),
      repair("a", "2027-01-05"),
      repair("b", "2027-03-01"),
    ]);

    expect(result.get("b")).toBe("a");
    expect(result.get("c")).toBe("b");
    expect(result.get("a")).toBeNull();
  });
});

describe("parts typed one a line", () => {
  it("reads a count, a description and a part number after the last comma", () => {
    expect(readPartLines("2 × Way wiper, WW-220\n 3x Fuse, 5 A, F-5 \n\nSpindle seal kit")).toEqual([
      { description: "Way wiper", partNumber: "WW-220", quantity: 2 },
      { description: "Fuse, 5 A", partNumber: "F-5", quantity: 3 },
      { description: "Spindle seal kit", partNumber: null, quantity: 1 },
    ]);
  });

  it("reads nothing from blank text", () => {
    expect(readPartLines("  \n ")).toEqual([]);
  });
});
