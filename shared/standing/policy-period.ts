import { DateTime } from "luxon";
import { parseIsoDate, utcMilliseconds } from "./iso-date.ts";

const MINUTES_PAST_MIDNIGHT = 1; // 12:01 a.m. (ISO CG DS 01 wording, from memory)
const MS_PER_MINUTE = 60_000;

/**
 * The zone's standard UTC offset in minutes for a year: the smaller (more negative) of its offsets on 1 January and
 * 1 July, because daylight saving time always adds to the standard offset (standard time all year, ISO CG DS 01 wording, from memory).
 */
// (zone, year) -> minutes: the engine asks for the same few zones and years for every policy of every holder, and each
// luxon zone lookup formats a date through Intl; tz rules for a year do not change while the process runs.
const standardOffsets = new Map<string, number>();

export function standardOffsetMinutes(timeZone: string, year: number): number {
  const key = `${timeZone}|${year}`;
  const known = standardOffsets.get(key);
  if (known !== undefined) return known;
  const january = DateTime.fromObject({ year, month: 1, day: 1 }, { zone: timeZone });
  const july = DateTime.fromObject({ year, month: 7, day: 1 }, { zone: timeZone });
  if (!january.isValid || !july.isValid) throw new RangeError(`Unknown IANA time zone: ${timeZone}`);
  const minutes = Math.min(january.offset, july.offset);
  standardOffsets.set(key, minutes);
  return minutes;
}

/**
 * 12:01 a.m. standard time at the insured's address on a policy date. Daylight saving time is ignored on purpose:
 * standard policy wording says "standard time", so in summer the cut-off is 1:01 a.m. on the wall clock (ISO CG DS 01 wording, from memory).
 */
export function policyCutoffInstant(isoDate: string, timeZone: string): Date {
  const { year, month, day } = parseIsoDate(isoDate);
  const wallClockAsUtc = utcMilliseconds(year, month - 1, day, 0, MINUTES_PAST_MIDNIGHT);
  return new Date(wallClockAsUtc - standardOffsetMinutes(timeZone, year) * MS_PER_MINUTE);
}

/** First instant the policy is in force. */
export function policyStartInstant(effectiveDate: string, timeZone: string): Date {
  return policyCutoffInstant(effectiveDate, timeZone);
}

/** First instant the policy is no longer in force: it is not in force for the rest of its expiration date (ISO CG DS 01 wording, from memory). */
export function policyEndInstant(expirationDate: string, timeZone: string): Date {
  return policyCutoffInstant(expirationDate, timeZone);
}

export interface PolicyPeriod {
  effectiveDate: string;
  expirationDate: string;
}

/** In force on the half-open interval [effective 00:01 std, expiration 00:01 std) (ISO CG DS 01 wording, from memory). */
export function isPolicyInForce(period: PolicyPeriod, timeZone: string, asOf: Date): boolean {
  const at = asOf.getTime();
  return (
    policyStartInstant(period.effectiveDate, timeZone).getTime() <= at &&
    at < policyEndInstant(period.expirationDate, timeZone).getTime()
  );
}
