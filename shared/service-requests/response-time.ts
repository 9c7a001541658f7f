import { median } from "../stats/median.ts";

/** How far back a company's answers count towards its typical response time. */
export const RESPONSE_WINDOW_DAYS = 90;

/**
 * The median of the minutes from invitation to first answer (estimate or pass), or null with no answers. The median
 * rather than the mean, so one slow weekend does not define a company.
 */
export function medianResponseMinutes(
  answers: readonly { invitedAt: Date; firstAnswerAt: Date }[],
): number | null {
  const value = median(answers.map((a) => (a.firstAnswerAt.getTime() - a.invitedAt.getTime()) / 60_000));
  return value === null ? null : Math.round(value);
}

/** Answers that count at `asOf`: invited within the window and answered. */
export function answersInWindow<T extends { invitedAt: Date; firstAnswerAt: Date | null }>(
  rows: readonly T[],
  asOf: Date,
): { invitedAt: Date; firstAnswerAt: Date }[] {
  const since = asOf.getTime() - RESPONSE_WINDOW_DAYS * 86_400_000;
  return rows.flatMap((r) =>
    r.firstAnswerAt && r.invitedAt.getTime() >= since && r.invitedAt.getTime() <= asOf.getTime()
      ? [{ invitedAt: r.invitedAt, firstAnswerAt: r.firstAnswerAt }]
      : [],
  );
}
