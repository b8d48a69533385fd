import { describe, expect, it } from "vitest";
import { coatWindows, layerTimingDefaults, spanInWords, timingBreaches, type TimingLayer } from "../../shared/domain/booth-timing";

const MIN = 60_000;
const T = Date.parse("2030-01-01T08:00:00Z");
const layer = (id: number, extra: Partial<TimingLayer> = {}): TimingLayer => ({
  id,
  name: `L${id}`,
  coats: 2,
  flashMinutes: 10,
  minutesPerCoat: 4,
  dryMinutes: 30,
  inductionMinutes: null,
  recoatMinMinutes: null,
  recoatMaxMinutes: null,
  catalysed: false,
  ...extra,
});
const coat = (id: number, layerId: number, at: number) => ({ id, layerId, coatNumber: 1, at, correctedBy: null });

describe("layerTimingDefaults", () => {
  it("takes the longest induction, the latest opening and the earliest closing; unknown figures are skipped", () => {
    expect(
      layerTimingDefaults([
        { inductionMinutes: 10, recoatMinMinutes: 30, recoatMaxMinutes: 4320 },
        { inductionMinutes: null, recoatMinMinutes: 15, recoatMaxMinutes: 1440 },
        { inductionMinutes: 20, recoatMinMinutes: null, recoatMaxMinutes: null },
      ]),
    ).toEqual({ inductionMinutes: 20, recoatMinMinutes: 30, recoatMaxMinutes: 1440 });
    expect(layerTimingDefaults([])).toEqual({ inductionMinutes: null, recoatMinMinutes: null, recoatMaxMinutes: null });
  });
});

describe("coatWindows and timingBreaches", () => {
  it("a second coat waits for the flash; a first coat for the dry time or the minimum recoat, whichever is later", () => {
    const layers = [layer(1, { recoatMinMinutes: 45, recoatMaxMinutes: 120 }), layer(2)];
    const w2 = coatWindows(layers, [coat(1, 1, T)], 0, 2, null);
    expect(w2).toMatchObject({ flashEndsAt: T + 10 * MIN, dryEndsAt: null, recoatClosesAt: null });
    const w = coatWindows(layers, [coat(1, 1, T), coat(2, 1, T + 20 * MIN)], 1, 1, null);
    expect(w).toMatchObject({ flashEndsAt: null, dryEndsAt: T + 65 * MIN, recoatClosesAt: T + 140 * MIN });
    expect(timingBreaches(layers, 1, w, T + 64 * MIN).map((b) => b.rule)).toEqual(["dry"]);
    expect(timingBreaches(layers, 1, w, T + 65 * MIN)).toEqual([]);
    expect(timingBreaches(layers, 1, w, T + 140 * MIN)).toEqual([]);
    expect(timingBreaches(layers, 1, w, T + 140 * MIN + 1).map((b) => b.rule)).toEqual(["recoat_window"]);
  });

  it("a catalysed layer needs a batch, and the batch its induction time", () => {
    const layers = [layer(1, { catalysed: true, inductionMinutes: 15 })];
    expect(timingBreaches(layers, 0, coatWindows(layers, [], 0, 1, null), T).map((b) => b.rule)).toEqual(["no_batch"]);
    const w = coatWindows(layers, [], 0, 1, { mixedAt: T });
    expect(w.inductionEndsAt).toBe(T + 15 * MIN);
    expect(timingBreaches(layers, 0, w, T + 14 * MIN).map((b) => b.rule)).toEqual(["induction"]);
    expect(timingBreaches(layers, 0, w, T + 15 * MIN)).toEqual([]);
  });
});

describe("spanInWords", () => {
  it("rounds up to whole minutes and writes hours and days", () => {
    expect(spanInWords(11_000)).toBe("1 min");
    expect(spanInWords(9 * MIN + 49_000)).toBe("10 min");
    expect(spanInWords(60 * MIN)).toBe("1 h");
    expect(spanInWords(65 * MIN)).toBe("1 h 5 min");
    expect(spanInWords(3 * 1440 * MIN + 2 * 60 * MIN)).toBe("3 d 2 h");
  });
});
