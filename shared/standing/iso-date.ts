/** Calendar dates as ISO `YYYY-MM-DD` text: arithmetic on the digits, so no time zone can shift a day (common practice). */
export interface CalendarDate {
  year: number;
  month: number;
  day: number;
}

export function parseIsoDate(isoDate: string): CalendarDate {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(isoDate);
  if (!match) throw new RangeError(`Not an ISO date: ${isoDate}`);
  return { year: Number(match[1]), month: Number(match[2]), day: Number(match[3]) };
}

export function formatIsoDate({ year, month, day }: CalendarDate): string {
  return `${String(year).padStart(4, "0")}-${String(month).padStart(2, "0")}-${String(day).padStart(2, "0")}`;
}

const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31] as const;

function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

export function daysInMonth(year: number, month: number): number {
  if (month === 2 && isLeapYear(year)) return 29;
  const days = DAYS_IN_MONTH[month - 1];
  if (days === undefined) throw new RangeError(`No month ${month}`);
  return days;
}

/**
 * Milliseconds since the epoch of a UTC wall-clock time. `Date.UTC` reads years 0 to 99 as 1900 to 1999, which would
 * make a date's computed lapse disagree with the date itself; setting the full year keeps every year as written.
 */
export function utcMilliseconds(year: number, monthIndex: number, day: number, hour = 0, minute = 0): number {
  const instant = new Date(0);
  instant.setUTCFullYear(year, monthIndex, day);
  instant.setUTCHours(hour, minute, 0, 0);
  return instant.getTime();
}

export function addCalendarDays(isoDate: string, days: number): string {
  const { year, month, day } = parseIsoDate(isoDate);
  const moved = new Date(utcMilliseconds(year, month - 1, day + days));
  return formatIsoDate({
    year: moved.getUTCFullYear(),
    month: moved.getUTCMonth() + 1,
    day: moved.getUTCDate(),
  });
}
