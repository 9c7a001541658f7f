import { describe, expect, it } from "vitest";
import { instantFromLocal, localFromInstant } from "../../../shared/dates/zoned-instant.ts";

describe("a wall-clock time at a site becomes one instant", () => {
  it("reads Chicago winter time as UTC-6 and summer time as UTC-5", () => {
    // Central Standard Time is UTC-6, Central Daylight Time UTC-5 (15 U.S.C. §260a; IANA tz database America/Chicago).
    expect(instantFromLocal("2027-01-15T08:30", "America/Chicago")?.toISOString()).toBe(
      "2027-01-15T14:30:00.000Z",
    );
    expect(instantFromLocal("2027-07-15T08:30", "America/Chicago")?.toISOString()).toBe(
      "2027-07-15T13:30:00.000Z",
    );
  });

  it("refuses a time skipped when clocks go forward, and reads a repeated hour as the first one", () => {
    // In 2027 US clocks go forward at 2:00 on Mar 14 and back at 2:00 on Nov 7 (15 U.S.C. §260a: second Sunday
    // in March, first Sunday in November).
    expect(instantFromLocal("2027-03-14T02:30", "America/Chicago")).toBeNull();
    expect(instantFromLocal("2027-11-07T01:30", "America/Chicago")?.toISOString()).toBe(
      "2027-11-07T06:30:00.000Z",
    );
  });

  it("takes zones without daylight saving and refuses days that do not exist", () => {
    // Arizona stays on MST, UTC-7, all year (IANA tz database America/Phoenix).
    expect(instantFromLocal("2027-07-01T07:00", "America/Phoenix")?.toISOString()).toBe(
      "2027-07-01T14:00:00.000Z",
    );
    expect(instantFromLocal("2027-02-30T07:00", "America/Chicago")).toBeNull();
    expect(instantFromLocal("tomorrow at 7", "America/Chicago")).toBeNull();
  });

  it("shows the instant back as the same wall-clock time in the zone", () => {
    const instant = instantFromLocal("2027-03-15T08:30", "America/New_York")!;
    expect(localFromInstant(instant, "America/New_York")).toBe("2027-03-15T08:30");
    expect(localFromInstant(instant, "America/Los_Angeles")).toBe("2027-03-15T05:30");
  });
});
