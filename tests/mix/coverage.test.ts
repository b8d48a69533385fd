import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  FT2_PER_GAL_AT_1_MIL,
  M2_PER_L_AT_1_UM,
  dryFilmFromWet,
  mixVolumeSolids,
  spreadingRate,
  volumeNeeded,
  wetFilmFromDry,
  type AreaUnit,
  type FilmUnit,
  type SpreadingRateUnit,
} from "../../shared/mix/index";
import { catchMixError, expectRel } from "./helpers";

describe("spreading-rate constants", () => {
  it("1 US gal at 100 % solids, 1 mil thick covers 1604.1667 ft² (231 / 0.001 / 144)", () => {
    // Ron Joseph, PCRC "Amount of Paint Required" (paintcenter.org/rj/dec09a.cfm): 1604 ft² per gal at 1 mil;
    // exact form 231 in³ / 0.001 in / 144 in²·ft⁻² from NIST Handbook 44 App. C (1 gal = 231 in³).
    expect(FT2_PER_GAL_AT_1_MIL).toBeCloseTo(1604.1667, 4);
    expect(spreadingRate({ volumeSolidsPct: 100, dryFilm: 1, dryFilmUnit: "mil" }, "ft2/gal")).toBeCloseTo(1604.1667, 4);
  });

  it("1 L at 100 % solids, 1 µm thick covers 1000 m²", () => {
    // "Theoretical Spreading Rate / Coverage" (scribd.com/document/343849341): TSR m²/L = 10 × VS% / DFT µm.
    expect(M2_PER_L_AT_1_UM).toBe(1000);
    expect(spreadingRate({ volumeSolidsPct: 100, dryFilm: 1, dryFilmUnit: "um" }, "m2/L")).toBe(1000);
  });

  it("the two constants are the same quantity in different units", () => {
    // 1 ft² = 0.09290304 m² (0.3048 m exactly, NIST HB 44), 1 gal = 3.785411784 L, 1 mil = 25.4 µm.
    const us = spreadingRate({ volumeSolidsPct: 100, dryFilm: 1, dryFilmUnit: "mil" }, "ft2/gal");
    const metric = spreadingRate({ volumeSolidsPct: 100, dryFilm: 1, dryFilmUnit: "mil" }, "m2/L");
    expectRel((us * 0.09290304) / 3.785411784, metric, 1e-12);
    expectRel(metric * 25.4, 1000, 1e-12);
  });
});

