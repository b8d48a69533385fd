import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  computeQuoteTotals,
  describeFinish,
  divRoundHalfUp,
  formatCents,
  parseMoneyToCents,
  percentOfCents,
  type QuoteLine,
} from "../../shared/quote/index";

const mat = (costCents: number, markupPercent = 0): QuoteLine => ({ kind: "materials", description: "Material", costCents, markupPercent });
const labour = (hours: number, rateCents: number): QuoteLine => ({ kind: "labour", description: "Labour", hours, rateCents });

describe("rounding: half away from zero on exact integers", () => {
  it("rounds halves up and is exact where floats are not", () => {
    // 0.125 / 2.345 / 1.005 to cents, half-up: 0.13 / 2.35 / 1.01 (references.md §10, Python decimal ROUND_HALF_UP).
    expect(divRoundHalfUp(125, 10)).toBe(13);
    expect(divRoundHalfUp(2345, 10)).toBe(235);
    expect(divRoundHalfUp(1005, 10)).toBe(101);
    // Negative halves go away from zero (a discount of -0.5 cent is -1 cent).
    expect(divRoundHalfUp(-5, 10)).toBe(-1);
    expect(divRoundHalfUp(-4, 10)).toBe(0);
  });

  it("parses typed amounts on their decimal digits, not through binary floats", () => {
    // (1.005).toFixed(2) === "1.00" and (2.675).toFixed(2) === "2.67" in Node 20 (references.md §10, [L]);
    // half-up on the decimal digits gives 1.01 and 2.68.
    expect((1.005).toFixed(2)).toBe("1.00");
    expect(parseMoneyToCents("1.005")).toBe(101);
    expect(parseMoneyToCents("2.675")).toBe(268);
    expect(parseMoneyToCents("$1,234.5")).toBe(123450);
    expect(parseMoneyToCents("0.125")).toBe(13);
    expect(parseMoneyToCents(".5")).toBe(50);
    expect(parseMoneyToCents("12")).toBe(1200);
    expect(parseMoneyToCents("twelve")).toBeNull();
    expect(parseMoneyToCents("")).toBeNull();
    expect(parseMoneyToCents("1.2.3")).toBeNull();
    expect(formatCents(101)).toBe("$1.01");
    expect(formatCents(123456789)).toBe("$1,234,567.89");
    expect(formatCents(-500)).toBe("-$5.00");
  });

  it("takes a percent of cents without float leaks (7.25 % of $2.00 is exactly 14.5 cents → 15)", () => {
    // 200 × 0.0725 = 14.499999999999998 in IEEE doubles (Node 20), so Math.round gives 14; the exact value is 14.5 → 15 half-up.
    expect(200 * 0.0725).toBeLessThan(14.5);
    expect(Math.round(200 * 0.0725)).toBe(14);
    expect(percentOfCents(200, 7.25)).toBe(15);
    // $30.00 at 7.25 % = 2.175 → $2.18 (half-up); floats give 217.49999999999997.
    expect(percentOfCents(3000, 7.25)).toBe(218);
    // 8.875 % (three decimals) of $3.60 = 31.95 cents → 32 [C].
    expect(percentOfCents(360, 8.875)).toBe(32);
  });
});

describe("sales tax per invoice or per line (SSUTA §324 worked example, references.md §10)", () => {
  const lines = [mat(25), mat(25), mat(25)];
  const opts = { taxPercent: 6, taxedKinds: ["materials"] as const, depositPercent: 0 };

  it("per invoice: 3 × $0.25 at 6 % → 0.045 → $0.05 (half-up)", () => {
    const t = computeQuoteTotals(lines, opts);
    expect(t.taxRounding).toBe("invoice");
    expect(t.subtotalCents).toBe(75);
    expect(t.taxCents).toBe(5);
    // Banker's rounding (half-even) would give $0.04; SSUTA half-up does not.
    expect(t.taxCents).not.toBe(4);
    expect(t.totalCents).toBe(80);
  });

  it("per line: each 0.015 → $0.02, total $0.06", () => {
    const t = computeQuoteTotals(lines, { ...opts, taxRounding: "line" });
    expect(t.taxCents).toBe(6);
    expect(t.totalCents).toBe(81);
  });
});

