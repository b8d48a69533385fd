import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { mixForTotal, roundForMeasuring, type MeasuringUnit, type MixComponent } from "../../shared/mix/index";
import { catchMixError, expectRel, mixArb } from "./helpers";

const paint411: MixComponent[] = [
  { name: "paint", parts: 4 },
  { name: "hardener", parts: 1 },
  { name: "reducer", parts: 1 },
];

/** Share error in % of each line, recomputed from the rounded amounts alone. */
function shareErrors(exact: number[], rounded: number[]): number[] {
  const e = exact.reduce((a, b) => a + b, 0);
  const r = rounded.reduce((a, b) => a + b, 0);
  return exact.map((x, i) => (Math.abs(rounded[i]! / r - x / e) / (x / e)) * 100);
}

/**
 * Independent oracle: tries every combination of rounding each amount down or up to a whole step
 * (never to zero) and returns the smallest possible worst share error in %.
 */
function bruteForceWorst(exact: number[], step: number): number {
  const options = exact.map((x) => {
    let q = x / step;
    if (Math.abs(q - Math.round(q)) <= 1e-9 * Math.max(1, q)) q = Math.round(q);
    return [...new Set([Math.floor(q), Math.ceil(q)].map((u) => Math.max(1, u)))];
  });
  let best = Number.POSITIVE_INFINITY;
  const walk = (i: number, picked: number[]): void => {
    if (i === options.length) {
      best = Math.min(best, Math.max(...shareErrors(exact, picked)));
      return;
    }
    for (const u of options[i]!) walk(i + 1, [...picked, u]);
  };
  walk(0, []);
  return best;
}