describe("worked coverage values (references.md §2)", () => {
  it("VS 65 %, DFT 5.0 mil → 208.54 ft²/gal (the source prints 208.52 using 1604)", () => {
    // scribd "Spreading Rate" document: 1604 × 0.65 / 5 = 208.52; with 1604.1667 the value is 208.54.
    expect(spreadingRate({ volumeSolidsPct: 65, dryFilm: 5, dryFilmUnit: "mil" }, "ft2/gal")).toBeCloseTo(208.54, 2);
  });

  it("VS 65 %, DFT 125 µm → 5.2 m²/L", () => {
    // scribd "Spreading Rate" document, metric example.
    expect(spreadingRate({ volumeSolidsPct: 65, dryFilm: 125, dryFilmUnit: "um" }, "m2/L")).toBeCloseTo(5.2, 10);
  });

  it("practical coverage: 1 gal, VS 52 %, TE 30 %, 1.5 mil → about 167 ft²", () => {
    // Ron Joseph, PCRC "Calculating Paint Coverage" (paintcenter.org/rj/oct03e.cfm): 166.8 → "167 ft²".
    const rate = spreadingRate(
      { volumeSolidsPct: 52, dryFilm: 1.5, dryFilmUnit: "mil", transferEfficiencyPct: 30 },
      "ft2/gal",
    );
    expect(rate).toBeCloseTo(166.83, 2);
    expect(Math.round(rate)).toBe(167);
  });

  it("job volume: 25 ft², 2.0 mil, VS 50 %, TE 65 % → 363.04 mL ready to spray", () => {
    // Computed from the 1604.1667 constant (references.md §2): 0.095904 gal = 12.276 fl oz = 363.04 mL.
    const job = {
      area: 25,
      areaUnit: "ft2" as const,
      coats: 1,
      dryFilmPerCoat: 2,
      dryFilmUnit: "mil" as const,
      volumeSolidsPct: 50,
      transferEfficiencyPct: 65,
    };
    expect(volumeNeeded(job, "mL")).toBeCloseTo(363.04, 2);
    expect(volumeNeeded(job, "gallon")).toBeCloseTo(0.095904, 6);
    expect(volumeNeeded(job, "floz")).toBeCloseTo(12.276, 3);
    // Plus 10 % left in cup and gun (÷ 0.9) → 403.37 mL.
    expect(volumeNeeded({ ...job, otherLossPct: 10 }, "mL")).toBeCloseTo(403.37, 2);
    // Two coats of the same film need twice the material.
    expectRel(volumeNeeded({ ...job, coats: 2 }, "mL"), 2 * volumeNeeded(job, "mL"), 1e-12);
  });

  it("job volume, metric: 2.3 m², 50 µm, VS 50 %, TE 65 % → 353.85 mL", () => {
    // Computed from 1000 m²/(L·µm) (references.md §2): 2.3 × 50 / (1000 × 0.5 × 0.65) L.
    expect(
      volumeNeeded(
        {
          area: 2.3,
          areaUnit: "m2",
          coats: 1,
          dryFilmPerCoat: 50,
          dryFilmUnit: "um",
          volumeSolidsPct: 50,
          transferEfficiencyPct: 65,
        },
        "mL",
      ),
    ).toBeCloseTo(353.846, 3);
  });

  it("a 30 % loss factor turns 100 ft²/gal into 70 ft²/gal", () => {
    // Corrosionpedia "Practical coverage": TSR 100 ft²/gal with 30 % loss → 70 ft²/gal.
    const dft = FT2_PER_GAL_AT_1_MIL / 100; // film giving exactly 100 ft²/gal at 100 % solids
    const gallons = volumeNeeded(
      {
        area: 70,
        areaUnit: "ft2",
        coats: 1,
        dryFilmPerCoat: dft,
        dryFilmUnit: "mil",
        volumeSolidsPct: 100,
        transferEfficiencyPct: 100,
        otherLossPct: 30,
      },
      "gallon",
    );
    expect(gallons).toBeCloseTo(1, 12);
  });
});

describe("film thickness", () => {
  it("DFT 1.5 mil at VS 42 % needs 3.57 mil wet", () => {
    // Ron Joseph, PCRC "Converting DFT to WFT" (paintcenter.org/rj/oct03k.php): WFT = DFT / VS.
    expect(wetFilmFromDry(1.5, 42)).toBeCloseTo(3.57, 2);
    expectRel(dryFilmFromWet(wetFilmFromDry(1.5, 42), 42), 1.5, 1e-12);
  });

  it("VS 60 % reduced 25 % (4:1) → VS 48 %, 2.0 mil dry needs 4.167 mil wet", () => {
    // Computed (references.md §2): VS_rts = VS / (1 + R); reducer has no solids; volumes add.
    const vs = mixVolumeSolids([
      { volume: 4, volumeSolidsPct: 60 },
      { volume: 1, volumeSolidsPct: 0 },
    ]);
    expectRel(vs, 48, 1e-12);
    expect(wetFilmFromDry(2, vs)).toBeCloseTo(4.167, 3);
  });

  it("mixed VS of 4:1:1 at 55 % / 70 % / 0 % is 48.33 %", () => {
    // Computed (references.md §2), volume-additivity assumption.
    expect(
      mixVolumeSolids([
        { volume: 4, volumeSolidsPct: 55 },
        { volume: 1, volumeSolidsPct: 70 },
        { volume: 1, volumeSolidsPct: 0 },
      ]),
    ).toBeCloseTo(48.33, 2);
  });
});

