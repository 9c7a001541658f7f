import { daysInMonth } from "../standing/iso-date.ts";
import { monthOnlyValidThrough } from "../standing/training-validity.ts";

/**
 * Dates as printed on certificates and cards. US documents print MM/DD/YYYY (sometimes M/D/YY); some systems
 * print ISO; cards and letters spell the month ("15 Mar 2027", "March 15, 2027"); many first aid/CPR cards print
 * only a month and year ("Recommended renewal: 03/2027"). We keep calendar dates as ISO text so no time zone can
 * move them.
 */
export const documentDateFormats = [
  "MM/DD/YYYY",
  "M/D/YY",
  "YYYY-MM-DD",
  "D Mon YYYY",
  "Month D, YYYY",
] as const;
export type DocumentDateFormat = (typeof documentDateFormats)[number];

// Two-digit years: 00-68 are 20xx, 69-99 are 19xx (the POSIX strptime %y rule), so no clock is needed.
const TWO_DIGIT_YEAR_PIVOT = 69;

const MONTH_NAMES = [
  "january",
  "february",
  "march",
  "april",
  "may",
  "june",
  "july",
  "august",
  "september",
  "october",
  "november",
  "december",
] as const;
const MONTH_WORD =
  "(?:Jan(?:uary)?|Feb(?:ruary)?|Mar(?:ch)?|Apr(?:il)?|May|June?|July?|Aug(?:ust)?|Sept?(?:ember)?|Oct(?:ober)?|Nov(?:ember)?|Dec(?:ember)?)\\.?";

const ISO_PATTERN = /^(\d{4})-(\d{1,2})-(\d{1,2})$/;
const US_PATTERN = /^(\d{1,2})[/.-](\d{1,2})[/.-](\d{2}|\d{4})$/;
const DAY_MONTH_YEAR = new RegExp(`^(\\d{1,2})[\\s-]*(${MONTH_WORD})[\\s,-]*(\\d{4})$`, "i");
const MONTH_DAY_YEAR = new RegExp(`^(${MONTH_WORD})\\s*(\\d{1,2})(?:st|nd|rd|th)?,?\\s*(\\d{4})$`, "i");
const NUMERIC_MONTH_YEAR = /^(\d{1,2})\s?[/-]\s?(\d{4})$/;
const WORD_MONTH_YEAR = new RegExp(`^(${MONTH_WORD})[\\s,]*(\\d{4})$`, "i");

/** Text that looks like a full date in any accepted format, with common OCR look-alikes (O for 0). */
export const DATE_IN_TEXT = new RegExp(
  [
    "(?<![\\w/])(?:[0-9Oo]{4}-[0-9Oo]{2}-[0-9Oo]{2}|[0-9Oo]{1,2}\\s?[/]\\s?[0-9Oo]{1,2}\\s?[/]\\s?(?:[0-9Oo]{4}|[0-9Oo]{2}))(?![\\w/])",
    `(?<![\\w])\\d{1,2}[\\s-]*${MONTH_WORD}[\\s,-]*\\d{4}(?!\\w)`,
    `(?<![\\w])${MONTH_WORD}\\s*\\d{1,2}(?:st|nd|rd|th)?,?\\s*\\d{4}(?!\\w)`,
  ].join("|"),
  "gi",
);

/** A month and year with no day ("03/2027", "March 2027"). */
export const MONTH_IN_TEXT = new RegExp(
  `(?<![\\w/])(?:[0-9Oo]{1,2}\\s?[/-]\\s?[0-9Oo]{4}|${MONTH_WORD}[\\s,]*\\d{4})(?![\\w/])`,
  "gi",
);

function monthOfWord(word: string): number | null {
  const stem = word.toLowerCase().replace(/\.$/, "").slice(0, 3);
  const index = MONTH_NAMES.findIndex((name) => name.startsWith(stem));
  return index < 0 ? null : index + 1;
}

function isRealDate(year: number, month: number, day: number): boolean {
  if (month < 1 || month > 12 || day < 1) return false;
  return day <= daysInMonth(year, month);
}

function toIso(year: number, month: number, day: number): string | null {
  if (!isRealDate(year, month, day)) return null;
  return `${String(year).padStart(4, "0")}-${String(month).padStart(2, "0")}-${String(day).padStart(2, "0")}`;
}

function spelledDate(text: string): string | null {
  const dmy = DAY_MONTH_YEAR.exec(text);
  if (dmy) {
    const month = monthOfWord(dmy[2] ?? "");
    return month ? toIso(Number(dmy[3]), month, Number(dmy[1])) : null;
  }
  const mdy = MONTH_DAY_YEAR.exec(text);
  if (mdy) {
    const month = monthOfWord(mdy[1] ?? "");
    return month ? toIso(Number(mdy[3]), month, Number(mdy[2])) : null;
  }
  return null;
}

/**
 * Reads MM/DD/YYYY, M/D/YY, YYYY-MM-DD, "15 Mar 2027" or "March 15, 2027" (OCR's O read as 0, stray spaces
 * dropped) into ISO; null if not a real date. A month and year alone is not a date: see parseDocumentMonth.
 */
export function parseDocumentDate(raw: string): string | null {
  const trimmed = raw.trim();
  if (/[A-Za-z]{3}/.test(trimmed)) return spelledDate(trimmed.replace(/\s+/g, " "));
  const text = trimmed.replace(/[Oo]/g, "0").replace(/\s+/g, "");
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

/** Reads a month and year printed without a day ("03/2027", "3-2027", "March 2027"); null otherwise. */
export function parseDocumentMonth(raw: string): { year: number; month: number } | null {
  const text = raw.trim().replace(/\s+/g, " ");
  const numeric = NUMERIC_MONTH_YEAR.exec(text.replace(/[Oo]/g, "0"));
  if (numeric) {
    const month = Number(numeric[1]);
    return month >= 1 && month <= 12 ? { year: Number(numeric[2]), month } : null;
  }
  const word = WORD_MONTH_YEAR.exec(text);
  const month = word ? monthOfWord(word[1] ?? "") : null;
  return word && month ? { year: Number(word[2]), month } : null;
}

/**
 * An end date as printed: a full date, or a month and year alone, which is read as valid through the last day of
 * that month (the shared validity rule, so a month-only card and a day card lapse the same way).
 */
export function parseDocumentEndDate(raw: string): string | null {
  const full = parseDocumentDate(raw);
  if (full) return full;
  const month = parseDocumentMonth(raw);
  return month ? monthOnlyValidThrough(month.year, month.month) : null;
}

const SHORT_MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];
const LONG_MONTHS = MONTH_NAMES.map((name) => name[0]!.toUpperCase() + name.slice(1));

/** Prints an ISO date the way a document would. */
export function formatDocumentDate(isoDate: string, format: DocumentDateFormat): string {
  const match = ISO_PATTERN.exec(isoDate);
  if (!match) throw new RangeError(`Not an ISO date: ${isoDate}`);
  const [year, month, day] = [match[1] ?? "", Number(match[2]), Number(match[3])];
  if (format === "YYYY-MM-DD")
    return `${year}-${String(month).padStart(2, "0")}-${String(day).padStart(2, "0")}`;
  if (format === "MM/DD/YYYY")
    return `${String(month).padStart(2, "0")}/${String(day).padStart(2, "0")}/${year}`;
  if (format === "D Mon YYYY") return `${day} ${SHORT_MONTHS[month - 1]} ${year}`;
  if (format === "Month D, YYYY") return `${LONG_MONTHS[month - 1]} ${day}, ${year}`;
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
