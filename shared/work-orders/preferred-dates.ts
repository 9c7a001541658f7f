import { addCalendarDays, formatIsoDate, parseIsoDate } from "../standing/iso-date.ts";

/** How far ahead a buyer may ask for a visit. */
export const PREFERRED_DATE_MAX_YEARS_AHEAD = 2;

/**
 * The plausible preferred visit dates on `today` (the caller's calendar date): from yesterday (a buyer in a zone behind
 * UTC may still be on the previous day) to the same date two years ahead (28 February for a 29 February).
 */
export function preferredDateWindow(today: string): { earliest: string; latest: string } {
  const { year, month, day } = parseIsoDate(today);
  return {
    earliest: addCalendarDays(today, -1),
    latest: formatIsoDate({
      year: year + PREFERRED_DATE_MAX_YEARS_AHEAD,
      month,
      day: month === 2 && day === 29 ? 28 : day,
    }),
  };
}

/** The problem with a preferred visit date on `today`, or null when it is plausible. */
export function preferredDateProblem(isoDate: string, today: string): string | null {
  const { earliest, latest } = preferredDateWindow(today);
  if (isoDate < earliest) return "Choose a date from today on";
  if (isoDate > latest) return `Choose a date within ${PREFERRED_DATE_MAX_YEARS_AHEAD} years`;
  return null;
}
