import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  G_PER_L_PER_LB_PER_GAL,
  actualVoc,
  gPerLToLbPerGal,
  lbPerGalToGPerL,
  mixVoc,
  mixVocActual,
  multiStageVoc,
  regulatoryVoc,
} from "../../shared/mix/index";
import { catchMixError, expectRel } from "./helpers";

const LB = 453.59237; // g, exact (1959 international pound)
const GAL = 3.785411784; // L, exact (NIST Handbook 44 App. C: 231 in³)

describe("lb/gal ↔ g/L", () => {
  it("1 lb/gal = 119.826427 g/L (453.59237 g ÷ 3.785411784 L)", () => {
    // Metal Finishing Guidebook App. B: "1 lb/gal = 119.8 g/L"; exact value from the two definitions.
    expect(G_PER_L_PER_LB_PER_GAL).toBeCloseTo(119.826427, 6);
    expect(lbPerGalToGPerL(1)).toBeCloseTo(119.8, 1);
  });

  it("worked conversions (computed, references.md §1b)", () => {
    expect(lbPerGalToGPerL(8.52)).toBeCloseTo(1020.921, 3);
    // Limits are printed as rounded pairs: 5.2 lb/gal = 623.10 g/L, 630 g/L = 5.258 lb/gal.
    expect(lbPerGalToGPerL(5.2)).toBeCloseTo(623.1, 2);
    expect(gPerLToLbPerGal(630)).toBeCloseTo(5.258, 3);
  });

  it("round trips to 1e-12", () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 2000, noNaN: true }), (g) => {
        expect(Math.abs(lbPerGalToGPerL(gPerLToLbPerGal(g)) - g)).toBeLessThanOrEqual(1e-12 * Math.max(1, g));
      }),
    );
  });
});

describe("regulatory VOC, 40 CFR 59.104(a)(1): (Wv − Ww − Wec) / (V − Vw − Vec)", () => {
  it("waterborne litre: 100 g VOC, 600 g water, 50 g acetone (exempt) → 296.92 g/L regulatory, 100 g/L actual", () => {
    // Formula: 40 CFR 59.104(a)(1); actual vs regulatory definitions: SCAQMD "VOC Calculations".
    // Worked numbers computed in references.md §3: acetone 50 g at 0.791 g/mL = 0.0632 L.
    const coating = {
      volatileMassG: 100 + 600 + 50,
      waterMassG: 600,
      exemptMassG: 50,
      volumeL: 1,
      waterVolumeL: 0.6,
      exemptVolumeL: 50 / 791,
    };
    expect(regulatoryVoc(coating)).toBeCloseTo(296.92, 2);
    expect(actualVoc(coating)).toBeCloseTo(100, 10);
  });

  it("weight-% example: 20.8 wt% solids, 53.0 wt% water, 8.52 lb/gal → regulatory 4.87, actual 2.23 lb/gal", () => {
    // Ron Joseph, PCRC "VOC for the Lube" (paintcenter.org/rj/mar04b.php), water at 8.33 lb/gal.
    const massLb = 8.52; // one gallon
    const volatileLb = massLb * (1 - 0.208);
    const waterLb = massLb * 0.53;
    const coating = {
      volatileMassG: volatileLb * LB,
      waterMassG: waterLb * LB,
      exemptMassG: 0,
      volumeL: GAL,
      waterVolumeL: (waterLb / 8.33) * GAL,
      exemptVolumeL: 0,
    };
    expect(gPerLToLbPerGal(regulatoryVoc(coating))).toBeCloseTo(4.87, 2);
    expect(gPerLToLbPerGal(actualVoc(coating))).toBeCloseTo(2.23, 2);
  });
});

