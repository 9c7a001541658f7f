import { describe, expect, it } from "vitest";
import {
  addBusinessHours,
  businessHoursBetween,
  reminderThresholdHours,
  siteLocalToInstant,
} from "../../../shared/service-requests/business-hours.ts";

const CHICAGO = "America/Chicago";

describe("business hours at the site (Mon-Fri 8 a.m.-5 p.m., common practice)", () => {
  it("counts hours inside one business day on the site's clock", () => {
    // Wednesday 2026-12-02 10:00 CST = 16:00Z
    const due = addBusinessHours(new Date("2026-12-02T16:00:00Z"), 3, CHICAGO);

    expect(due.toISOString()).toBe("2026-12-02T19:00:00.000Z");
  });

  it("carries what is left past 5 p.m. into the next morning", () => {
    // Wednesday 15:30 CST + 3 h = 1.5 h today + 1.5 h Thursday from 8:00 = Thursday 9:30 CST (15:30Z)
    const due = addBusinessHours(new Date("2026-12-02T21:30:00Z"), 3, CHICAGO);

    expect(due.toISOString()).toBe("2026-12-03T15:30:00.000Z");
  });

  it("skips the weekend: Friday 4 p.m. + 3 h is Monday 10 a.m.", () => {
    const due = addBusinessHours(new Date("2026-12-04T22:00:00Z"), 3, CHICAGO);

    expect(due.toISOString()).toBe("2026-12-07T16:00:00.000Z");
  });

  it("starts a request raised on a Saturday at Monday's opening", () => {
    const due = addBusinessHours(new Date("2026-12-05T18:00:00Z"), 1, CHICAGO);

    expect(due.toISOString()).toBe("2026-12-07T15:00:00.000Z");
  });

  it("opens at 8 a.m. local after the spring-forward Sunday (8 a.m. CDT = 13:00Z)", () => {
    // US clocks go forward on the second Sunday of March: 2027-03-14 (15 U.S.C. 260a).
    const due = addBusinessHours(new Date("2027-03-13T18:00:00Z"), 2, CHICAGO);

    expect(due.toISOString()).toBe("2027-03-15T15:00:00.000Z");
  });

  it("opens at 8 a.m. local after the fall-back Sunday (8 a.m. CST = 14:00Z)", () => {
    // ... and back on the first Sunday of November: 2026-11-01 (15 U.S.C. 260a).
    const due = addBusinessHours(new Date("2026-10-31T18:00:00Z"), 2, CHICAGO);

    expect(due.toISOString()).toBe("2026-11-02T16:00:00.000Z");
  });

  it("uses the site's zone, not the server's: 7 a.m. in Los Angeles is before opening there", () => {
    // Monday 2026-12-07 07:00 PST (15:00Z) is before opening; 1 h counts from 8:00 PST = 16:00Z.
    const due = addBusinessHours(new Date("2026-12-07T15:00:00Z"), 1, "America/Los_Angeles");

    expect(due.toISOString()).toBe("2026-12-07T17:00:00.000Z");
  });

  it("measures elapsed business hours as the inverse of adding them", () => {
    const from = new Date("2026-12-04T22:00:00Z");
    const to = addBusinessHours(from, 5.5, CHICAGO);

    expect(businessHoursBetween(from, to, CHICAGO)).toBeCloseTo(5.5, 6);
    expect(businessHoursBetween(to, from, CHICAGO)).toBe(0);
  });

  it("refuses a wall-clock arrival time that the spring-forward skips", () => {
    expect(siteLocalToInstant("2027-03-14T02:30", CHICAGO)).toBeNull();
    expect(siteLocalToInstant("2027-03-15T09:30", CHICAGO)?.toISOString()).toBe("2027-03-15T14:30:00.000Z");
  });

  it("chases a machine-down request sooner than planned work", () => {
    const config = { normalHours: 3, downHours: 1 };

    expect(reminderThresholdHours("down", config)).toBe(1);
    expect(reminderThresholdHours("planned", config)).toBe(3);
  });
});
