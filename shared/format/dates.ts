import { DateTime } from "luxon";

/**
 * Dates people read: "Jul 15, 2027" (US month-day-year with the month spelled), never ISO digits. One formatter so a
 * sentence on a work order, a directory card and a warning mail all print a date the same way.
 */
const READABLE = "LLL d, yyyy";

/** The calendar day an instant falls on in `timeZone` (the holder's or the reader's), e.g. "Jul 15, 2027". */
export function readableDate(instant: Date, timeZone: string): string {
  const local = DateTime.fromJSDate(instant, { zone: timeZone });
  return local.isValid ? local.setLocale("en-US").toFormat(READABLE) : instant.toISOString();
}

/** A printed calendar date (`YYYY-MM-DD`, no zone: an issue date on a card is the same day everywhere). */
export function readableCalendarDate(isoDate: string): string {
  const day = DateTime.fromISO(isoDate, { zone: "UTC" });
  return day.isValid ? day.setLocale("en-US").toFormat(READABLE) : isoDate;
}
