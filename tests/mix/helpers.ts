import fc from "fast-check";
import { expect } from "vitest";
import { MixError, type MixComponent } from "../../shared/mix/index";

/** Asserts |actual − expected| ≤ rel × max(1e-300, |expected|). */
export function expectRel(actual: number, expected: number, rel = 1e-12): void {
  const scale = Math.max(Math.abs(expected), 1e-300);
  expect(Math.abs(actual - expected) / scale, `${actual} vs ${expected}`).toBeLessThanOrEqual(rel);
}

/** Runs `fn`, asserts it throws a MixError, and returns it for further checks. */
export function catchMixError(fn: () => unknown): MixError {
  try {
    fn();
  } catch (error) {
    expect(error).toBeInstanceOf(MixError);
    return error as MixError;
  }
  throw new Error("expected a MixError, but nothing was thrown");
}

/**
 * Random valid mixes: 1–5 parts components, then 0–4 percent components, each taking a percent of a
 * random non-empty set of components defined before it (so there is never a cycle); the list is then
 * shuffled, because the order of components must not matter to the computation.
 */
export const mixArb: fc.Arbitrary<MixComponent[]> = fc
  .tuple(
    fc.array(fc.double({ min: 0.01, max: 1000, noNaN: true }), { minLength: 1, maxLength: 5 }),
    fc.array(
      fc.record({
        percent: fc.double({ min: 0.1, max: 200, noNaN: true }),
        pick: fc.array(fc.boolean(), { minLength: 9, maxLength: 9 }),
      }),
      { maxLength: 4 },
    ),
    fc.array(fc.option(fc.double({ min: 0.5, max: 2.5, noNaN: true }), { nil: undefined }), {
      minLength: 9,
      maxLength: 9,
    }),
    fc.integer({ min: 0, max: 1_000_000 }),
  )
  .map(([parts, percents, densities, seed]) => {
    const list: MixComponent[] = parts.map((p, i) => ({ name: `part${i}`, parts: p }));
    percents.forEach(({ percent, pick }, j) => {
      const earlier = list.map((c) => c.name);
      let of = earlier.filter((_, k) => pick[k]);
      if (of.length === 0) of = [earlier[j % earlier.length]!];
      list.push({ name: `pct${j}`, percent, percentOf: of.length === 1 ? of[0]! : of });
    });
    list.forEach((c, i) => {
      const d = densities[i];
      if (d !== undefined) c.densityGPerMl = d;
    });
    // Deterministic shuffle from the seed (fast-check still shrinks the seed).
    let s = seed;
    for (let i = list.length - 1; i > 0; i--) {
      s = (s * 1103515245 + 12345) % 2147483648;
      const k = s % (i + 1);
      [list[i], list[k]] = [list[k]!, list[i]!];
    }
    return list;
  });
