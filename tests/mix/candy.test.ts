import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  equivalentCoats,
  equivalentCoatsByFraction,
  tonerFraction,
  tonerFractionOfMix,
  type MixComponent,
} from "../../shared/mix/index";
import { catchMixError, expectRel } from "./helpers";

// Candy let down 6:1 to 8:1 clear to toner (common practice).
const SIX_TO_ONE = { clear: 6, toner: 1 };
const EIGHT_TO_ONE = { clear: 8, toner: 1 };

describe("toner fraction", () => {
  it("6:1 → 1/7 and 8:1 → 1/9 of the let-down", () => {
    // Computed (references.md §6): f = toner / (clear + toner).
    expectRel(tonerFraction(SIX_TO_ONE), 1 / 7);
    expectRel(tonerFraction(EIGHT_TO_ONE), 1 / 9);
  });

  it("of a complete recipe: toner in clear, clear activated 4:1:1 → 0.1 at 6:1, 1/13 at 8:1", () => {
    // Computed (references.md §6 "full-recipe effect"): f = 1/(6·1.5 + 1) vs 1/(8·1.5 + 1), factor 1.30 (not 9/7).
    const recipe = (clear: number): MixComponent[] => [
      { name: "clear", parts: clear },
      { name: "toner", parts: 1 },
      { name: "hardener", percent: 25, percentOf: "clear" },
      { name: "reducer", percent: 25, percentOf: "clear" },
    ];
    const f6 = tonerFractionOfMix(recipe(6), "toner");
    const f8 = tonerFractionOfMix(recipe(8), ["toner"]);
    expectRel(f6, 0.1);
    expectRel(f8, 1 / 13);
    expectRel(equivalentCoatsByFraction(4, f6, f8), 5.2);
  });
});

describe("equivalent coats (Beer–Lambert: depth ∝ toner fraction × coats)", () => {
  it("4 coats at 6:1 → 5.142857 coats at 8:1, not 5.333", () => {
    // Beer–Lambert law A = ε·c·ℓ (Britannica "Beer's law"); n₂ = n₁·f₁/f₂ = 4 × 9/7 (references.md §6).
    const n = equivalentCoats(4, SIX_TO_ONE, EIGHT_TO_ONE);
    expect(n).toBeCloseTo(5.142857, 6);
    // The common mistake, 4 × 8/6 = 5.333, ignores the toner's own volume.
    expect(Math.abs(n - 16 / 3)).toBeGreaterThan(0.15);
  });

  it("4 candy coats at 6:1 need about 5.1 at 8:1 (common practice)", () => {
    expect(Number(equivalentCoats(4, SIX_TO_ONE, EIGHT_TO_ONE).toFixed(1))).toBe(5.1);
  });

  it("3 / 5 / 6 coats at 6:1 → 3.857 / 6.429 / 7.714 at 8:1", () => {
    // Computed (references.md §6).
    expect(equivalentCoats(3, SIX_TO_ONE, EIGHT_TO_ONE)).toBeCloseTo(3.857, 3);
    expect(equivalentCoats(5, SIX_TO_ONE, EIGHT_TO_ONE)).toBeCloseTo(6.429, 3);
    expect(equivalentCoats(6, SIX_TO_ONE, EIGHT_TO_ONE)).toBeCloseTo(7.714, 3);
  });

  it("rounding to 5 whole coats at 8:1 gives about 2.8 % less absorbance than 4 at 6:1", () => {
    // Computed (references.md §6): f·n = 0.5556 vs 0.5714.
    const shortfall = 1 - 5 / equivalentCoats(4, SIX_TO_ONE, EIGHT_TO_ONE);
    expect(shortfall * 100).toBeCloseTo(2.8, 1);
  });

  it("properties: going there and back returns the coats; same ratio keeps them; more toner needs fewer", () => {
    const letDown = fc.record({
      clear: fc.double({ min: 0.5, max: 20, noNaN: true }),
      toner: fc.double({ min: 0.1, max: 5, noNaN: true }),
    });
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 12, noNaN: true }), letDown, letDown, (n, a, b) => {
        expectRel(equivalentCoats(equivalentCoats(n, a, b), b, a), n, 1e-12);
        expectRel(equivalentCoats(n, a, a), n, 1e-15);
        const m = equivalentCoats(n, a, b);
        expect(Number.isFinite(m) && m > 0).toBe(true);
        // Fractions a rounding step apart can give the same coats back, so only a real difference counts.
        if (tonerFraction(b) > tonerFraction(a) * (1 + 1e-9)) expect(m).toBeLessThan(n);
      }),
      // A counterexample CI once found: fractions equal but for the last bits.
      { examples: [[0.5000000000000007, { clear: 0.5, toner: 4.9999999999999885 }, { clear: 0.5, toner: 4.999999999999996 }]] },
    );
  });
});

describe("invalid input", () => {
  it("rejects zero or negative coats and ratios, and unknown toner names", () => {
    expect(catchMixError(() => equivalentCoats(0, SIX_TO_ONE, EIGHT_TO_ONE)).field).toBe("coats");
    expect(catchMixError(() => equivalentCoats(4, { clear: 6, toner: 0 }, EIGHT_TO_ONE)).field).toBe("from.toner");
    expect(catchMixError(() => equivalentCoats(4, SIX_TO_ONE, { clear: -8, toner: 1 })).field).toBe("to.clear");
    expect(catchMixError(() => equivalentCoatsByFraction(4, 1.5, 0.1)).field).toBe("toFraction");
    expect(
      catchMixError(() => tonerFractionOfMix([{ name: "clear", parts: 6 }], "tonr")).message,
    ).toBe('Component "tonr": not in this mix');
  });
});
