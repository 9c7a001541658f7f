/**
 * The middle value of a list (the mean of the two middle ones for an even count), or null for an empty list. Used
 * where one slow job should not define a company, which a mean would let it do.
 */
export function median(values: readonly number[]): number | null {
  if (values.length === 0) return null;
  const sorted = [...values].sort((x, y) => x - y);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[middle]! : (sorted[middle - 1]! + sorted[middle]!) / 2;
}
