/**
 * Who may read which part of a machine's service history once it has changed hands. A machine's history follows it to
 * the next shop, but what a shop paid, wrote and who worked for it stay that shop's own: a new owner reads past entries
 * in their carried form only, and a seller keeps its own entries (read only) up to the day it handed the machine over.
 */

/** One shop's time with the machine: from the instant it arrived to the instant it left (null while it stays). */
export interface OwnershipPeriod {
  companyId: number;
  /** ISO instant. */
  from: string;
  /** ISO instant, or null for the current owner. */
  to: string | null;
}

/** own: every field; carried: the fields that follow the machine; none: the entry is not shown at all. */
export type HistoryAccess = "own" | "carried" | "none";

/** What follows the machine to its next owner (the date, kind of work, company, work done and parts). */
export const carriedHistoryFields = [
  "occurredAt",
  "kind",
  "serviceCompanyName",
  "workDone",
  "parts",
  "recordedByShop",
] as const;
export type CarriedHistoryField = (typeof carriedHistoryFields)[number];

/** What stays with the shop that owned the machine at the time: its prices, its messages, its people. */
export const withheldHistoryFields = [
  "prices",
  "hours",
  "messages",
  "technicianName",
  "technicianStanding",
  "recordedBy",
  "attachments",
  "workOrderId",
] as const;

const inPeriod = (p: OwnershipPeriod, at: number) =>
  Date.parse(p.from) <= at && (p.to === null || at < Date.parse(p.to));

/** The shop that held the machine at `at` (a period runs from its start, inclusive, to its end, exclusive). */
export function ownerAt(periods: readonly OwnershipPeriod[], at: Date): number | null {
  const t = at.getTime();
  return periods.find((p) => inPeriod(p, t))?.companyId ?? null;
}

/**
 * How much of an entry dated `at` the reader sees. The current owner sees the whole history, its own periods in full
 * and everyone else's carried; a former owner sees the history up to the end of its last period the same way, and
 * nothing after it; a shop that never held the machine sees nothing.
 */
export function historyAccess(
  readerCompanyId: number,
  periods: readonly OwnershipPeriod[],
  at: Date,
): HistoryAccess {
  const own = periods.filter((p) => p.companyId === readerCompanyId);
  if (own.length === 0) return "none";
  const t = at.getTime();
  const horizon = own.some((p) => p.to === null)
    ? Number.POSITIVE_INFINITY
    : Math.max(...own.map((p) => Date.parse(p.to!)));
  if (t >= horizon) return "none";
  return own.some((p) => inPeriod(p, t)) ? "own" : "carried";
}

/** The reader may add to the history only while it owns the machine; a former owner's copy is read only. */
export function canWriteHistory(readerCompanyId: number, periods: readonly OwnershipPeriod[]): boolean {
  return periods.some((p) => p.companyId === readerCompanyId && p.to === null);
}

/** An entry cut down to what follows the machine; every other field is left behind. */
export function carriedEntry<T extends Partial<Record<CarriedHistoryField, unknown>>>(
  entry: T,
): Pick<T, Extract<keyof T, CarriedHistoryField>> {
  const out: Partial<T> = {};
  for (const key of carriedHistoryFields)
    if (key in entry) (out as Record<string, unknown>)[key] = entry[key];
  return out as Pick<T, Extract<keyof T, CarriedHistoryField>>;
}
