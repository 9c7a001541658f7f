import { describe, expect, it } from "vitest";
import { formatCalendarDate, formatLocalDate } from "../../../shared/dates/local-time.ts";

describe("readable dates", () => {
  it("names the calendar day an instant falls on in the given zone", () => {
    const instant = new Date("2027-07-15T03:30:00Z");

    expect(formatLocalDate(instant, "America/Chicago")).toBe("Jul 14, 2027");
    expect(formatLocalDate(instant, "UTC")).toBe("Jul 15, 2027");
  });

  it("prints a printed calendar date the same in every zone", () => {
    expect(formatCalendarDate("2027-01-05")).toBe("Jan 5, 2027");
  });

  it("leaves text that is not a date as it came", () => {
    expect(formatCalendarDate("soon")).toBe("soon");
  });
});
