import { describe, expect, it } from "vitest";
import { cToF, coatCount, effectiveCoats, fToC, nextBoothStep, type BoothLayerTiming, type CoatEntry } from "../../shared/domain/booth";
import { colourVerdict, colourVerdictText } from "../../shared/domain/colour-verdict";
import { missingPrepSteps, prepStepsFor } from "../../shared/domain/prep";

const MIN = 60_000;
const T = Date.parse("2030-01-01T08:00:00Z");
const LAYERS: BoothLayerTiming[] = [
  { id: 10, coats: 2, flashMinutes: 10, minutesPerCoat: 4, dryMinutes: 30 },
  { id: 20, coats: 3, flashMinutes: 5, minutesPerCoat: 5, dryMinutes: 0 },
];
const coat = (id: number, layerId: number, coatNumber: number, at: number, extra: Partial<CoatEntry> = {}): CoatEntry => ({ id, layerId, coatNumber, at, correctsId: null, voids: false, ...extra });

describe("effectiveCoats", () => {
  it("keeps originals, applies the latest correction's time, drops voided coats, and ignores correction rows themselves", () => {
    const entries = [
      coat(1, 10, 1, T),
      coat(2, 10, 2, T + 15 * MIN),
      coat(3, 10, 1, T - 2 * MIN, { correctsId: 1 }),
      coat(4, 10, 1, T - 3 * MIN, { correctsId: 1 }),
      coat(5, 10, 2, T + 15 * MIN, { correctsId: 2, voids: true }),
    ];
    expect(effectiveCoats(entries)).toEqual([{ id: 1, layerId: 10, coatNumber: 1, at: T - 3 * MIN, correctedBy: 4 }]);
  });
});

describe("nextBoothStep", () => {
  it("starts at coat 1 of the first layer with no timer", () => {
    expect(nextBoothStep(LAYERS, [], T)).toMatchObject({ state: "spray", layerId: 10, coat: 1, of: 2, timer: null, isLastLayer: false });
  });

  it("after a coat, the flash timer ends at the coat's time + flash minutes (mix engine layerTimeline)", () => {
    const step = nextBoothStep(LAYERS, effectiveCoats([coat(1, 10, 1, T)]), T + MIN);
    expect(step).toMatchObject({ state: "spray", layerId: 10, coat: 2, timer: { kind: "flash", startedAt: T, endsAt: T + 10 * MIN } });
    // The rest of the layer: one more coat of 4 min starting when the flash ends (08:10) → done 08:14.
    expect(step.state === "spray" && step.layerDoneAt).toBe(T + 14 * MIN);
  });

  it("when a layer is done, the next layer waits for its dry time", () => {
    const step = nextBoothStep(LAYERS, effectiveCoats([coat(1, 10, 1, T), coat(2, 10, 2, T + 12 * MIN)]), T + 13 * MIN);
    expect(step).toMatchObject({ state: "spray", layerId: 20, coat: 1, of: 3, isLastLayer: true, timer: { kind: "dry", startedAt: T + 12 * MIN, endsAt: T + 42 * MIN } });
    expect(step.layers.map((l) => l.status)).toEqual(["done", "current"]);
  });

  it("is done after the last coat of the last layer", () => {
    const coats = [coat(1, 10, 1, T), coat(2, 10, 2, T + 12 * MIN), coat(3, 20, 1, T + 50 * MIN), coat(4, 20, 2, T + 60 * MIN), coat(5, 20, 3, T + 70 * MIN)];
    expect(nextBoothStep(LAYERS, effectiveCoats(coats), T + 80 * MIN)).toMatchObject({ state: "done", lastCoatAt: T + 70 * MIN });
  });

  it("gives the same answer whenever it is asked: timers come from stored times, not from when the card is opened", () => {
    const coats = effectiveCoats([coat(1, 10, 1, T)]);
    const a = nextBoothStep(LAYERS, coats, T + MIN);
    const b = nextBoothStep(LAYERS, coats, T + 7 * MIN);
    expect(a.state === "spray" && a.timer).toEqual(b.state === "spray" && b.timer);
  });

  it("rounds part coats up and handles a plan with no layers", () => {
    expect(coatCount(2.5)).toBe(3);
    expect(coatCount(2)).toBe(2);
    expect(coatCount(0)).toBe(1);
    expect(nextBoothStep([], [], T).state).toBe("no_layers");
  });
});

describe("colour verdict", () => {
  const t = { deltaEMatch: 1, deltaEClose: 2 };
  it("under the tolerance is within, under the outer limit borderline, otherwise out of tolerance (limits are exclusive)", () => {
    expect(colourVerdict(0.9082, t)).toBe("match"); // Sharma et al. 2005 pair 34
    expect(colourVerdict(1, t)).toBe("close");
    expect(colourVerdict(1.8731, t)).toBe("close"); // pair 27
    expect(colourVerdict(2, t)).toBe("different");
    expect(colourVerdictText(1.2644, t)).toBe("Borderline (ΔE00 1.26): over the shop's tolerance of 1, under its outer limit of 2");
    expect(colourVerdictText(0.9082, t)).toBe("Within tolerance (ΔE00 0.91): under the shop's tolerance of 1");
    expect(colourVerdictText(2.3669, t)).toBe("Out of tolerance (ΔE00 2.37): at or over the shop's outer limit of 2"); // Sharma et al. 2005 pair 7
  });

  it("never uses the old rating words Match / Close / Different", () => {
    for (const d of [0.2, 1.5, 4]) expect(colourVerdictText(d, t)).not.toMatch(/\b(Match|Close|Different)\b/);
  });
});

describe("prep steps", () => {
  it("plastic needs the adhesion promoter (common practice), steel does not", () => {
    expect(prepStepsFor("plastic")).toEqual(["scuff", "clean", "tack", "adhesionPromoter"]);
    expect(prepStepsFor("steel")).toEqual(["scuff", "clean", "tack"]);
    const none = { scuffMedium: null, scuffGrit: null, cleaner: null, tackCloth: false, adhesionPromoter: false };
    expect(missingPrepSteps("plastic", none)).toEqual(["scuff", "clean", "tack", "adhesionPromoter"]);
    expect(missingPrepSteps("steel", { ...none, scuffMedium: "scuff_pad", cleaner: "Wax remover", tackCloth: true })).toEqual([]);
  });
});

describe("temperature units", () => {
  it("°F ↔ °C by the exact definition (°C = (°F − 32) × 5/9)", () => {
    expect(fToC(212)).toBe(100);
    expect(fToC(32)).toBe(0);
    expect(fToC(72)).toBeCloseTo(22.2222, 4);
    expect(cToF(21)).toBeCloseTo(69.8, 10);
  });
});
