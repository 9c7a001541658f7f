import type { FieldSet } from "../credentials/credential-fields.ts";

/**
 * How a lapse instant reads to a person, from the same instant the standing engine uses (lapse-instant.ts), so
 * the words and the status can never disagree.
 * A card or license printed "Expiration 11/30/2028" counts for all of that local day and lapses at the start of
 * the next (common practice), so people read the printed day: "valid through Nov 30, 2028", never "Dec 1".
 * A policy ends at 12:01 a.m. standard time on its expiration date (ISO CG DS 01 declarations wording, from memory),
 * so it reads with its hour: "in force until 12:01 a.m., Nov 30, 2028".
 */
export function lapseWords(
  lapsesAt: Date | string,
  fieldSet: FieldSet | undefined,
  timeZone: string,
): string {
  const instant = typeof lapsesAt === "string" ? new Date(lapsesAt) : lapsesAt;
  if (Number.isNaN(instant.getTime())) throw new RangeError(`Bad lapse instant: ${String(lapsesAt)}`);
  // Intl rather than a date library: the same words are built in the browser, which ships no luxon.
  const day = (at: Date) => new Intl.DateTimeFormat("en-US", { dateStyle: "medium", timeZone }).format(at);
  if (fieldSet === "insurance") {
    const parts = new Intl.DateTimeFormat("en-US", {
      hour: "numeric",
      minute: "2-digit",
      timeZone,
    }).formatToParts(instant);
    const part = (type: string) => parts.find((p) => p.type === type)?.value ?? "";
    const meridiem = part("dayPeriod").toUpperCase() === "AM" ? "a.m." : "p.m.";
    return `in force until ${part("hour")}:${part("minute")} ${meridiem}, ${day(instant)}`;
  }
  // The last moment that still counts belongs to the printed day.
  return `valid through ${day(new Date(instant.getTime() - 1))}`;
}

/** The reader's own zone in a browser, UTC where none is known (tests, server). */
export function readerTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone || "UTC";
}
