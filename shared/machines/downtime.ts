import { instantFromLocal, localFromInstant } from "../dates/zoned-instant.ts";
import { median } from "../stats/median.ts";

/** How many calendar months the machine page charts, this month included. */
export const DOWNTIME_CHART_MONTHS = 12;

export interface DowntimePeriod {
  startedAt: Date;
  /** Null while the machine is still down. */
  endedAt: Date | null;
}

export interface MonthOfDowntime {
  /** "2027-03": the calendar month in the site's zone. */
  month: string;
  hours: number;
}

const HOUR_MS = 3_600_000;
const tenths = (hours: number) => Math.round(hours * 10) / 10;

/**
 * The instant a calendar month begins in a zone. Midnight on the first is tried first; in the few zones whose clocks
 * skip midnight itself on a daylight-saving change, the first minute that exists that morning.
 */
function monthStart(year: number, month: number, timeZone: string): Date {
  const y = year + Math.floor((month - 1) / 12);
  const m = ((((month - 1) % 12) + 12) % 12) + 1;
  const day = `${String(y).padStart(4, "0")}-${String(m).padStart(2, "0")}-01`;
  for (const time of ["00:00", "01:00", "02:00"]) {
    const instant = instantFromLocal(`${day}T${time}`, timeZone);
    if (instant) return instant;
  }
  throw new RangeError(`No start of ${day} in ${timeZone}`);
}

/** Hours of `period` inside [from, to), counting an open period as lasting until `now`. */
function overlapHours(period: DowntimePeriod, from: Date, to: Date, now: Date): number {
  const start = Math.max(period.startedAt.getTime(), from.getTime());
  const end = Math.min((period.endedAt ?? now).getTime(), to.getTime(), now.getTime());
  return end > start ? (end - start) / HOUR_MS : 0;
}

/**
 * Hours down in each of the last twelve calendar months of the site's zone, oldest first, this month up to `now`. A
 * period that spans a month end is split at the zone's midnight, so a machine down from the 30th to the 2nd shows in
 * both months; a month of a daylight-saving change has its real length (one hour more or less).
 */
export function downtimeByMonth(
  periods: readonly DowntimePeriod[],
  now: Date,
  timeZone: string,
  months = DOWNTIME_CHART_MONTHS,
): MonthOfDowntime[] {
  const [year, month] = localFromInstant(now, timeZone).split("-").map(Number) as [number, number];
  return Array.from({ length: months }, (_, i) => {
    const offset = month - (months - 1) + i;
    const from = monthStart(year, offset, timeZone);
    const to = monthStart(year, offset + 1, timeZone);
    const hours = periods.reduce((sum, p) => sum + overlapHours(p, from, to, now), 0);
    return { month: localFromInstant(from, timeZone).slice(0, 7), hours: tenths(hours) };
  });
}

export interface DowntimeSummary {
  /** The chart the figures are taken from. */
  months: MonthOfDowntime[];
  /** Hours down within the charted months. */
  totalHours: number;
  /** Periods that began within the charted months. */
  periods: number;
  /** Median hours from going down to running again, over the periods of the window that have ended. */
  medianHoursToRestore: number | null;
  /** When the open period began, if the machine is down now. */
  downSince: Date | null;
}

/** The figures beside the chart: how much, how often, how long until it ran again. */
export function summariseDowntime(
  periods: readonly DowntimePeriod[],
  now: Date,
  timeZone: string,
  months = DOWNTIME_CHART_MONTHS,
): DowntimeSummary {
  const chart = downtimeByMonth(periods, now, timeZone, months);
  const [year, month] = chart[0]!.month.split("-").map(Number) as [number, number];
  const windowStart = monthStart(year, month, timeZone);
  const inWindow = periods.filter((p) => p.startedAt.getTime() >= windowStart.getTime());
  const restored = inWindow.flatMap((p) =>
    p.endedAt ? [(p.endedAt.getTime() - p.startedAt.getTime()) / HOUR_MS] : [],
  );
  const toRestore = median(restored);
  return {
    months: chart,
    totalHours: tenths(chart.reduce((sum, m) => sum + m.hours, 0)),
    periods: inWindow.length,
    medianHoursToRestore: toRestore === null ? null : tenths(toRestore),
    downSince: periods.find((p) => p.endedAt === null)?.startedAt ?? null,
  };
}

/** One piece of confirmed work on the machine, with the instants its times are measured between. */
export interface TimedWork {
  companyId: number;
  companyName: string;
  /** When the company was called: its invitation to the service request, or the work order being raised. */
  calledAt: Date;
  /** The arrival on site agreed when the work was accepted; without one, the acceptance itself. */
  onSiteAt: Date | null;
  completedAt: Date | null;
}

export interface CompanyServiceTimes {
  companyId: number;
  companyName: string;
  workOrders: number;
  /** Median hours from being called to being on site. */
  medianResponseHours: number | null;
  /** Median hours from being on site to the work completed. */
  medianRepairHours: number | null;
}

/**
 * Each company's median response (called to on site) and repair (on site to completed) on this machine, most work
 * first. A time that runs backwards (an arrival agreed after the work was already completed) is left out rather than
 * counted as zero, so it cannot flatter the company.
 */
export function serviceTimesByCompany(work: readonly TimedWork[]): CompanyServiceTimes[] {
  const byCompany = new Map<number, TimedWork[]>();
  for (const w of work) byCompany.set(w.companyId, [...(byCompany.get(w.companyId) ?? []), w]);
  const hoursBetween = (from: Date | null, to: Date | null) =>
    from && to && to.getTime() >= from.getTime() ? [(to.getTime() - from.getTime()) / HOUR_MS] : [];
  const rounded = (value: number | null) => (value === null ? null : tenths(value));
  return [...byCompany.values()]
    .map((rows) => ({
      companyId: rows[0]!.companyId,
      companyName: rows[0]!.companyName,
      workOrders: rows.length,
      medianResponseHours: rounded(median(rows.flatMap((r) => hoursBetween(r.calledAt, r.onSiteAt)))),
      medianRepairHours: rounded(median(rows.flatMap((r) => hoursBetween(r.onSiteAt, r.completedAt)))),
    }))
    .sort((a, b) => b.workOrders - a.workOrders || a.companyName.localeCompare(b.companyName));
}
