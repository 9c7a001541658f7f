import { addCalendarDays, parseIsoDate } from "../standing/iso-date.ts";

/** How far ahead a buyer may ask for a visit. */
export const PREFERRED_DATE_MAX_YEARS_AHEAD = 2;

/**
 * Whether a preferred visit date is plausible on `today` (the caller's calendar date): from yesterday (a buyer in a zone
 * behind UTC may still be on the previous day) to two years ahead. Returns the problem, or null.
 */
export function preferredDateProblem(isoDate: string, today: string): string | null {
  const earliest = addCalendarDays(today, -1);
  const { year, month, day } = parseIsoDate(today);
  const latest = `${String(year + PREFERRED_DATE_MAX_YEARS_AHEAD).padStart(4, "0")}-${String(month).padStart(2, "0")}-${String(month === 2 && day === 29 ? 28 : day).padStart(2, "0")}`;
  if (isoDate < earliest) return "Choose a date from today on";
  if (isoDate > latest) return `Choose a date within ${PREFERRED_DATE_MAX_YEARS_AHEAD} years`;
  return null;
}
