/** Whole-number ticks from 0 in steps of 1, 2 or 5 times a power of ten, about four steps to the top. */
export function countTicks(max: number): number[] {
  if (max <= 0) return [0, 1];
  const rough = Math.max(1, max / 4);
  const power = 10 ** Math.floor(Math.log10(rough));
  const step = [1, 2, 5, 10].map((m) => m * power).find((s) => s >= rough) ?? 10 * power;
  const top = Math.ceil(max / step) * step;
  return Array.from({ length: top / step + 1 }, (_, i) => i * step);
}

/**
 * Which category labels fit under bars of `band` pixels: every k-th from the first, and the last always,
 * dropping the one before it when the two would overlap.
 */
export function labelsShown(count: number, band: number, labelWidth: number): number[] {
  if (count === 0) return [];
  const stride = Math.max(1, Math.ceil(labelWidth / band));
  const shown: number[] = [];
  for (let i = 0; i < count; i += stride) shown.push(i);
  const last = count - 1;
  if (shown[shown.length - 1] !== last) {
    if (shown.length > 1 && (last - shown[shown.length - 1]!) * band < labelWidth) shown.pop();
    shown.push(last);
  }
  return shown;
}
