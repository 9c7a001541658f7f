import { addCalendarMonths } from "../standing/training-validity.ts";
import { addCalendarDays, parseIsoDate, utcMilliseconds } from "../standing/iso-date.ts";

/** Days before a plan falls due at which the shop is reminded, once each per due date. */
export const MAINTENANCE_REMINDER_DAYS = [30, 7] as const;

/** A reading of the machine's running-hours meter on a calendar date at its site. */
export interface HourReading {
  readOn: string;
  hours: number;
}

export type MaintenanceInterval = { kind: "months"; months: number } | { kind: "hours"; hours: number };

export interface PlanFacts {
  interval: MaintenanceInterval;
  /** Calendar date the work was last done (required for a months plan). */
  lastDoneOn: string | null;
  /** Meter reading when the work was last done (required for a running-hours plan). */
  lastDoneHours: number | null;
}

export type DueState = "scheduled" | "coming_due" | "due_soon" | "due_now" | "overdue";

export interface PlanDue {
  /** The date it falls due: the calendar date for a months plan, the estimate for an hours plan (null when unknown). */
  dueOn: string | null;
  /** True when `dueOn` is projected from the meter's recent use rather than fixed by the calendar. */
  estimated: boolean;
  /** Meter reading at which a running-hours plan falls due. */
  dueHours: number | null;
  /** Latest meter reading, for an hours plan. */
  currentHours: number | null;
  /** Whole days from today at the site to `dueOn`; 0 for an hours plan whose meter already reached it. */
  daysUntil: number | null;
  state: DueState;
  /** Identifies one due occurrence, so reminders are kept once per occurrence and start again after the work. */
  dueKey: string;
}

const DAY_MS = 86_400_000;

export function daysBetween(fromIsoDate: string, toIsoDate: string): number {
  const a = parseIsoDate(fromIsoDate);
  const b = parseIsoDate(toIsoDate);
  return Math.round(
    (utcMilliseconds(b.year, b.month - 1, b.day) - utcMilliseconds(a.year, a.month - 1, a.day)) / DAY_MS,
  );
}

/**
 * The next due date of a calendar plan: the last service date plus the interval in calendar months, with the day of
 * month clamped to the end of a shorter month, the same rule as training cards (common practice). Always counted from
 * the date the work was done, never by adding intervals to a previous due date, so clamping never drifts.
 */
export function nextDueOnByMonths(lastDoneOn: string, months: number): string {
  return addCalendarMonths(lastDoneOn, months);
}

// Shorter spans say little about the rate a machine runs at; a year back keeps seasonal shutdowns in the average.
const MIN_RATE_SPAN_DAYS = 7;
const MAX_RATE_SPAN_DAYS = 365;

/**
 * Average meter hours per calendar day between the oldest reading within a year of the latest one and the latest one,
 * or null when the readings span less than a week or show no use: then no date is projected and the shop is reminded
 * only once the meter reaches the due reading.
 */
export function hoursPerDay(readings: readonly HourReading[]): number | null {
  if (readings.length < 2) return null;
  const sorted = [...readings].sort((a, b) => (a.readOn < b.readOn ? -1 : a.readOn > b.readOn ? 1 : 0));
  const latest = sorted[sorted.length - 1]!;
  const oldest = sorted.find((r) => daysBetween(r.readOn, latest.readOn) <= MAX_RATE_SPAN_DAYS)!;
  const span = daysBetween(oldest.readOn, latest.readOn);
  const used = latest.hours - oldest.hours;
  if (span < MIN_RATE_SPAN_DAYS || used <= 0) return null;
  return used / span;
}

function latestReading(readings: readonly HourReading[]): HourReading | null {
  return readings.reduce<HourReading | null>(
    (best, r) => (!best || r.readOn >= best.readOn ? r : best),
    null,
  );
}

function stateFor(daysUntil: number | null): DueState {
  if (daysUntil === null) return "scheduled";
  if (daysUntil < 0) return "overdue";
  if (daysUntil === 0) return "due_now";
  if (daysUntil <= MAINTENANCE_REMINDER_DAYS[1]) return "due_soon";
  if (daysUntil <= MAINTENANCE_REMINDER_DAYS[0]) return "coming_due";
  return "scheduled";
}

/**
 * When a plan falls due, seen on `today` (the calendar date at the machine's site). A running-hours plan is due when
 * the meter reaches the last service reading plus the interval; its date is projected from the average use since the
 * readings began (straight-line, common practice for usage-based maintenance), and once the meter reaches the due
 * reading it is due now whatever the projection said.
 */
export function planDue(plan: PlanFacts, readings: readonly HourReading[], today: string): PlanDue {
  if (plan.interval.kind === "months") {
    if (!plan.lastDoneOn) throw new RangeError("A calendar plan needs the date it was last done");
    const dueOn = nextDueOnByMonths(plan.lastDoneOn, plan.interval.months);
    const daysUntil = daysBetween(today, dueOn);
    return {
      dueOn,
      estimated: false,
      dueHours: null,
      currentHours: null,
      daysUntil,
      state: stateFor(daysUntil),
      dueKey: `date:${dueOn}`,
    };
  }
  if (plan.lastDoneHours === null)
    throw new RangeError("A running-hours plan needs the reading it was last done at");
  const dueHours = plan.lastDoneHours + plan.interval.hours;
  const latest = latestReading(readings);
  const currentHours = latest && latest.hours >= plan.lastDoneHours ? latest.hours : plan.lastDoneHours;
  const dueKey = `hours:${dueHours}`;
  if (currentHours >= dueHours)
    return { dueOn: today, estimated: false, dueHours, currentHours, daysUntil: 0, state: "due_now", dueKey };
  const rate = hoursPerDay(readings);
  if (rate === null || !latest)
    return {
      dueOn: null,
      estimated: false,
      dueHours,
      currentHours,
      daysUntil: null,
      state: "scheduled",
      dueKey,
    };
  const dueOn = addCalendarDays(latest.readOn, Math.ceil((dueHours - currentHours) / rate));
  // A projection that already passed means the meter was not read lately: remind now rather than never.
  const daysUntil = Math.max(0, daysBetween(today, dueOn));
  return { dueOn, estimated: true, dueHours, currentHours, daysUntil, state: stateFor(daysUntil), dueKey };
}

/**
 * The reminder owed today: the nearest of the thresholds already reached (so a plan first seen 5 days out gets the
 * 7-day reminder, not both), or null. Kept once per plan, due occurrence and threshold by the caller.
 */
export function reminderThresholdFor(
  daysUntil: number | null,
  thresholds: readonly number[] = MAINTENANCE_REMINDER_DAYS,
): number | null {
  if (daysUntil === null) return null;
  const reached = thresholds.filter((t) => daysUntil <= t);
  return reached.length ? Math.min(...reached) : null;
}

/**
 * The window a preventive-maintenance request asks for: the two weeks up to the due date, never starting in the past,
 * and at least a week long so a company can fit it in (our own default; the buyer may change it). A plan with no
 * known date asks for the next two weeks.
 */
export function maintenanceWindow(
  dueOn: string | null,
  today: string,
): { windowStart: string; windowEnd: string } {
  const LEAD_DAYS = 14;
  const MIN_WINDOW_DAYS = 7;
  if (!dueOn) return { windowStart: today, windowEnd: addCalendarDays(today, LEAD_DAYS) };
  const early = addCalendarDays(dueOn, -LEAD_DAYS);
  const windowStart = early > today ? early : today;
  const minEnd = addCalendarDays(windowStart, MIN_WINDOW_DAYS);
  return { windowStart, windowEnd: dueOn > minEnd ? dueOn : minEnd };
}