describe("rounding a mix to what a cup or scale shows", () => {
  it("4:1:1 of 100 mL on a 5 mL cup → 65 / 15 / 15 mL, ratio off by 1/19 = 5.263 %", () => {
    // Computed by hand for this test by listing the 8 floor/ceil choices (65|70, 15|20, 15|20):
    // 65/15/15 gives shares 13/19, 3/19, 3/19 against 4/6, 1/6, 1/6 → worst |3/19 − 1/6| / (1/6) = 1/19;
    // every other choice is worse (e.g. 70/15/15 → 10 %, 70/20/20 → 9.1 %).
    const r = roundForMeasuring(mixForTotal(paint411, 100, "mL"), 5, "mL");
    expect(r.lines.map((l) => l.rounded)).toEqual([65, 15, 15]);
    expect(r.worstRatioErrorPct).toBeCloseTo(100 / 19, 10);
    expect(["hardener", "reducer"]).toContain(r.worstComponent);
    expect(r.roundedTotal).toBe(95);
    expectRel(r.exactTotal, 100);
    expect(r.raisedFromZero).toEqual([]);
  });

  it("8:1:1 of 10 fl oz on a 1/8 fl oz cup stays exact", () => {
    const r = roundForMeasuring(
      mixForTotal(
        [
          { name: "paint", parts: 8 },
          { name: "hardener", parts: 1 },
          { name: "reducer", parts: 1 },
        ],
        10,
        "floz",
      ),
      0.125,
      "floz",
    );
    expect(r.lines.map((l) => l.rounded)).toEqual([8, 1, 1]);
    expect(r.worstRatioErrorPct).toBeLessThan(1e-9);
  });

  it("converts the lines to the measuring unit: 4:1:1 of 600 mL in fl oz", () => {
    // 400 mL = 13.526 fl oz (1 fl oz = 29.5735295625 mL, NIST Handbook 44 App. C).
    const r = roundForMeasuring(mixForTotal(paint411, 600, "mL"), 0.25, "floz");
    expect(r.lines[0]!.exact).toBeCloseTo(400 / 29.5735295625, 12);
    expect(r.unit).toBe("floz");
    for (const l of r.lines) expect(Math.abs(l.rounded - l.exact)).toBeLessThan(0.25);
  });

  it("weighs on a 0.1 g scale: 4:1:1 of 300 mL at 1.00 / 1.10 / 0.87 g/mL → 200.0 / 55.0 / 43.5 g", () => {
    // references.md §7 weights (computed): 200 × 1.00, 50 × 1.10, 50 × 0.87.
    const lines = mixForTotal(
      [
        { name: "clear", parts: 4, densityGPerMl: 1.0 },
        { name: "hardener", parts: 1, densityGPerMl: 1.1 },
        { name: "reducer", parts: 1, densityGPerMl: 0.87 },
      ],
      300,
      "mL",
    );
    const r = roundForMeasuring(lines, 0.1, "g");
    expect(r.lines.map((l) => l.rounded)).toEqual([200, 55, 43.5]);
    expect(r.roundedTotal).toBe(298.5);
    expect(r.worstRatioErrorPct).toBeLessThan(1e-9);
    // In ounces on a 0.05 oz scale: 1 oz = 28.349523125 g (NIST Handbook 44 App. C).
    const oz = roundForMeasuring(lines, 0.05, "oz");
    expect(oz.lines[0]!.exact).toBeCloseTo(200 / 28.349523125, 12);
  });

  it("never rounds a component to zero, and reports the ones it had to raise", () => {
    const r = roundForMeasuring(
      mixForTotal(
        [
          { name: "base", parts: 100 },
          { name: "flattener", parts: 1 },
        ],
        50,
        "mL",
      ),
      5,
      "mL",
    );
    expect(r.raisedFromZero).toEqual(["flattener"]);
    expect(r.lines[1]!.rounded).toBe(5);
    expect(r.worstComponent).toBe("flattener");
    expect(r.worstRatioErrorPct).toBeGreaterThan(100); // the screen must warn
  });

  describe("properties (fast-check)", () => {
    const step = fc.constantFrom(0.1, 0.5, 1, 2, 5, 10, 25);
    const total = fc.double({ min: 1, max: 5000, noNaN: true });

    it("amounts are whole steps, within one step of exact, never zero", () => {
      fc.assert(
        fc.property(mixArb, total, step, (mix, t, s) => {
          const r = roundForMeasuring(mixForTotal(mix, t, "mL"), s, "mL");
          for (const l of r.lines) {
            const q = l.rounded / s;
            expect(Math.abs(q - Math.round(q))).toBeLessThan(1e-6);
            expect(l.rounded).toBeGreaterThanOrEqual(s - 1e-9);
            expect(Math.abs(l.rounded - l.exact)).toBeLessThan(s + 1e-9);
          }
        }),
      );
    });

    it("never moves a share more than it reports", () => {
      fc.assert(
        fc.property(mixArb, total, step, (mix, t, s) => {
          const r = roundForMeasuring(mixForTotal(mix, t, "mL"), s, "mL");
          const errors = shareErrors(
            r.lines.map((l) => l.exact),
            r.lines.map((l) => l.rounded),
          );
          expect(Number.isFinite(r.worstRatioErrorPct) && r.worstRatioErrorPct >= 0).toBe(true);
          // Relative tolerance: a component raised from zero can carry an error of thousands of percent.
          const tol = (x: number) => 1e-9 * Math.max(1, Math.abs(x));
          errors.forEach((e, i) => {
            expect(e).toBeLessThanOrEqual(r.worstRatioErrorPct + tol(e));
            expect(Math.abs(e - r.lines[i]!.ratioErrorPct)).toBeLessThanOrEqual(tol(e));
          });
          expect(Math.abs(Math.max(...errors) - r.worstRatioErrorPct)).toBeLessThanOrEqual(tol(r.worstRatioErrorPct));
        }),
      );
    });

    it("finds the smallest worst error of all down/up choices", () => {
      fc.assert(
        fc.property(mixArb, total, step, (mix, t, s) => {
          const lines = mixForTotal(mix, t, "mL");
          const r = roundForMeasuring(lines, s, "mL");
          const best = bruteForceWorst(
            lines.map((l) => l.volume),
            s,
          );
          expect(Math.abs(r.worstRatioErrorPct - best)).toBeLessThanOrEqual(1e-9 * Math.max(1, best));
        }),
        { numRuns: 300 },
      );
    });
  });

  it("rejects a bad step, an unknown unit, nothing to round and weighing without density", () => {
    const lines = mixForTotal(paint411, 100, "mL");
    expect(catchMixError(() => roundForMeasuring(lines, 0, "mL")).field).toBe("step");
    expect(catchMixError(() => roundForMeasuring(lines, Number.NaN, "mL")).field).toBe("step");
    expect(catchMixError(() => roundForMeasuring(lines, 5, "cc" as MeasuringUnit)).field).toBe("unit");
    expect(catchMixError(() => roundForMeasuring([], 5, "mL")).field).toBe("lines");
    const e = catchMixError(() => roundForMeasuring(lines, 0.1, "g"));
    expect(e.message).toBe('Component "paint": has no density, so it cannot be weighed');
  });
});
