import { describe, expect, it } from "vitest";
import {
  downtimeByMonth,
  serviceTimesByCompany,
  summariseDowntime,
} from "../../../shared/machines/downtime.ts";
import { median } from "../../../shared/stats/median.ts";

const CHICAGO = "America/Chicago";
const at = (iso: string) => new Date(iso);

describe("hours down per month", () => {
  it("charts twelve calendar months of the site's zone, oldest first, ending with this one", () => {
    const months = downtimeByMonth([], at("2027-06-15T17:00:00Z"), CHICAGO);
    expect(months.map((m) => m.month)).toEqual([
      "2026-07",
      "2026-08",
      "2026-09",
      "2026-10",
      "2026-11",
      "2026-12",
      "2027-01",
      "2027-02",
      "2027-03",
      "2027-04",
      "2027-05",
      "2027-06",
    ]);
    expect(months.every((m) => m.hours === 0)).toBe(true);
  });

  it("splits a stoppage over a month end at the site's midnight, not at UTC's", () => {
    // Down from 10 PM on Apr 30 to 2 AM on May 1, Chicago daylight time (UTC-5): 2 h in April, 2 h in May. Read at
    // UTC midnight, all four hours would fall in May.
    const months = downtimeByMonth(
      [{ startedAt: at("2027-05-01T03:00:00Z"), endedAt: at("2027-05-01T07:00:00Z") }],
      at("2027-05-20T12:00:00Z"),
      CHICAGO,
    );
    expect(months.find((m) => m.month === "2027-04")?.hours).toBe(2);
    expect(months.find((m) => m.month === "2027-05")?.hours).toBe(2);
  });

  it("gives a month of a clock change its real length", () => {
    // US daylight saving time begins at 2 AM on the second Sunday of March and ends at 2 AM on the first Sunday of
    // November (15 U.S.C. 260a, as amended by the Energy Policy Act of 2005, sec. 110): March 2027 in Chicago lasts
    // 31 x 24 - 1 = 743 hours, November 2026 lasts 30 x 24 + 1 = 721 hours.
    const wholeMonths = [
      { startedAt: at("2026-11-01T05:00:00Z"), endedAt: at("2026-12-01T06:00:00Z") },
      { startedAt: at("2027-03-01T06:00:00Z"), endedAt: at("2027-04-01T05:00:00Z") },
    ];
    const months = downtimeByMonth(wholeMonths, at("2027-04-10T12:00:00Z"), CHICAGO);
    expect(months.find((m) => m.month === "2026-11")?.hours).toBe(721);
    expect(months.find((m) => m.month === "2027-03")?.hours).toBe(743);
  });

  it("counts a machine still down up to now, and nothing from before the chart", () => {
    const periods = [
      { startedAt: at("2025-01-01T00:00:00Z"), endedAt: at("2025-01-02T00:00:00Z") },
      { startedAt: at("2027-06-15T12:00:00Z"), endedAt: null },
    ];
    const now = at("2027-06-15T18:30:00Z");
    expect(downtimeByMonth(periods, now, CHICAGO).at(-1)).toEqual({ month: "2027-06", hours: 6.5 });
    const summary = summariseDowntime(periods, now, CHICAGO);
    expect(summary.totalHours).toBe(6.5);
    expect(summary.periods).toBe(1);
    expect(summary.downSince?.toISOString()).toBe("2027-06-15T12:00:00.000Z");
    expect(summary.medianHoursToRestore).toBeNull();
  });

  it("takes the median time to run again over the stoppages that ended", () => {
    const day = (d: number, hours: number) => ({
      startedAt: at(`2027-02-${String(d).padStart(2, "0")}T14:00:00Z`),
      endedAt: at(
        new Date(
          Date.parse(`2027-02-${String(d).padStart(2, "0")}T14:00:00Z`) + hours * 3_600_000,
        ).toISOString(),
      ),
    });
    const summary = summariseDowntime(
      [day(1, 2), day(8, 30), day(15, 5)],
      at("2027-03-01T00:00:00Z"),
      CHICAGO,
    );
    expect(summary.medianHoursToRestore).toBe(5);
    expect(summary.totalHours).toBe(37);
    expect(summary.periods).toBe(3);
  });

  it("cuts months in the site's zone on the far side of the date line too", () => {
    // Pacific/Auckland is 13 hours ahead in January: 11:00 UTC on Jan 31 is already Feb 1 there.
    const months = downtimeByMonth(
      [{ startedAt: at("2027-01-31T10:00:00Z"), endedAt: at("2027-01-31T12:00:00Z") }],
      at("2027-02-10T00:00:00Z"),
      "Pacific/Auckland",
    );
    expect(months.find((m) => m.month === "2027-01")?.hours).toBe(1);
    expect(months.find((m) => m.month === "2027-02")?.hours).toBe(1);
  });
});

describe("response and repair times per company", () => {
  const job = (companyId: number, called: string, onSite: string | null, done: string | null) => ({
    companyId,
    companyName: companyId === 1 ? "Harrow Spindle Service" : "Quill Axis Repair",
    calledAt: at(called),
    onSiteAt: onSite ? at(onSite) : null,
    completedAt: done ? at(done) : null,
  });

  it("takes each company's medians, most jobs first", () => {
    const times = serviceTimesByCompany([
      job(2, "2027-01-04T08:00:00Z", "2027-01-04T12:00:00Z", "2027-01-04T15:00:00Z"),
      job(1, "2027-02-01T08:00:00Z", "2027-02-01T10:00:00Z", "2027-02-01T11:00:00Z"),
      job(1, "2027-03-01T08:00:00Z", "2027-03-02T08:00:00Z", "2027-03-02T14:00:00Z"),
    ]);
    expect(times).toEqual([
      {
        companyId: 1,
        companyName: "Harrow Spindle Service",
        workOrders: 2,
        medianResponseHours: 13,
        medianRepairHours: 3.5,
      },
      {
        companyId: 2,
        companyName: "Quill Axis Repair",
        workOrders: 1,
        medianResponseHours: 4,
        medianRepairHours: 3,
      },
    ]);
  });

  it("leaves out a time that runs backwards or has no end instead of counting it as zero", () => {
    const [times] = serviceTimesByCompany([
      job(1, "2027-02-01T08:00:00Z", "2027-02-03T08:00:00Z", "2027-02-02T08:00:00Z"),
      job(1, "2027-02-05T08:00:00Z", null, "2027-02-05T12:00:00Z"),
    ]);
    expect(times).toMatchObject({ workOrders: 2, medianResponseHours: 48, medianRepairHours: null });
  });
});

describe("median", () => {
  it("is the middle value, or the mean of the two middle ones", () => {
    expect(median([])).toBeNull();
    expect(median([7, 1, 3])).toBe(3);
    expect(median([4, 1, 3, 10])).toBe(3.5);
  });
});
