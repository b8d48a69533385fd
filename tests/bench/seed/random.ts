/** Deterministic helpers for the bench's invented large shop: the same data on every run and machine. */

export const MIN = 60_000;
export const HOUR = 60 * MIN;
export const DAY = 24 * HOUR;

export type Rand = ReturnType<typeof makeRand>;

/** A seeded generator (mulberry32, a common small PRNG) with the picks the seed needs. */
export function makeRand(seed: number) {
  let s = seed >>> 0;
  const next = () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 2 ** 32;
  };
  return {
    next,
    int: (min: number, max: number) => min + Math.floor(next() * (max - min + 1)),
    pick: <T>(xs: readonly T[]): T => xs[Math.floor(next() * xs.length)]!,
    /** Picks a key with probability proportional to its weight. */
    weighted: <K extends string>(weights: Record<K, number>): K => {
      const entries = Object.entries(weights) as [K, number][];
      let r = next() * entries.reduce((sum, [, w]) => sum + w, 0);
      for (const [key, w] of entries) if ((r -= w) < 0) return key;
      return entries[entries.length - 1]![0];
    },
    chance: (p: number) => next() < p,
  };
}

export const dateOnly = (ms: number) => new Date(ms).toISOString().slice(0, 10);
