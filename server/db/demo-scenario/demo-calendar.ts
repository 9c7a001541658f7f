import { DateTime } from "luxon";
import { addCalendarDays } from "../../../shared/standing/iso-date.ts";
import { addCalendarMonths } from "../../../shared/standing/training-validity.ts";

/** Calendar dates and instants relative to the demo's "today", so the scenario reads the same on any date. */
export interface DemoCalendar {
  today: string;
  /** The calendar date `days` from today (negative: in the past). */
  days(days: number): string;
  /** The calendar date `months` (then `days`) from today, clamped to month end. */
  months(months: number, days?: number): string;
  /** An instant on a calendar date at a local office hour. */
  at(isoDate: string, hour?: number): Date;
}

// The demo world's offices are in the US Central zone; one zone keeps "today" the same for all of them.
const DEMO_ZONE = "America/Chicago";

export function demoCalendar(today: Date): DemoCalendar {
  const todayIso = DateTime.fromJSDate(today, { zone: DEMO_ZONE }).toISODate();
  if (!todayIso) throw new RangeError("Invalid demo date");
  return {
    today: todayIso,
    days: (days) => addCalendarDays(todayIso, days),
    months: (months, days = 0) => addCalendarDays(addCalendarMonths(todayIso, months), days),
    at: (isoDate, hour = 10) => DateTime.fromISO(isoDate, { zone: DEMO_ZONE }).set({ hour }).toJSDate(),
  };
}
