/**
 * Instants as a person reads them: in a named zone, with the zone shown ("Mar 1, 2027, 6:00 AM CST"), never raw ISO or
 * UTC. Pure: the zone is always a parameter (the reader's, or the site's on a printed page).
 */
const cache = new Map<string, Intl.DateTimeFormat>();

function formatter(timeZone: string, withTime: boolean): Intl.DateTimeFormat {
  const key = `${timeZone}|${withTime}`;
  let f = cache.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat(
      "en-US",
      withTime
        ? {
            timeZone,
            year: "numeric",
            month: "short",
            day: "numeric",
            hour: "numeric",
            minute: "2-digit",
            timeZoneName: "short",
          }
        : { timeZone, year: "numeric", month: "short", day: "numeric" },
    );
    cache.set(key, f);
  }
  return f;
}

/** "Mar 1, 2027, 6:00 AM CST" */
export function formatLocalDateTime(iso: string | Date, timeZone: string): string {
  const date = typeof iso === "string" ? new Date(iso) : iso;
  return Number.isNaN(date.getTime()) ? String(iso) : formatter(timeZone, true).format(date);
}

/** "Mar 1, 2027": the day of an instant in the zone. */
export function formatLocalDate(iso: string | Date, timeZone: string): string {
  const date = typeof iso === "string" ? new Date(iso) : iso;
  return Number.isNaN(date.getTime()) ? String(iso) : formatter(timeZone, false).format(date);
}

/** "Jan 5, 2027" for a printed calendar date (`YYYY-MM-DD`, no zone: an issue date is the same day everywhere). */
export function formatCalendarDate(isoDate: string): string {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(isoDate);
  if (!match) return isoDate;
  const noonUtc = new Date(Date.UTC(Number(match[1]), Number(match[2]) - 1, Number(match[3]), 12));
  return formatter("UTC", false).format(noonUtc);
}

/** The calendar date (YYYY-MM-DD) an instant falls on in a zone, e.g. "today" at a site, not on the server's clock. */
export function calendarDateIn(instant: Date, timeZone: string): string {
  const parts = new Intl.DateTimeFormat("en-US", {
    timeZone,
    year: "numeric",
    month: "2-digit",
    day: "2-digit",
  }).formatToParts(instant);
  const part = (type: string) => parts.find((p) => p.type === type)?.value ?? "";
  return `${part("year")}-${part("month")}-${part("day")}`;
}