describe("a whole quote at the demo shop's settings", () => {
  // Demo settings: labour $95/h, materials markup 30 %, supplies 8 % of labour, tax 7.25 % on materials and supplies, deposit 40 %.
  const lines: QuoteLine[] = [
    labour(12.5, 9500),
    mat(21040, 30),
    { kind: "supplies", description: "Shop supplies", basis: "percent", percent: 8 },
  ];
  const opts = { taxPercent: 7.25, taxedKinds: ["materials", "supplies"] as const, depositPercent: 40 };

  it("matches the hand-worked figures [C]", () => {
    const t = computeQuoteTotals(lines, opts);
    // 12.5 h × $95.00 = $1,187.50
    expect(t.labourCents).toBe(118750);
    // $210.40 + 30 % ($63.12) = $273.52
    expect(t.materialsCents).toBe(27352);
    // 8 % of $1,187.50 = $95.00
    expect(t.suppliesCents).toBe(9500);
    expect(t.subtotalCents).toBe(155602);
    // taxed: $273.52 + $95.00 = $368.52; × 7.25 % = $26.7177 → $26.72
    expect(t.taxableCents).toBe(36852);
    expect(t.taxCents).toBe(2672);
    expect(t.totalCents).toBe(158274);
    // 40 % of $1,582.74 = $633.096 → $633.10; balance $949.64
    expect(t.depositCents).toBe(63310);
    expect(t.balanceCents).toBe(94964);
    expect(t.lines.map((l) => l.taxed)).toEqual([false, true, true]);
  });

  it("taxes only the kinds the settings name", () => {
    const t = computeQuoteTotals(lines, { ...opts, taxedKinds: ["labour"] });
    // $1,187.50 × 7.25 % = $86.09375 → $86.09 [C]
    expect(t.taxableCents).toBe(118750);
    expect(t.taxCents).toBe(8609);
    const none = computeQuoteTotals(lines, { ...opts, taxedKinds: [] });
    expect(none.taxCents).toBe(0);
    expect(none.totalCents).toBe(none.subtotalCents);
  });

  it("hours with two decimals: 0.75 h × $95 = $71.25; 1.33 h × $95 = $126.35 [C]", () => {
    expect(computeQuoteTotals([labour(0.75, 9500)], opts).labourCents).toBe(7125);
    expect(computeQuoteTotals([labour(1.33, 9500)], opts).labourCents).toBe(12635);
    // 0.67 h × $1.50 = 100.5 cents → $1.01 half-up (0.67 × 150 = 100.50000000000001 in floats, harmless here, but exact anyway).
    expect(computeQuoteTotals([labour(0.67, 150)], opts).labourCents).toBe(101);
  });
});

describe("supplies, sublet and discounts", () => {
  const opts = { taxPercent: 10, taxedKinds: ["materials"] as const, depositPercent: 50 };

  it("percent supplies follow the labour total across several labour lines; fixed supplies are as entered", () => {
    const t = computeQuoteTotals(
      [
        labour(2, 10000),
        labour(1.5, 10000),
        { kind: "supplies", description: "Supplies", basis: "percent", percent: 5 },
        { kind: "supplies", description: "Masking kit", basis: "fixed", amountCents: 1234 },
        { kind: "sublet", description: "Chrome plating", amountCents: 40000 },
      ],
      opts,
    );
    expect(t.labourCents).toBe(35000);
    // 5 % of $350 = $17.50, plus the fixed $12.34
    expect(t.suppliesCents).toBe(1750 + 1234);
    expect(t.subletCents).toBe(40000);
    expect(t.taxCents).toBe(0);
    expect(t.totalCents).toBe(35000 + 2984 + 40000);
  });

  it("a fixed discount lowers the taxed base in proportion", () => {
    // Gross $1,000 labour + $500 materials; discount $150. Taxed share = 150 × 500 / 1500 = $50,
    // taxed base $450, tax 10 % = $45; subtotal $1,350; total $1,395 [C].
    const t = computeQuoteTotals([labour(10, 10000), mat(50000), { kind: "discount", description: "Club discount", basis: "fixed", amountCents: 15000 }], opts);
    expect(t.grossCents).toBe(150000);
    expect(t.discountCents).toBe(15000);
    expect(t.subtotalCents).toBe(135000);
    expect(t.taxableCents).toBe(45000);
    expect(t.taxCents).toBe(4500);
    expect(t.totalCents).toBe(139500);
    expect(t.depositCents).toBe(69750);
    expect(t.lines[2]!.amountCents).toBe(-15000);
  });

  it("a percent discount is a share of the gross", () => {
    // 10 % of $1,500 = $150: same figures as the fixed discount above.
    const t = computeQuoteTotals([labour(10, 10000), mat(50000), { kind: "discount", description: "10 % off", basis: "percent", percent: 10 }], opts);
    expect(t.discountCents).toBe(15000);
    expect(t.totalCents).toBe(139500);
  });

  it("no lines: everything is zero", () => {
    const t = computeQuoteTotals([], opts);
    expect([t.subtotalCents, t.taxCents, t.totalCents, t.depositCents, t.balanceCents]).toEqual([0, 0, 0, 0, 0]);
  });
});

