import fc from "fast-check";
import { unit as mathUnit } from "mathjs";
import { describe, expect, it } from "vitest";
import {
  MASS_UNITS,
  MASS_UNIT_IDS,
  VOLUME_UNITS,
  VOLUME_UNIT_IDS,
  convertMass,
  convertVolume,
  isMassUnit,
  isVolumeUnit,
  type MassUnit,
  type VolumeUnit,
} from "../../shared/mix/index";
import { catchMixError, expectRel } from "./helpers";

describe("US customary volume, exact NIST definitions", () => {
  it("1 US gallon = 231 in³ = 3785.411784 mL exactly", () => {
    // NIST Handbook 44 App. C: "1 gallon (gal) (U.S.) 231 cubic inches (exactly)"; 1 in = 2.54 cm exactly
    // → 1 in³ = 16.387064 mL exactly, so 1 gal = 231 × 16.387064 = 3785.411784 mL.
    expectRel(convertVolume(1, "gallon", "mL"), 3785.411784, 1e-15);
    expectRel(convertVolume(1, "gallon", "mL") / 16.387064, 231, 1e-15);
    expectRel(convertVolume(1, "gallon", "L"), 3.785411784, 1e-15);
  });

  it("fluid ounce, cup, pint and quart follow from the gallon", () => {
    // NIST Handbook 44 App. C: fl oz = gal/128 = 29.5735295625 mL; cup = 8 fl oz (exactly) = ½ liquid pint;
    // pint = gal/8 = 473.176473 mL; quart = gal/4 = 946.352946 mL.
    expectRel(convertVolume(1, "floz", "mL"), 29.5735295625, 1e-15);
    expectRel(convertVolume(1, "cup", "mL"), 236.5882365, 1e-15);
    expectRel(convertVolume(1, "pint", "mL"), 473.176473, 1e-15);
    expectRel(convertVolume(1, "quart", "mL"), 946.352946, 1e-15);
    expect(convertVolume(1, "gallon", "floz")).toBe(128); // NIST HB 44: 1 gal = 128 fl oz
    expect(convertVolume(1, "cup", "floz")).toBe(8); // NIST HB 44: cup = 8 fl oz (exactly)
    expect(convertVolume(1, "pint", "cup")).toBe(2); // NIST HB 44: cup = ½ liquid pint (exactly)
    expect(convertVolume(1, "quart", "pint")).toBe(2); // NIST HB 44: 1 qt = 2 pt
  });

  it("is not the imperial gallon nor the nutrition-label cup", () => {
    // Imperial gallon = 4.54609 L exactly (UK Weights and Measures Act 1985, from memory; references.md §1a);
    // US nutrition-label cup = 240 mL (21 CFR 101.9(b)(5)(viii), from memory).
    expect(Math.abs(convertVolume(1, "gallon", "L") - 4.54609)).toBeGreaterThan(0.7);
    expect(Math.abs(convertVolume(1, "cup", "mL") - 240)).toBeGreaterThan(3);
  });

  it("worked conversions (computed from the NIST definitions, references.md §1b)", () => {
    expect(convertVolume(750, "mL", "floz")).toBeCloseTo(25.360517026, 9); // 750 / 29.5735295625
    expect(convertVolume(2.5, "L", "gallon")).toBeCloseTo(0.660430131, 9); // 2.5 / 3.785411784
    expectRel(convertVolume(12, "floz", "mL"), 354.88235475, 1e-15); // 12 × 29.5735295625
    expectRel(convertVolume(1, "quart", "mL") + convertVolume(1, "cup", "mL"), 1182.9411825, 1e-15);
    expect(convertVolume(1, "L", "floz")).toBeCloseTo(33.814022701843, 12); // 1000 / 29.5735295625
  });
});

describe("avoirdupois mass, exact definitions", () => {
  it("1 lb = 453.59237 g and 1 oz = 28.349523125 g exactly", () => {
    // International yard and pound agreement (1959): 1 lb = 0.45359237 kg exactly; NIST HB 44 App. C: oz = lb/16.
    expectRel(convertMass(1, "lb", "g"), 453.59237, 1e-15);
    expectRel(convertMass(1, "oz", "g"), 28.349523125, 1e-15);
    expect(convertMass(1, "lb", "oz")).toBe(16);
    expect(convertMass(1, "kg", "g")).toBe(1000);
  });

  it("worked conversions (computed from the definitions, references.md §1b)", () => {
    expect(convertMass(500, "g", "oz")).toBeCloseTo(17.636981, 6); // 500 / 28.349523125
    expect(convertMass(1, "kg", "lb")).toBeCloseTo(2.204622621849, 12); // 1000 / 453.59237
  });
});