describe("properties (fast-check)", () => {
  const pct = fc.double({ min: 1, max: 100, noNaN: true });
  const film = fc.double({ min: 0.1, max: 500, noNaN: true });

  it("volume needed × spreading rate = area × coats, in both unit systems", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 1000, noNaN: true }),
        fc.integer({ min: 1, max: 6 }),
        film,
        fc.constantFrom<FilmUnit>("um", "mil"),
        pct,
        pct,
        (area, coats, dft, filmUnit, vs, te) => {
          const spec = { volumeSolidsPct: vs, dryFilm: dft, dryFilmUnit: filmUnit, transferEfficiencyPct: te };
          const inputs = { coats, dryFilmPerCoat: dft, dryFilmUnit: filmUnit, volumeSolidsPct: vs, transferEfficiencyPct: te };
          const litres = volumeNeeded({ area, areaUnit: "m2", ...inputs }, "L");
          expectRel(litres * spreadingRate(spec, "m2/L"), area * coats, 1e-12);
          const gallons = volumeNeeded({ area, areaUnit: "ft2", ...inputs }, "gallon");
          expectRel(gallons * spreadingRate(spec, "ft2/gal"), area * coats, 1e-12);
          expect(Number.isFinite(litres) && litres > 0).toBe(true);
        },
      ),
    );
  });
});

describe("invalid input", () => {
  it("rejects bad percentages, films, units and areas, naming the field", () => {
    const ok = { volumeSolidsPct: 50, dryFilm: 2, dryFilmUnit: "mil" as const };
    expect(catchMixError(() => spreadingRate({ ...ok, volumeSolidsPct: 0 }, "m2/L")).field).toBe("volumeSolidsPct");
    expect(catchMixError(() => spreadingRate({ ...ok, volumeSolidsPct: 120 }, "m2/L")).field).toBe("volumeSolidsPct");
    expect(catchMixError(() => spreadingRate({ ...ok, transferEfficiencyPct: -5 }, "m2/L")).field).toBe(
      "transferEfficiencyPct",
    );
    expect(catchMixError(() => spreadingRate({ ...ok, dryFilm: 0 }, "m2/L")).field).toBe("dryFilm");
    expect(catchMixError(() => spreadingRate({ ...ok, dryFilmUnit: "mm" as FilmUnit }, "m2/L")).field).toBe(
      "dryFilmUnit",
    );
    expect(catchMixError(() => spreadingRate(ok, "m2/gal" as SpreadingRateUnit)).field).toBe("out");
    expect(catchMixError(() => wetFilmFromDry(2, Number.NaN)).field).toBe("volumeSolidsPct");
    const job = {
      area: 10,
      areaUnit: "m2" as const,
      coats: 2,
      dryFilmPerCoat: 40,
      dryFilmUnit: "um" as const,
      volumeSolidsPct: 50,
      transferEfficiencyPct: 65,
    };
    expect(catchMixError(() => volumeNeeded({ ...job, area: -1 }, "L")).field).toBe("area");
    expect(catchMixError(() => volumeNeeded({ ...job, areaUnit: "yd2" as AreaUnit }, "L")).field).toBe("areaUnit");
    expect(catchMixError(() => volumeNeeded({ ...job, coats: 0 }, "L")).field).toBe("coats");
    expect(catchMixError(() => volumeNeeded({ ...job, otherLossPct: 100 }, "L")).field).toBe("otherLossPct");
    expect(catchMixError(() => volumeNeeded(job, "pt" as "pint")).field).toBe("unit");
    expect(catchMixError(() => mixVolumeSolids([])).field).toBe("items");
    expect(catchMixError(() => mixVolumeSolids([{ volume: 0, volumeSolidsPct: 50 }])).field).toBe("items");
  });
});
