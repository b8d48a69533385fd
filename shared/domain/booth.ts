import { layerTimeline } from "../mix/index";

/**
 * The booth card's rules, pure so the server and tests compute the same thing: which coat entries still count
 * after corrections, and what the painter does next with which timer. Times are epoch milliseconds; nothing here
 * keeps state, so a reload computes the same timers from the stored times.
 */

export const TEMP_UNITS = ["C", "F"] as const;
export type TempUnit = (typeof TEMP_UNITS)[number];

/** °F → °C and back (exact linear definitions: °C = (°F − 32) × 5/9). */
export const fToC = (f: number) => ((f - 32) * 5) / 9;
export const cToF = (c: number) => (c * 9) / 5 + 32;
export const toCelsius = (value: number, unit: TempUnit) => (unit === "C" ? value : fToC(value));

/** One stored coat-log row: an original entry, or a correction of one (correctsId set). */
export type CoatEntry = {
  id: number;
  layerId: number;
  coatNumber: number;
  /** When the coat was sprayed (its end: the painter taps once the coat is on). */
  at: number;
  correctsId: number | null;
  voids: boolean;
};

/** An original entry as it stands after its corrections (the latest correction's values win). */
export type EffectiveCoat = { id: number; layerId: number; coatNumber: number; at: number; correctedBy: number | null };

export function effectiveCoats(entries: readonly CoatEntry[]): EffectiveCoat[] {
  const corrections = new Map<number, CoatEntry[]>();
  for (const e of entries) {
    if (e.correctsId != null) corrections.set(e.correctsId, [...(corrections.get(e.correctsId) ?? []), e]);
  }
  const out: EffectiveCoat[] = [];
  for (const e of entries) {
    if (e.correctsId != null) continue;
    const fixes = (corrections.get(e.id) ?? []).sort((a, b) => a.id - b.id);
    if (fixes.some((f) => f.voids)) continue;
    const latest = fixes[fixes.length - 1];
    out.push({ id: e.id, layerId: e.layerId, coatNumber: e.coatNumber, at: latest?.at ?? e.at, correctedBy: latest?.id ?? null });
  }
  return out.sort((a, b) => a.at - b.at || a.id - b.id);
}

export type BoothLayerTiming = {
  id: number;
  coats: number;
  flashMinutes: number;
  minutesPerCoat: number;
  dryMinutes: number;
};

/** Whole coats of a layer (a planned 2.5 means three passes, the last a light one). */
export const coatCount = (coats: number) => Math.max(1, Math.ceil(coats - 1e-9));

export type BoothTimer = {
  /** flash: waiting between coats of a layer; dry: waiting before the next layer. */
  kind: "flash" | "dry";
  startedAt: number;
  endsAt: number;
};

export type LayerProgress = { layerId: number; coatsDone: number; coats: number; status: "done" | "current" | "upcoming"; lastCoatAt: number | null };

export type NextStep =
  | { state: "no_layers"; layers: LayerProgress[] }
  | {
      state: "spray";
      layers: LayerProgress[];
      layerId: number;
      layerIndex: number;
      coat: number;
      of: number;
      isLastLayer: boolean;
      timer: BoothTimer | null;
      /** When the rest of this layer should be done if each coat goes on as soon as its flash ends. */
      layerDoneAt: number;
    }
  | { state: "done"; layers: LayerProgress[]; lastCoatAt: number; timer: BoothTimer };

/** Timing of one logged coat through the mix engine: its flash end and when the next layer may go on. */
export function coatTiming(layer: BoothLayerTiming, coatEndAt: number) {
  const minutesPerCoat = layer.minutesPerCoat > 0 ? layer.minutesPerCoat : 1;
  const plan = { coats: 1, flashMinutes: Math.max(0, layer.flashMinutes), minutesPerCoat, dryMinutes: Math.max(0, layer.dryMinutes) };
  const t = layerTimeline(plan, new Date(coatEndAt - Math.round(minutesPerCoat * 60_000)));
  return { flashEndsAt: t.coats[0]!.flashEndsAt.getTime(), nextLayerAt: t.nextLayerAt.getTime() };
}

/** What comes next on the booth card, from the plan's layers in order and the coats that count. */
export function nextBoothStep(layers: readonly BoothLayerTiming[], coats: readonly EffectiveCoat[], now: number): NextStep {
  const byLayer = new Map<number, EffectiveCoat[]>();
  for (const c of coats) byLayer.set(c.layerId, [...(byLayer.get(c.layerId) ?? []), c]);
  let currentIndex = -1;
  const progress: LayerProgress[] = layers.map((layer, i) => {
    const done = byLayer.get(layer.id) ?? [];
    const total = coatCount(layer.coats);
    const status = done.length >= total ? "done" : currentIndex === -1 ? ((currentIndex = i), "current") : "upcoming";
    const lastCoatAt = done.length ? Math.max(...done.map((c) => c.at)) : null;
    return { layerId: layer.id, coatsDone: Math.min(done.length, total), coats: total, status, lastCoatAt };
  });
  if (layers.length === 0) return { state: "no_layers", layers: progress };

  if (currentIndex === -1) {
    const last = layers[layers.length - 1]!;
    const lastAt = progress[progress.length - 1]!.lastCoatAt!;
    return { state: "done", layers: progress, lastCoatAt: lastAt, timer: { kind: "dry", startedAt: lastAt, endsAt: coatTiming(last, lastAt).nextLayerAt } };
  }

  const layer = layers[currentIndex]!;
  const p = progress[currentIndex]!;
  let timer: BoothTimer | null = null;
  if (p.lastCoatAt != null) {
    timer = { kind: "flash", startedAt: p.lastCoatAt, endsAt: coatTiming(layer, p.lastCoatAt).flashEndsAt };
  } else if (currentIndex > 0) {
    const prev = progress[currentIndex - 1]!;
    if (prev.lastCoatAt != null) timer = { kind: "dry", startedAt: prev.lastCoatAt, endsAt: coatTiming(layers[currentIndex - 1]!, prev.lastCoatAt).nextLayerAt };
  }
  const remaining = p.coats - p.coatsDone;
  const startAt = Math.max(now, timer?.endsAt ?? now);
  const minutesPerCoat = layer.minutesPerCoat > 0 ? layer.minutesPerCoat : 1;
  const rest = layerTimeline(
    { coats: remaining, flashMinutes: Math.max(0, layer.flashMinutes), minutesPerCoat, dryMinutes: Math.max(0, layer.dryMinutes) },
    new Date(startAt),
  );
  return {
    state: "spray",
    layers: progress,
    layerId: layer.id,
    layerIndex: currentIndex,
    coat: p.coatsDone + 1,
    of: p.coats,
    isLastLayer: currentIndex === layers.length - 1,
    timer,
    layerDoneAt: rest.lastCoatEndsAt.getTime(),
  };
}

/**
 * A temperature typed in a form, re-expressed when the unit switches: "21" °C → "70" °F. Booth thermometers read whole
 * degrees (common practice), so the result is rounded to one; text that is not a number is left as typed.
 */
export function switchTemperatureText(text: string, from: TempUnit, to: TempUnit): string {
  const value = Number(text.trim().replace(",", "."));
  if (from === to || text.trim() === "" || !Number.isFinite(value)) return text;
  return String(Math.round(to === "F" ? cToF(value) : fToC(value)));
}
