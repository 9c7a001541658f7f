import { DateTime } from "luxon";

/** Common practice for a service office: Monday to Friday, 8 a.m. to 5 p.m. at the site. Configurable per call. */
export interface BusinessDay {
  startHour: number;
  endHour: number;
  /** ISO weekdays that are working days (1 = Monday ... 7 = Sunday). */
  weekdays: readonly number[];
}

export const DEFAULT_BUSINESS_DAY: BusinessDay = { startHour: 8, endHour: 17, weekdays: [1, 2, 3, 4, 5] };

/** The next opening at or after `local` (the same instant when it is inside business hours). */
function nextOpen(local: DateTime, day: BusinessDay): DateTime {
  let cursor = local;
  for (let i = 0; i < 14; i += 1) {
    const open = cursor.set({ hour: day.startHour, minute: 0, second: 0, millisecond: 0 });
    const close = cursor.set({ hour: day.endHour, minute: 0, second: 0, millisecond: 0 });
    if (day.weekdays.includes(cursor.weekday)) {
      if (cursor < open) return open;
      if (cursor < close) return cursor;
    }
    cursor = cursor.plus({ days: 1 }).set({ hour: day.startHour, minute: 0, second: 0, millisecond: 0 });
    if (day.weekdays.includes(cursor.weekday)) return cursor;
  }
  throw new RangeError("No working day in the business week");
}

/**
 * The instant at which `hours` business hours have passed since `start`, counted on the wall clock of `timeZone`.
 * Hours outside the business day and on days off do not count. Opening and closing are wall-clock times, so a day on
 * which the clocks change still has its full business day; the elapsed real time inside it is what counts.
 */
export function addBusinessHours(
  start: Date,
  hours: number,
  timeZone: string,
  day: BusinessDay = DEFAULT_BUSINESS_DAY,
): Date {
  if (!(hours >= 0)) throw new RangeError("hours must be 0 or more");
  let remainingMs = hours * 3_600_000;
  let cursor = nextOpen(DateTime.fromJSDate(start, { zone: timeZone }), day);
  for (;;) {
    const close = cursor.set({ hour: day.endHour, minute: 0, second: 0, millisecond: 0 });
    const available = close.toMillis() - cursor.toMillis();
    if (remainingMs <= available) return new Date(cursor.toMillis() + remainingMs);
    remainingMs -= available;
    cursor = nextOpen(close.plus({ minutes: 1 }), day);
  }
}

/** Business hours elapsed between two instants (0 when `to` is not after `from`). */
export function businessHoursBetween(
  from: Date,
  to: Date,
  timeZone: string,
  day: BusinessDay = DEFAULT_BUSINESS_DAY,
): number {
  if (to <= from) return 0;
  let total = 0;
  let cursor = nextOpen(DateTime.fromJSDate(from, { zone: timeZone }), day);
  const end = to.getTime();
  while (cursor.toMillis() < end) {
    const close = cursor.set({ hour: day.endHour, minute: 0, second: 0, millisecond: 0 });
    total += Math.min(close.toMillis(), end) - cursor.toMillis();
    cursor = nextOpen(close.plus({ minutes: 1 }), day);
  }
  return total / 3_600_000;
}

/** A wall-clock "2026-12-04T09:30" at the site as an instant; null when that time does not exist (spring forward). */
export function siteLocalToInstant(local: string, timeZone: string): Date | null {
  const parsed = DateTime.fromISO(local, { zone: timeZone });
  if (!parsed.isValid) return null;
  // Luxon moves a nonexistent time forward; such a time was never on the site's clock.
  if (parsed.toFormat("yyyy-MM-dd'T'HH:mm") !== local) return null;
  return parsed.toJSDate();
}

/** The reminder threshold in business hours for a request: machine down is chased sooner. */
export function reminderThresholdHours(
  machineState: "down" | "running_fault" | "planned",
  config: { normalHours: number; downHours: number },
): number {
  return machineState === "down" ? config.downHours : config.normalHours;
}
