import { daysInMonth } from "../standing/iso-date.ts";

/**
 * Dates as printed on certificates and cards. US documents print MM/DD/YYYY (sometimes M/D/YY); some
 * systems print ISO. We keep calendar dates as ISO text so no time zone can move them.
 */
export const documentDateFormats = ["MM/DD/YYYY", "M/D/YY", "YYYY-MM-DD"] as const;
export type DocumentDateFormat = (typeof documentDateFormats)[number];

// Two-digit years: 00-68 are 20xx, 69-99 are 19xx (the POSIX strptime %y rule), so no clock is needed.
const TWO_DIGIT_YEAR_PIVOT = 69;

const ISO_PATTERN = /^(\d{4})-(\d{1,2})-(\d{1,2})$/;
const US_PATTERN = /^(\d{1,2})[/.-](\d{1,2})[/.-](\d{2}|\d{4})$/;

/** Text that looks like a date in any accepted format, with common OCR look-alikes (O for 0). */
export const DATE_IN_TEXT =
  /(?<![\w/])(?:[0-9Oo]{4}-[0-9Oo]{2}-[0-9Oo]{2}|[0-9Oo]{1,2}\s?[/]\s?[0-9Oo]{1,2}\s?[/]\s?(?:[0-9Oo]{4}|[0-9Oo]{2}))(?![\w/])/g;

function isRealDate(year: number, month: number, day: number): boolean {
  if (month < 1 || month > 12 || day < 1) return false;
  return day <= daysInMonth(year, month);
}

function toIso(year: number, month: number, day: number): string | null {
  if (!isRealDate(year, month, day)) return null;
  return `${String(year).padStart(4, "0")}-${String(month).padStart(2, "0")}-${String(day).padStart(2, "0")}`;
}

/** Reads MM/DD/YYYY, M/D/YY or YYYY-MM-DD (OCR's O read as 0, stray spaces dropped) into ISO; null if not a real date. */
export function parseDocumentDate(raw: string): string | null {
  const text = raw.trim().replace(/[Oo]/g, "0").replace(/\s+/g, "");
  const iso = ISO_PATTERN.exec(text);
  if (iso) return toIso(Number(iso[1]), Number(iso[2]), Number(iso[3]));
  const us = US_PATTERN.exec(text);
  if (!us) return null;
  const yearText = us[3] ?? "";
  const shortYear = Number(yearText);
  const year =
    yearText.length === 4
      ? shortYear
      : shortYear < TWO_DIGIT_YEAR_PIVOT
        ? 2000 + shortYear
        : 1900 + shortYear;
  return toIso(year, Number(us[1]), Number(us[2]));
}

/** Prints an ISO date the way a document would. */
export function formatDocumentDate(isoDate: string, format: DocumentDateFormat): string {
  const match = ISO_PATTERN.exec(isoDate);
  if (!match) throw new RangeError(`Not an ISO date: ${isoDate}`);
  const [year, month, day] = [match[1] ?? "", Number(match[2]), Number(match[3])];
  if (format === "YYYY-MM-DD")
    return `${year}-${String(month).padStart(2, "0")}-${String(day).padStart(2, "0")}`;
  if (format === "MM/DD/YYYY")
    return `${String(month).padStart(2, "0")}/${String(day).padStart(2, "0")}/${year}`;
  return `${month}/${day}/${year.slice(-2)}`;
}

/** Every date in a piece of text, in reading order, as ISO. */
export function findDocumentDates(text: string): string[] {
  const dates: string[] = [];
  for (const match of text.matchAll(DATE_IN_TEXT)) {
    const iso = parseDocumentDate(match[0]);
    if (iso) dates.push(iso);
  }
  return dates;
}
