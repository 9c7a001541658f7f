import { parseIsoDate } from "../standing/iso-date.ts";

/**
 * The years a date printed on a certificate or card may fall in. Anything outside is a typo or a misread (a year
 * 0099, 1900, 2999), and accepting it would store a lapse instant nobody meant (common practice).
 */
export const DOCUMENT_YEAR_MIN = 1950;
export const DOCUMENT_YEAR_MAX = 2100;

export interface DateProblem {
  /** The field's name inside the fields object (`expirationDate`). */
  path: string;
  message: string;
}

const START_END_PAIRS = [
  ["effectiveDate", "expirationDate", "The expiration date is before the effective date"],
  ["issueDate", "expiryDate", "The expiry date is before the issue date"],
] as const;

function yearOf(isoDate: string): number | null {
  try {
    return parseIsoDate(isoDate).year;
  } catch {
    return null;
  }
}

/**
 * What makes a document's dates impossible: a year outside the plausible window, or an end before its start. An end on
 * the start date itself is left to the reviewer (reviewer-checks.ts warns), since the document may say exactly that.
 */
export function documentDateProblems(fields: Record<string, unknown>): DateProblem[] {
  const problems: DateProblem[] = [];
  for (const [name, value] of Object.entries(fields)) {
    if (!/Date$/.test(name) || typeof value !== "string") continue;
    const year = yearOf(value);
    if (year !== null && (year < DOCUMENT_YEAR_MIN || year > DOCUMENT_YEAR_MAX)) {
      problems.push({
        path: name,
        message: `Use a year from ${DOCUMENT_YEAR_MIN} to ${DOCUMENT_YEAR_MAX}`,
      });
    }
  }
  for (const [start, end, message] of START_END_PAIRS) {
    const from = fields[start];
    const to = fields[end];
    if (typeof from === "string" && typeof to === "string" && to < from)
      problems.push({ path: end, message });
  }
  return problems;
}
