import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  mixForTotal,
  mixFromComponent,
  resolveShares,
  weighingPlan,
  type MixComponent,
  type MixLine,
  type PercentComponent,
} from "../../shared/mix/index";
import { expectRel, mixArb } from "./helpers";

const volumes = (lines: MixLine[]): number[] => lines.map((l) => l.volume);

describe("parts ratios (references.md §7, computed from the parts-by-volume convention)", () => {
  const paint411: MixComponent[] = [
    { name: "paint", parts: 4 },
    { name: "hardener", parts: 1 },
    { name: "reducer", parts: 1 },
  ];

  it("4:1:1 of 600 mL is 400 / 100 / 100 mL", () => {
    const lines = mixForTotal(paint411, 600, "mL");
    expect(lines.map((l) => l.name)).toEqual(["paint", "hardener", "reducer"]);
    expectRel(lines[0]!.volume, 400);
    expectRel(lines[1]!.volume, 100);
    expectRel(lines[2]!.volume, 100);
    expect(lines.every((l) => l.unit === "mL")).toBe(true);
    expectRel(lines[0]!.share, 4 / 6);
  });

  it("4:1:1 of 1 US quart is 630.901964 / 157.725491 / 157.725491 mL", () => {
    // 1 qt = 946.352946 mL (NIST Handbook 44 App. C, gal/4); split 4/6, 1/6, 1/6.
    const lines = mixForTotal(paint411, 1, "quart");
    expectRel(lines[0]!.volume, 4 / 6);
    expect(lines[0]!.volume * 946.352946).toBeCloseTo(630.901964, 6);
    expect(lines[1]!.volume * 946.352946).toBeCloseTo(157.725491, 6);
  });

  it("8:1:1 of 10 fl oz is 8 / 1 / 1 fl oz", () => {
    // Meaning of 8:1:1 (8 paint, 1 hardener, 1 reducer): trade how-to on measuring parts, references.md §7 [V].
    const lines = mixForTotal(
      [
        { name: "paint", parts: 8 },
        { name: "hardener", parts: 1 },
        { name: "reducer", parts: 1 },
      ],
      10,
      "floz",
    );
    volumes(lines).forEach((v, i) => expectRel(v, [8, 1, 1][i]!));
  });

  it("2:1:1 of 12 fl oz is 6 / 3 / 3 fl oz = 177.441 / 88.721 / 88.721 mL", () => {
    const lines = mixForTotal(
      [
        { name: "clear", parts: 2 },
        { name: "hardener", parts: 1 },
        { name: "reducer", parts: 1 },
      ],
      12,
      "floz",
    );
    volumes(lines).forEach((v, i) => expectRel(v, [6, 3, 3][i]!));
    // 1 fl oz = 29.5735295625 mL (NIST Handbook 44 App. C)
    expect(lines[0]!.volume * 29.5735295625).toBeCloseTo(177.441, 3);
    expect(lines[1]!.volume * 29.5735295625).toBeCloseTo(88.721, 3);
  });

  it("2:1 of 300 mL is 200 / 100 mL", () => {
    const lines = mixForTotal(
      [
        { name: "primer", parts: 2 },
        { name: "hardener", parts: 1 },
      ],
      300,
      "mL",
    );
    volumes(lines).forEach((v, i) => expectRel(v, [200, 100][i]!));
  });

  it("parts per hundred 100:25:10 of 270 mL is 200 / 50 / 20 mL", () => {
    // Parts-per-hundred convention (common practice).
    const lines = mixForTotal(
      [
        { name: "base", parts: 100 },
        { name: "hardener", parts: 25 },
        { name: "thinner", parts: 10 },
      ],
      270,
      "mL",
    );
    volumes(lines).forEach((v, i) => expectRel(v, [200, 50, 20][i]!));
  });
});

