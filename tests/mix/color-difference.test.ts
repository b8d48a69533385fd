import { differenceCiede2000, differenceEuclidean } from "culori";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { deltaE2000, deltaE76, type Lab } from "../../shared/mix/index";
import { catchMixError } from "./helpers";

/*
 * Sharma, G., Wu, W., Dalal, E. N. (2005), "The CIEDE2000 color-difference formula: Implementation notes,
 * supplementary test data, and mathematical observations", Color Res. Appl. 30(1):21–30,
 * doi:10.1002/col.20070, Table 1 (data file ciede2000testdata.txt): [L1, a1, b1, L2, a2, b2, ΔE00].
 */
const SHARMA_TABLE_1: readonly (readonly number[])[] = [
  [50.0, 2.6772, -79.7751, 50.0, 0.0, -82.7485, 2.0425], // pair 1
  [50.0, 3.1571, -77.2803, 50.0, 0.0, -82.7485, 2.8615], // pair 2
  [50.0, 2.8361, -74.02, 50.0, 0.0, -82.7485, 3.4412], // pair 3
  [50.0, -1.3802, -84.2814, 50.0, 0.0, -82.7485, 1.0], // pair 4
  [50.0, -1.1848, -84.8006, 50.0, 0.0, -82.7485, 1.0], // pair 5
  [50.0, -0.9009, -85.5211, 50.0, 0.0, -82.7485, 1.0], // pair 6
  [50.0, 0.0, 0.0, 50.0, -1.0, 2.0, 2.3669], // pair 7
  [50.0, -1.0, 2.0, 50.0, 0.0, 0.0, 2.3669], // pair 8 (symmetry)
  [50.0, 2.49, -0.001, 50.0, -2.49, 0.0009, 7.1792], // pair 9
  [50.0, 2.49, -0.001, 50.0, -2.49, 0.001, 7.1792], // pair 10
  [50.0, 2.49, -0.001, 50.0, -2.49, 0.0011, 7.2195], // pair 11 (hue wrap)
  [50.0, 2.49, -0.001, 50.0, -2.49, 0.0012, 7.2195], // pair 12
  [50.0, -0.001, 2.49, 50.0, 0.0009, -2.49, 4.8045], // pair 13
  [50.0, -0.001, 2.49, 50.0, 0.001, -2.49, 4.8045], // pair 14
  [50.0, -0.001, 2.49, 50.0, 0.0011, -2.49, 4.7461], // pair 15
  [50.0, 2.5, 0.0, 50.0, 0.0, -2.5, 4.3065], // pair 16
  [50.0, 2.5, 0.0, 73.0, 25.0, -18.0, 27.1492], // pair 17
  [50.0, 2.5, 0.0, 61.0, -5.0, 29.0, 22.8977], // pair 18
  [50.0, 2.5, 0.0, 56.0, -27.0, -3.0, 31.903], // pair 19 (R_T region)
  [50.0, 2.5, 0.0, 58.0, 24.0, 15.0, 19.4535], // pair 20
  [50.0, 2.5, 0.0, 50.0, 3.1736, 0.5854, 1.0], // pair 21
  [50.0, 2.5, 0.0, 50.0, 3.2972, 0.0, 1.0], // pair 22
  [50.0, 2.5, 0.0, 50.0, 1.8634, 0.5757, 1.0], // pair 23
  [50.0, 2.5, 0.0, 50.0, 3.2592, 0.335, 1.0], // pair 24
  [60.2574, -34.0099, 36.2677, 60.4626, -34.1751, 39.4387, 1.2644], // pair 25
  [63.0109, -31.0961, -5.8663, 62.8187, -29.7946, -4.0864, 1.263], // pair 26
  [61.2901, 3.7196, -5.3901, 61.4292, 2.248, -4.962, 1.8731], // pair 27
  [35.0831, -44.1164, 3.7933, 35.0232, -40.0716, 1.5901, 1.8645], // pair 28
  [22.7233, 20.0904, -46.694, 23.0331, 14.973, -42.5619, 2.0373], // pair 29
  [36.4612, 47.858, 18.3852, 36.2715, 50.5065, 21.2231, 1.4146], // pair 30
  [90.8027, -2.0831, 1.441, 91.1528, -1.6435, 0.0447, 1.4441], // pair 31
  [90.9257, -0.5406, -0.9208, 88.6381, -0.8985, -0.7239, 1.5381], // pair 32
  [6.7747, -0.2908, -2.4247, 5.8714, -0.0985, -2.2286, 0.6377], // pair 33
  [2.0776, 0.0795, -1.135, 0.9033, -0.0636, -0.5514, 0.9082], // pair 34
];

