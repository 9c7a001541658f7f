const dollars = new Intl.NumberFormat("en-US", { style: "currency", currency: "USD" });
const wholeDollars = new Intl.NumberFormat("en-US", {
  style: "currency",
  currency: "USD",
  maximumFractionDigits: 0,
});

/** Integer cents as dollars, e.g. 8550 → "$85.50". Money travels in cents so no float rounding creeps in. */
export const formatCents = (cents: number): string => dollars.format(cents / 100);

/** Whole dollars as printed on a certificate, e.g. 1000000 → "$1,000,000". */
export const formatDollars = (amount: number): string => wholeDollars.format(amount);

/** Cents as the text of a dollars input ("85.50"). */
export const centsToInput = (cents: number | null | undefined): string =>
  cents === null || cents === undefined ? "" : (cents / 100).toFixed(2);

/** A dollars input ("85.5", "$1,200") as integer cents; NaN when it is not a number, so the schema reports it. */
export function inputToCents(text: string): number {
  const cleaned = text.replace(/[$,\s]/g, "");
  if (cleaned === "") return Number.NaN;
  return /^\d+(\.\d{0,2})?$/.test(cleaned) ? Math.round(Number(cleaned) * 100) : Number.NaN;
}