describe("percent components", () => {
  it("reduce 25 %: 400 mL paint takes 100 mL reducer, 500 mL in all (= 4:1)", () => {
    // "Reduce X %" = X parts reducer per 100 parts paint (common practice; references.md §7).
    const mix: MixComponent[] = [
      { name: "paint", parts: 1 },
      { name: "reducer", percent: 25, percentOf: "paint" },
    ];
    const lines = mixFromComponent(mix, "paint", 400, "mL");
    expect(lines[0]!.volume).toBe(400);
    expectRel(lines[1]!.volume, 100);
    expectRel(lines[1]!.share, 1 / 5); // same as 4:1
  });

  it("a 10 % reduction: 100 mL base takes 10 mL reducer (110 mL)", () => {
    // Reduce about 10 % (common practice).
    const mix: MixComponent[] = [
      { name: "base", parts: 1 },
      { name: "reducer", percent: 10, percentOf: "base" },
    ];
    const lines = mixFromComponent(mix, "base", 100, "mL");
    expectRel(lines[1]!.volume, 10);
    expectRel(lines[0]!.share, 100 / 110);
    const fromTotal = mixForTotal(mix, 110, "mL");
    expectRel(fromTotal[0]!.volume, 100);
    expectRel(fromTotal[1]!.volume, 10);
  });

  it("metallic ground with intercoat additive at 25 % of the colour, then reduced 10 %", () => {
    // About 25 % intercoat additive in a metallic ground; reduce about 10 % (both common practice).
    const mix: MixComponent[] = [
      { name: "colour", parts: 1 },
      { name: "intercoat", percent: 25, percentOf: "colour" },
      { name: "reducer", percent: 10, percentOf: ["colour", "intercoat"] },
    ];
    const lines = mixFromComponent(mix, "colour", 400, "mL");
    expectRel(lines[1]!.volume, 100); // 25 % of 400
    expectRel(lines[2]!.volume, 50); // 10 % of (400 + 100)
    expectRel(
      lines.reduce((a, l) => a + l.volume, 0),
      550,
    );
  });

  it("candy let down 1 toner in 6 intercoat clear, reduced 5 % of that mixture", () => {
    // Candy at 6:1 clear to toner; reduce a candy mix 5 to 10 % at most (both common practice).
    const mix: MixComponent[] = [
      { name: "clear", parts: 6 },
      { name: "toner", parts: 1 },
      { name: "reducer", percent: 5, percentOf: ["clear", "toner"] },
    ];
    const lines = mixForTotal(mix, 735, "mL"); // 7 parts × 1.05 = 7.35 parts
    volumes(lines).forEach((v, i) => expectRel(v, [600, 100, 35][i]!));
    // At the 10 % ceiling the reducer is 10/110 of the batch.
    const at10 = resolveShares([mix[0]!, mix[1]!, { ...(mix[2] as PercentComponent), percent: 10 }]);
    expectRel(at10[2]!.share, 10 / 110);
  });

  it("order of the list does not matter and a percent may refer to a later component", () => {
    const a = mixForTotal(
      [
        { name: "reducer", percent: 10, percentOf: "base" },
        { name: "base", parts: 1 },
      ],
      110,
      "mL",
    );
    expectRel(a[0]!.volume, 10);
    expectRel(a[1]!.volume, 100);
  });
});

