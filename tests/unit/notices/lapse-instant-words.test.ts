import { DateTime } from "luxon";
import { describe, expect, it } from "vitest";
import { formatLapseInstant } from "../../../server/notices/lapse-email.ts";

// Zone names and abbreviations: IANA time zone database (US zones with and without daylight saving time).
const ZONES = [
  "America/New_York",
  "America/Chicago",
  "America/Denver",
  "America/Phoenix",
  "America/Los_Angeles",
  "America/Anchorage",
  "Pacific/Honolulu",
  "America/Puerto_Rico",
];

describe("the lapse instant in a notice", () => {
  it("reads as the company's wall clock with the zone's abbreviation", () => {
    // 2027-07-15 06:01Z is 01:01 CDT (UTC-5); 2027-01-15 06:01Z is 00:01 CST (UTC-6).
    expect(formatLapseInstant(new Date("2027-07-15T06:01:00Z"), "America/Chicago")).toBe(
      "Thursday, July 15, 2027 at 1:01 AM CDT",
    );
    expect(formatLapseInstant(new Date("2027-01-15T06:01:00Z"), "America/Chicago")).toBe(
      "Friday, January 15, 2027 at 12:01 AM CST",
    );
    expect(formatLapseInstant(new Date("2027-07-15T19:30:00Z"), "America/Phoenix")).toBe(
      "Thursday, July 15, 2027 at 12:30 PM MST",
    );
  });

  it("says what luxon's 'cccc, LLLL d, yyyy at h:mm a ZZZZ' says, across two years and both clock changes", () => {
    // A step of 26 h 56 min walks every hour of the day and every weekday over two years; the hours around the US clock
    // changes of 2027 (March 14 and November 7, 2 a.m. local) are walked every 20 minutes.
    const start = Date.parse("2027-01-01T00:00:00Z");
    const instants: number[] = [];
    for (let t = start; t < start + 730 * 86_400_000; t += 97_000_000) instants.push(t);
    for (const day of ["2027-03-14T00:00:00Z", "2027-11-07T00:00:00Z"])
      for (let t = Date.parse(day); t < Date.parse(day) + 86_400_000; t += 1_200_000) instants.push(t);
    for (const zone of ZONES) {
      for (const t of instants) {
        const at = new Date(t);
        const expected = DateTime.fromJSDate(at, { zone }).toFormat("cccc, LLLL d, yyyy 'at' h:mm a ZZZZ");
        expect(formatLapseInstant(at, zone), `${zone} ${at.toISOString()}`).toBe(expected);
      }
    }
  });
});