describe("invariants (fast-check)", () => {
  const line = fc.oneof(
    fc.record({ kind: fc.constant("labour" as const), description: fc.constant("L"), hours: fc.integer({ min: 0, max: 20000 }).map((h) => h / 100), rateCents: fc.integer({ min: 0, max: 50000 }) }),
    fc.record({ kind: fc.constant("materials" as const), description: fc.constant("M"), costCents: fc.integer({ min: 0, max: 5_000_000 }), markupPercent: fc.integer({ min: 0, max: 50000 }).map((m) => m / 100) }),
    fc.record({ kind: fc.constant("supplies" as const), description: fc.constant("S"), basis: fc.constant("percent" as const), percent: fc.integer({ min: 0, max: 2000 }).map((m) => m / 100) }),
    fc.record({ kind: fc.constant("sublet" as const), description: fc.constant("B"), amountCents: fc.integer({ min: 0, max: 1_000_000 }) }),
  );
  const opts = fc.record({
    taxPercent: fc.integer({ min: 0, max: 150000 }).map((t) => t / 10000),
    taxedKinds: fc.subarray(["labour", "materials", "supplies", "sublet"] as const),
    depositPercent: fc.integer({ min: 0, max: 10000 }).map((d) => d / 100),
  });

  it("all amounts are whole cents, the parts add up, and per-line tax stays within half a cent a line of per-invoice tax", () => {
    fc.assert(
      fc.property(fc.array(line, { maxLength: 12 }), opts, (lines, o) => {
        const inv = computeQuoteTotals(lines, o);
        const per = computeQuoteTotals(lines, { ...o, taxRounding: "line" });
        for (const t of [inv, per]) {
          for (const v of [t.subtotalCents, t.taxCents, t.totalCents, t.depositCents, t.balanceCents]) expect(Number.isSafeInteger(v)).toBe(true);
          expect(t.totalCents).toBe(t.subtotalCents + t.taxCents);
          expect(t.depositCents + t.balanceCents).toBe(t.totalCents);
          expect(t.lines.reduce((s, l) => s + l.amountCents, 0)).toBe(t.subtotalCents);
        }
        const taxedLines = inv.lines.filter((l) => l.taxed).length;
        expect(Math.abs(inv.taxCents - per.taxCents)).toBeLessThanOrEqual(Math.ceil(taxedLines / 2) + 1);
      }),
      { numRuns: 300 },
    );
  });
});

describe("the finish in plain words", () => {
  it("names each layer with its coats, bottom to top", () => {
    expect(
      describeFinish([
        { name: "Scuff and clean", kind: "prep", coats: 0 },
        { name: "Sealer", kind: "sealer", coats: 2 },
        { name: "Silver ground coat", kind: "ground_coat", coats: 2 },
        { name: "Candy red", kind: "candy", coats: 5 },
        { name: "2K clear", kind: "clear", coats: 3 },
        { name: "", kind: "effect_mid_coat", coats: 1 },
      ]),
    ).toBe("Scuff and clean · Sealer, 2 coats · Silver ground coat, 2 coats · Candy red, 5 coats · 2K clear, 3 coats · Effect mid-coat, 1 coat");
  });
});