describe("weights from densities", () => {
  it("2:1 by volume at 1.02 and 1.05 g/mL: 200 g base takes 102.94 g hardener", () => {
    // mass = volume × density; weight ratio = 2 × 1.02 / 1.05 = 1.942857 (references.md §7, computed).
    const mix: MixComponent[] = [
      { name: "base", parts: 2, densityGPerMl: 1.02 },
      { name: "hardener", parts: 1, densityGPerMl: 1.05 },
    ];
    const lines = mixFromComponent(mix, "base", 200 / 1.02, "mL");
    expectRel(lines[0]!.grams!, 200);
    expect(lines[1]!.grams!).toBeCloseTo(102.94, 2);
    expect(lines[0]!.grams! / lines[1]!.grams!).toBeCloseTo(1.942857, 6);
  });

  it("4:1:1 of 300 mL at 1.00 / 1.10 / 0.87 g/mL weighs 200.00 → 255.00 → 298.50 g cumulative", () => {
    // references.md §7 cumulative scale targets (computed): 200 × 1.00, +50 × 1.10, +50 × 0.87.
    const lines = mixForTotal(
      [
        { name: "clear", parts: 4, densityGPerMl: 1.0 },
        { name: "hardener", parts: 1, densityGPerMl: 1.1 },
        { name: "reducer", parts: 1, densityGPerMl: 0.87 },
      ],
      300,
      "mL",
    );
    const { steps } = weighingPlan(lines);
    expect(steps.map((t) => t.scaleReads)).toEqual([200, 255, 298.5]);
    expect(steps[1]!.exact).toBeCloseTo(55, 10);
  });

  it("grams use the millilitres of the line, whatever its unit", () => {
    // 1 US gal = 3785.411784 mL (NIST Handbook 44 App. C); density 1.20 kg/L → 4542.494 g = 10.014485 lb.
    const lines = mixForTotal([{ name: "clear", parts: 1, densityGPerMl: 1.2 }], 1, "gallon");
    expect(lines[0]!.grams!).toBeCloseTo(4542.494, 3);
    expect(lines[0]!.grams! / 453.59237).toBeCloseTo(10.014485, 6); // 1 lb = 453.59237 g exactly
  });

  it("lines without a density have no grams", () => {
    const lines = mixForTotal(
      [
        { name: "clear", parts: 1, densityGPerMl: 1 },
        { name: "toner", parts: 1 },
      ],
      2,
      "mL",
    );
    expect(lines[0]!.grams).toBe(1);
    expect("grams" in lines[1]!).toBe(false);
  });
});

describe("properties (fast-check)", () => {
  const total = fc.double({ min: 0.001, max: 1e6, noNaN: true });

  it("shares sum to 1 and follow each component's definition", () => {
    fc.assert(
      fc.property(mixArb, (mix) => {
        const shares = resolveShares(mix);
        expectRel(
          shares.reduce((a, s) => a + s.share, 0),
          1,
          1e-12,
        );
        const byName = new Map(shares.map((s) => [s.name, s.share]));
        for (const c of mix) {
          if ("percent" in c) {
            const of = typeof c.percentOf === "string" ? [c.percentOf] : c.percentOf;
            const base = of.reduce((a, n) => a + byName.get(n)!, 0);
            expectRel(byName.get(c.name)!, (c.percent / 100) * base, 1e-12);
          }
        }
      }),
    );
  });

  it("scaling is linear", () => {
    fc.assert(
      fc.property(mixArb, total, fc.double({ min: 0.01, max: 100, noNaN: true }), (mix, t, k) => {
        const a = mixForTotal(mix, t, "mL");
        const b = mixForTotal(mix, t * k, "mL");
        a.forEach((line, i) => expectRel(b[i]!.volume, line.volume * k, 1e-12));
      }),
    );
  });

  it("mixFromComponent and mixForTotal agree", () => {
    fc.assert(
      fc.property(mixArb, total, fc.nat(), (mix, t, pick) => {
        const lines = mixForTotal(mix, t, "L");
        const known = lines[pick % lines.length]!;
        const again = mixFromComponent(mix, known.name, known.volume, "L");
        again.forEach((line, i) => {
          expectRel(line.volume, lines[i]!.volume, 1e-12);
          expect(line.share).toBe(lines[i]!.share);
        });
      }),
    );
  });

  it("every result is finite and non-negative, in the given order", () => {
    fc.assert(
      fc.property(mixArb, total, (mix, t) => {
        const lines = mixForTotal(mix, t, "floz");
        expect(lines.map((l) => l.name)).toEqual(mix.map((c) => c.name));
        for (const [i, line] of lines.entries()) {
          for (const v of [line.volume, line.share, line.grams ?? 0]) {
            expect(Number.isFinite(v) && v >= 0).toBe(true);
          }
          expect(line.grams === undefined).toBe(mix[i]!.densityGPerMl === undefined);
        }
        expectRel(
          lines.reduce((a, l) => a + l.volume, 0),
          t,
          1e-12,
        );
      }),
    );
  });
});