describe("VOC of a mixed batch", () => {
  it("1 gal enamel at 2.5 lb/gal + 0.25 gal thinner at 6.8 lb/gal → 3.36 lb/gal", () => {
    // Metal Finishing Guidebook App. B (metalfinishing.epubxp.com/i/218436-2013/826): 4.2 lb / 1.25 gal.
    const voc = mixVoc([
      { volume: 1, vocGPerL: lbPerGalToGPerL(2.5) },
      { volume: 0.25, vocGPerL: lbPerGalToGPerL(6.8) },
    ]);
    expect(gPerLToLbPerGal(voc)).toBeCloseTo(3.36, 10);
  });

  it("3 parts A at 3.1 + 1 part B at 1.8 lb/gal less water + 7 parts water → 2.775 lb/gal less water", () => {
    // Metal Finishing Guidebook App. B (…/830): 11.1 lb / 4 gal; the source prints 2.75 (an arithmetic slip,
    // see references.md §3). Including the water: 11.1 / 11 = 1.009 lb/gal.
    const items = [
      { volume: 3, vocGPerL: lbPerGalToGPerL(3.1) },
      { volume: 1, vocGPerL: lbPerGalToGPerL(1.8) },
      { volume: 7, vocGPerL: 0, waterExemptPct: 100 },
    ];
    expect(gPerLToLbPerGal(mixVoc(items))).toBeCloseTo(2.775, 10);
    expect(gPerLToLbPerGal(mixVocActual(items))).toBeCloseTo(1.009, 3);
  });

  it("2:1:1 base 500, hardener 300, reducer 880 g/L (no water/exempt) → 545 g/L", () => {
    // Computed (references.md §3) from the 40 CFR 59.104(a)(1) formula: (1000 + 300 + 880) / 4.
    expect(
      mixVoc([
        { volume: 2, vocGPerL: 500 },
        { volume: 1, vocGPerL: 300 },
        { volume: 1, vocGPerL: 880 },
      ]),
    ).toBeCloseTo(545, 10);
  });

  it("the waterborne litre split into its parts gives the same 296.92 / 100 g/L", () => {
    // Same example as above (references.md §3): 100 g VOC in the 0.3368 L that is neither water nor exempt.
    const exemptL = 50 / 791;
    const restL = 1 - 0.6 - exemptL;
    const items = [
      { volume: restL, vocGPerL: 100 / restL },
      { volume: 0.6, vocGPerL: 0, waterExemptPct: 100 },
      { volume: exemptL, vocGPerL: 0, waterExemptPct: 100 },
    ];
    expect(mixVoc(items)).toBeCloseTo(296.92, 2);
    expect(mixVocActual(items)).toBeCloseTo(100, 10);
  });

  it("without water or exempts, the mix VOC is the volume-weighted mean and lies between the parts", () => {
    // references.md §3: with no water/exempt, VOC_mix = Σ VOC_i·V_i / Σ V_i (40 CFR 59.104(a)(1)).
    const item = fc.record({
      volume: fc.double({ min: 0.001, max: 100, noNaN: true }),
      vocGPerL: fc.double({ min: 0, max: 900, noNaN: true }),
    });
    fc.assert(
      fc.property(fc.array(item, { minLength: 1, maxLength: 6 }), (items) => {
        const voc = mixVoc(items);
        const mean = items.reduce((a, i) => a + i.vocGPerL * i.volume, 0) / items.reduce((a, i) => a + i.volume, 0);
        expect(Math.abs(voc - mean)).toBeLessThanOrEqual(1e-9 * Math.max(1, mean));
        expect(voc).toBeGreaterThanOrEqual(Math.min(...items.map((i) => i.vocGPerL)) - 1e-9);
        expect(voc).toBeLessThanOrEqual(Math.max(...items.map((i) => i.vocGPerL)) + 1e-9);
        expectRel(mixVocActual(items), voc, 1e-12); // no water: actual = regulatory (SCAQMD "VOC Calculations")
      }),
    );
  });

  it("regulatory VOC is never below actual VOC", () => {
    // SCAQMD "VOC Calculations": regulatory is always the higher of the two.
    const item = fc.record({
      volume: fc.double({ min: 0.001, max: 100, noNaN: true }),
      vocGPerL: fc.double({ min: 0, max: 900, noNaN: true }),
      waterExemptPct: fc.double({ min: 0, max: 90, noNaN: true }),
    });
    fc.assert(
      fc.property(fc.array(item, { minLength: 1, maxLength: 6 }), (items) => {
        const reg = mixVoc(items);
        const act = mixVocActual(items);
        expect(Number.isFinite(reg) && reg >= 0 && act >= 0).toBe(true);
        expect(reg).toBeGreaterThanOrEqual(act - 1e-9);
      }),
    );
  });
});

describe("multi-stage finishes", () => {
  it("two-stage: basecoat 700, clearcoat 450 g/L → (700 + 2 × 450) / 3 = 533.3 g/L", () => {
    // Formula (ROGbc + 2 ROGcc) / 3: San Luis Obispo APCD Rule 423 (arb.ca.gov/drdb/slo/suphtml/s423.htm).
    expect(multiStageVoc({ basecoat: 700, clearcoat: 450 })).toBeCloseTo(533.33, 2);
  });

  it("three-stage candy: 600 / one midcoat 550 / clear 500 → 537.5 g/L", () => {
    // (bc + Σ mc + 2 cc) / (M + 3): federal multi-stage formula, 40 CFR 59.104(a)(2) — form from memory.
    expect(multiStageVoc({ basecoat: 600, midcoats: [550], clearcoat: 500 })).toBeCloseTo(537.5, 10);
  });
});

describe("invalid input", () => {
  it("rejects empty batches, all-water batches and bad numbers, naming the field", () => {
    expect(catchMixError(() => mixVoc([])).field).toBe("items");
    expect(catchMixError(() => mixVoc([{ volume: 1, vocGPerL: 0, waterExemptPct: 100 }])).message).toContain(
      "all water and exempt",
    );
    expect(catchMixError(() => mixVoc([{ volume: 0, vocGPerL: 100 }])).field).toBe("items[0].volume");
    expect(catchMixError(() => mixVoc([{ volume: 1, vocGPerL: -1 }])).field).toBe("items[0].vocGPerL");
    expect(catchMixError(() => mixVoc([{ volume: 1, vocGPerL: 1, waterExemptPct: 101 }])).field).toBe(
      "items[0].waterExemptPct",
    );
    expect(catchMixError(() => lbPerGalToGPerL(Number.NaN)).field).toBe("lbPerGal");
    const c = { volatileMassG: 10, waterMassG: 20, exemptMassG: 0, volumeL: 1, waterVolumeL: 0.02, exemptVolumeL: 0 };
    expect(catchMixError(() => regulatoryVoc(c)).field).toBe("volatileMassG");
    expect(catchMixError(() => regulatoryVoc({ ...c, volatileMassG: 30, waterVolumeL: 1 })).field).toBe("volumeL");
  });
});
