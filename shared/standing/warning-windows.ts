/** Days before a lapse at which the daily job warns the holder, plus the lapse itself. */
export const DEFAULT_WARNING_DAYS = [60, 30, 14, 7, 1] as const;

/** The "lapsing" window for a configured list of warning days: the widest of them. */
export const lapsingWindowOf = (warningDays: readonly number[]): number => Math.max(...warningDays);

/** A requirement is "lapsing" when its credential ends within the widest warning window. */
export const LAPSING_WINDOW_DAYS = lapsingWindowOf(DEFAULT_WARNING_DAYS);

/** How far ahead the office's overview looks: past the first warning, so what comes right after it shows too. */
export const OFFICE_LOOK_AHEAD_DAYS = LAPSING_WINDOW_DAYS + 30;

export const MS_PER_DAY = 86_400_000;

export type DueThreshold = number | "lapsed";

/**
 * Which notice is due for a credential at `asOf`: "lapsed" once the lapse instant is reached (threshold 0), else the
 * smallest threshold whose window (lapse minus that many 24-hour days) we are inside, else null. The daily job keys notices
 * by (credential, threshold), so a missed run still sends the one notice that matters, and a rerun sends nothing twice.
 */
export function dueThreshold(
  lapseInstant: Date | null,
  asOf: Date,
  thresholds: readonly number[] = DEFAULT_WARNING_DAYS,
): DueThreshold | null {
  if (lapseInstant === null) return null;
  const remainingMs = lapseInstant.getTime() - asOf.getTime();
  if (remainingMs <= 0) return "lapsed";
  const inside = thresholds.filter((days) => days > 0 && remainingMs <= days * MS_PER_DAY);
  return inside.length === 0 ? null : Math.min(...inside);
}

/** Whole days left before a lapse, rounded up, for sentences such as "Lapsing in 12 days". */
export function daysUntil(lapseInstant: Date, asOf: Date): number {
  return Math.ceil((lapseInstant.getTime() - asOf.getTime()) / MS_PER_DAY);
}
