import { describe, expect, it } from "vitest";
import {
  isPolicyInForce,
  policyEndInstant,
  policyStartInstant,
  standardOffsetMinutes,
} from "../../../shared/standing/policy-period.ts";

// Cut-off instants computed with luxon 3.7.2 and the IANA zone data, for the standard CGL declarations' "12:01 A.M. standard time" at the insured's address (ISO CG DS 01 wording, from memory).
const cutoffRows = [
  {
    zone: "America/Chicago",
    date: "2027-07-15",
    offset: -360,
    cutoff: "2027-07-15T06:01:00.000Z",
    note: "summer, 01:01 CDT",
  },
  {
    zone: "America/Chicago",
    date: "2027-01-15",
    offset: -360,
    cutoff: "2027-01-15T06:01:00.000Z",
    note: "winter, 00:01 CST",
  },
  {
    zone: "America/New_York",
    date: "2027-01-15",
    offset: -300,
    cutoff: "2027-01-15T05:01:00.000Z",
    note: "winter, 00:01 EST",
  },
  {
    zone: "America/New_York",
    date: "2027-07-15",
    offset: -300,
    cutoff: "2027-07-15T05:01:00.000Z",
    note: "summer, 01:01 EDT",
  },
  {
    zone: "America/Phoenix",
    date: "2027-07-15",
    offset: -420,
    cutoff: "2027-07-15T07:01:00.000Z",
    note: "no DST, 00:01 MST",
  },
  {
    zone: "Pacific/Honolulu",
    date: "2027-07-15",
    offset: -600,
    cutoff: "2027-07-15T10:01:00.000Z",
    note: "no DST, 00:01 HST",
  },
  {
    zone: "America/Chicago",
    date: "2027-03-14",
    offset: -360,
    cutoff: "2027-03-14T06:01:00.000Z",
    note: "spring-forward day",
  },
  {
    zone: "America/Chicago",
    date: "2027-11-07",
    offset: -360,
    cutoff: "2027-11-07T06:01:00.000Z",
    note: "fall-back day, first 01:01",
  },
] as const;

describe("policy period", () => {
  it.each(cutoffRows)(
    "ends at 12:01 a.m. standard time in $zone on $date ($note)",
    ({ zone, date, cutoff }) => {
      const end = policyEndInstant(date, zone);

      expect(end.toISOString()).toBe(cutoff); // luxon 3.7.2, IANA tz data
    },
  );

  it.each(cutoffRows)("uses the standard offset of $zone for the year of $date", ({ zone, date, offset }) => {
    const minutes = standardOffsetMinutes(zone, Number(date.slice(0, 4)));

    expect(minutes).toBe(offset); // standard offset = the smaller of the 1 January and 1 July offsets (IANA tz data)
  });

  it("starts at the same 12:01 a.m. standard time on its effective date", () => {
    const start = policyStartInstant("2026-07-15", "America/Chicago");

    expect(start.toISOString()).toBe("2026-07-15T06:01:00.000Z"); // ISO CG DS 01 (from memory): both ends at 12:01 a.m. standard time
  });

  it("is in force one second before the cut-off and not at the cut-off", () => {
    const period = { effectiveDate: "2026-07-15", expirationDate: "2027-07-15" };

    const before = isPolicyInForce(period, "America/Chicago", new Date("2027-07-15T06:00:59Z"));
    const at = isPolicyInForce(period, "America/Chicago", new Date("2027-07-15T06:01:00Z"));

    expect(before).toBe(true); // in force until the 12:01 a.m. standard-time cut-off
    expect(at).toBe(false); // half-open policy period [effective, expiration)
  });

  it("does not read 12:01 a.m. as local daylight time in summer", () => {
    const end = policyEndInstant("2027-07-15", "America/Chicago");

    expect(end.toISOString()).not.toBe("2027-07-15T05:01:00.000Z"); // local wall time would be one hour early; the declarations say standard time
  });

  it("is not in force during the rest of its expiration date", () => {
    const period = { effectiveDate: "2026-07-15", expirationDate: "2027-07-15" };

    const middayOnExpiry = isPolicyInForce(period, "America/New_York", new Date("2027-07-15T16:00:00Z"));

    expect(middayOnExpiry).toBe(false); // the policy ends at 12:01 a.m., not at the end of the business day
  });

  it("is not in force before 12:01 a.m. standard time on its effective date", () => {
    const period = { effectiveDate: "2027-01-15", expirationDate: "2028-01-15" };

    const justBefore = isPolicyInForce(period, "America/New_York", new Date("2027-01-15T05:00:59Z"));
    const atStart = isPolicyInForce(period, "America/New_York", new Date("2027-01-15T05:01:00Z"));

    expect(justBefore).toBe(false); // in force from 12:01 a.m. standard time on the effective date
    expect(atStart).toBe(true); // in force on the half-open period
  });

  it("takes the standard offset from winter in the southern hemisphere too", () => {
    const minutes = standardOffsetMinutes("Australia/Sydney", 2027);

    expect(minutes).toBe(600); // from memory: AEST +10:00, AEDT +11:00 in January
  });

  it("refuses an unknown time zone", () => {
    const act = () => policyEndInstant("2027-07-15", "America/Nowhere");

    expect(act).toThrow(RangeError);
  });
});
