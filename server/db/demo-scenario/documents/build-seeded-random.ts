/** A small seeded generator (mulberry32) so generated documents are random-looking but repeatable. */
export function buildSeededRandom(seed: number) {
  let state = seed >>> 0;
  const next = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const int = (min: number, max: number): number => min + Math.floor(next() * (max - min + 1));
  const pick = <T>(items: readonly T[]): T => items[int(0, items.length - 1)] as T;
  const bool = (): boolean => next() < 0.5;
  return { next, int, pick, bool };
}
export type SeededRandom = ReturnType<typeof buildSeededRandom>;