describe("second reference: mathjs (exact US units since v13.0.3)", () => {
  const mathVolume: Record<VolumeUnit, string> = {
    mL: "mL",
    L: "L",
    floz: "fluidounce",
    cup: "cup",
    pint: "pint",
    quart: "quart",
    gallon: "gallon",
  };
  const mathMass: Record<MassUnit, string> = { g: "g", kg: "kg", oz: "oz", lb: "lbm" };
  const value = fc.double({ min: 1e-6, max: 1e6, noNaN: true });

  it("volume conversions agree with mathjs to 1e-12 relative on random values", () => {
    fc.assert(
      fc.property(value, fc.constantFrom(...VOLUME_UNIT_IDS), fc.constantFrom(...VOLUME_UNIT_IDS), (v, from, to) => {
        const expected = mathUnit(v, mathVolume[from]).toNumber(mathVolume[to]);
        expectRel(convertVolume(v, from, to), expected, 1e-12);
      }),
    );
  });

  it("mass conversions agree with mathjs to 1e-12 relative on random values", () => {
    fc.assert(
      fc.property(value, fc.constantFrom(...MASS_UNIT_IDS), fc.constantFrom(...MASS_UNIT_IDS), (v, from, to) => {
        const expected = mathUnit(v, mathMass[from]).toNumber(mathMass[to]);
        expectRel(convertMass(v, from, to), expected, 1e-12);
      }),
    );
  });
});

describe("properties", () => {
  const value = fc.double({ min: 1e-9, max: 1e9, noNaN: true });

  it("round trips hold to 1e-12 relative", () => {
    fc.assert(
      fc.property(value, fc.constantFrom(...VOLUME_UNIT_IDS), fc.constantFrom(...VOLUME_UNIT_IDS), (v, a, b) => {
        expectRel(convertVolume(convertVolume(v, a, b), b, a), v, 1e-12);
      }),
    );
    fc.assert(
      fc.property(value, fc.constantFrom(...MASS_UNIT_IDS), fc.constantFrom(...MASS_UNIT_IDS), (v, a, b) => {
        expectRel(convertMass(convertMass(v, a, b), b, a), v, 1e-12);
      }),
    );
  });

  it("results are finite and non-negative, and zero stays zero", () => {
    fc.assert(
      fc.property(value, fc.constantFrom(...VOLUME_UNIT_IDS), fc.constantFrom(...VOLUME_UNIT_IDS), (v, a, b) => {
        const r = convertVolume(v, a, b);
        expect(Number.isFinite(r) && r > 0).toBe(true);
      }),
    );
    expect(convertVolume(0, "gallon", "mL")).toBe(0);
    expect(convertMass(0, "lb", "g")).toBe(0);
  });
});

describe("unit lists for dropdowns", () => {
  it("list every unit once, with a label and symbol", () => {
    expect(VOLUME_UNITS.map((u) => u.value)).toEqual([...VOLUME_UNIT_IDS]);
    expect(MASS_UNITS.map((u) => u.value)).toEqual([...MASS_UNIT_IDS]);
    for (const u of [...VOLUME_UNITS, ...MASS_UNITS]) {
      expect(u.label.length).toBeGreaterThan(2);
      expect(u.symbol.length).toBeGreaterThan(0);
    }
    // Metric first, then US customary from small to large, so a dropdown reads naturally.
    const us = VOLUME_UNITS.slice(2).map((u) => convertVolume(1, u.value, "mL"));
    expect(VOLUME_UNITS.slice(0, 2).map((u) => u.value)).toEqual(["mL", "L"]);
    expect([...us].sort((a, b) => a - b)).toEqual(us);
  });

  it("type guards accept the units and nothing else", () => {
    expect(VOLUME_UNIT_IDS.every(isVolumeUnit)).toBe(true);
    expect(MASS_UNIT_IDS.every(isMassUnit)).toBe(true);
    expect(isVolumeUnit("gal")).toBe(false);
    expect(isVolumeUnit("g")).toBe(false);
    expect(isMassUnit("mL")).toBe(false);
    expect(isMassUnit("toString")).toBe(false);
  });
});

describe("invalid input", () => {
  it("rejects unknown units, naming the field", () => {
    const e = catchMixError(() => convertVolume(1, "gal" as VolumeUnit, "mL"));
    expect(e.field).toBe("from");
    expect(e.message).toContain('"gal"');
    expect(catchMixError(() => convertMass(1, "g", "stone" as MassUnit)).field).toBe("to");
    expect(catchMixError(() => convertVolume(1, "mL", "g" as VolumeUnit)).field).toBe("to");
  });

  it("rejects negative and non-finite values", () => {
    for (const bad of [-1, Number.NaN, Number.POSITIVE_INFINITY]) {
      expect(catchMixError(() => convertVolume(bad, "mL", "L")).field).toBe("value");
      expect(catchMixError(() => convertMass(bad, "g", "kg")).field).toBe("value");
    }
  });
});
