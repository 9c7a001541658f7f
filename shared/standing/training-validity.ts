import { DateTime } from "luxon";
import type { CredentialValidity } from "../credentials/catalogue.ts";
import { addCalendarDays, daysInMonth, formatIsoDate, parseIsoDate } from "./iso-date.ts";

/**
 * Adds calendar months to a calendar date, keeping the day of month clamped to the target month's last day
 * (common practice). Callers add the total to the original date: chaining clamps twice and drifts (2024-01-31 +1 +1 = 03-29).
 * Works on the date's digits, never on a Date at UTC midnight, so no time zone can shift it.
 */
export function addCalendarMonths(isoDate: string, months: number): string {
  if (!Number.isInteger(months)) throw new RangeError(`Months must be a whole number: ${months}`);
  const { year, month, day } = parseIsoDate(isoDate);
  const monthIndex = year * 12 + (month - 1) + months;
  const targetYear = Math.floor(monthIndex / 12);
  const targetMonth = monthIndex - targetYear * 12 + 1;
  return formatIsoDate({
    year: targetYear,
    month: targetMonth,
    day: Math.min(day, daysInMonth(targetYear, targetMonth)),
  });
}

/** Midnight at the start of a calendar date in a zone (luxon moves forward when a DST gap swallows midnight). */
export function startOfDateInstant(isoDate: string, timeZone: string): Date {
  const start = DateTime.fromISO(isoDate, { zone: timeZone }).startOf("day");
  if (!start.isValid) throw new RangeError(`Bad date or time zone: ${isoDate} ${timeZone}`);
  return start.toJSDate();
}

/**
 * The last calendar date a document that prints only a month and year ("Recommended renewal: 03/2027") counts
 * through: the last day of that month (common practice). Stored as that day, a month-only expiry then lapses by the
 * same rule as a printed day: at the start of the next day in the holder's zone.
 */
export function monthOnlyValidThrough(year: number, month: number): string {
  return formatIsoDate({ year, month, day: daysInMonth(year, month) });
}

export interface TrainingDates {
  issueDate: string;
  expiryDate?: string | undefined;
}

/**
 * The last calendar date on which a training credential counts, or null when it never lapses by the calendar.
 * An expiry printed on the card wins over the type's rule, even for a type that normally has no expiry: the
 * document itself says it ends. Otherwise issue date + N calendar months: an interval "not to exceed 3 years"
 * (NFPA 70E 110.6(A)(3)) is still met by retraining on that date, so the card counts through it (common practice).
 */
export function trainingValidThrough(validity: CredentialValidity, dates: TrainingDates): string | null {
  if (dates.expiryDate) return dates.expiryDate;
  if (validity.kind === "months_from_issue") return addCalendarMonths(dates.issueDate, validity.months);
  return null;
}

/**
 * When a credential that is valid through a calendar date stops counting: the start of the next day in the holder's
 * zone. A card reading "valid through" or "expires" a date is honoured for all of that local day (common practice;
 * American Heart Association cards are valid "through" the end of a month, cpr.heart.org "Course Card Information").
 */
export function endOfValidThroughInstant(validThrough: string, timeZone: string): Date {
  return startOfDateInstant(addCalendarDays(validThrough, 1), timeZone);
}

/** The instant a training credential lapses, or null for never. */
export function trainingLapseInstant(
  validity: CredentialValidity,
  dates: TrainingDates,
  timeZone: string,
): Date | null {
  const validThrough = trainingValidThrough(validity, dates);
  return validThrough === null ? null : endOfValidThroughInstant(validThrough, timeZone);
}