const lab = (L: number, a: number, b: number): Lab => ({ L, a, b });

describe("CIEDE2000 against Sharma, Wu & Dalal (2005) Table 1", () => {
  it("has all 34 pairs", () => {
    expect(SHARMA_TABLE_1).toHaveLength(34);
  });

  it.each(SHARMA_TABLE_1.map((row, i) => [i + 1, row] as const))("pair %i matches to 1e-4", (_pair, row) => {
    const [L1, a1, b1, L2, a2, b2, expected] = row as number[];
    expect(Math.abs(deltaE2000(lab(L1!, a1!, b1!), lab(L2!, a2!, b2!)) - expected!)).toBeLessThanOrEqual(5e-5);
  });
});

describe("CIE76", () => {
  it("pair 1 of Sharma Table 1 → 4.0011; pair 17 → 36.8680", () => {
    // 4.0011: cie.js README output (npmjs.com/package/cie.js), also culori and delta-e (4.001063);
    // 36.8680: computed from √(ΔL² + Δa² + Δb²) (references.md §5a).
    expect(deltaE76(lab(50, 2.6772, -79.7751), lab(50, 0, -82.7485))).toBeCloseTo(4.0011, 4);
    expect(deltaE76(lab(50, 2.5, 0), lab(73, 25, -18))).toBeCloseTo(36.868, 4);
  });
});

describe("second reference: culori 4.0.2 on random colours", () => {
  // culori's differenceCiede2000 follows Sharma's Matlab code; Lab given as mode "lab65" is used as is
  // (references.md §5b: 34/34 Table 1 pairs match).
  const ciede = differenceCiede2000();
  const euclid = differenceEuclidean("lab65");
  const labArb = fc.record({
    L: fc.double({ min: 0, max: 100, noNaN: true }),
    a: fc.double({ min: -128, max: 128, noNaN: true }),
    b: fc.double({ min: -128, max: 128, noNaN: true }),
  });
  const toCulori = (c: Lab) => ({ mode: "lab65" as const, l: c.L, a: c.a, b: c.b });

  it("ΔE00 agrees with culori to 1e-9", () => {
    fc.assert(
      fc.property(labArb, labArb, (x, y) => {
        expect(Math.abs(deltaE2000(x, y) - ciede(toCulori(x), toCulori(y)))).toBeLessThan(1e-9);
      }),
      { numRuns: 1000 },
    );
  });

  it("ΔE76 agrees with culori's Euclidean difference in lab65 to 1e-9", () => {
    fc.assert(
      fc.property(labArb, labArb, (x, y) => {
        expect(Math.abs(deltaE76(x, y) - euclid(toCulori(x), toCulori(y)))).toBeLessThan(1e-9);
      }),
    );
  });

  it("is symmetric, zero for the same colour, finite and non-negative", () => {
    fc.assert(
      fc.property(labArb, labArb, (x, y) => {
        const d = deltaE2000(x, y);
        expect(Number.isFinite(d) && d >= 0).toBe(true);
        expect(Math.abs(d - deltaE2000(y, x))).toBeLessThan(1e-9);
        expect(deltaE2000(x, x)).toBe(0);
      }),
    );
  });
});

describe("invalid input", () => {
  it("rejects non-finite values and bad weights, naming the field", () => {
    expect(catchMixError(() => deltaE2000(lab(50, Number.NaN, 0), lab(50, 0, 0))).field).toBe("lab1.a");
    expect(catchMixError(() => deltaE76(lab(50, 0, 0), lab(Number.POSITIVE_INFINITY, 0, 0))).field).toBe("lab2.L");
    expect(catchMixError(() => deltaE2000(lab(50, 0, 0), lab(50, 1, 0), { kL: 0 })).field).toBe("kL");
  });
});
