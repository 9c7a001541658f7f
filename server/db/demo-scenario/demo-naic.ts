/**
 * NAIC company codes for invented insurers. Real codes are five digits; as far as we know (from memory, not checked
 * against the NAIC's list) companies are assigned codes of 10000 and up, so a code beginning "000" should belong to
 * no insurer. We cannot be certain of that, so every demo code is also recognizable by its shape: "000" and two digits.
 */
export const DEMO_NAIC_PREFIX = "000";

export function demoNaic(n: number): string {
  if (!Number.isInteger(n) || n < 0 || n > 99) throw new RangeError("A demo NAIC code takes 0 to 99");
  return `${DEMO_NAIC_PREFIX}${String(n).padStart(2, "0")}`;
}

export const isDemoNaic = (code: string): boolean => /^000\d{2}$/.test(code);
