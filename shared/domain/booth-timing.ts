import { coatTiming, type BoothLayerTiming, type EffectiveCoat } from "./booth";

/**
 * The booth's timing rules, pure so the server refuses and the card warns from the same figures. A coat that goes
 * on against one of them is refused unless the painter gives a reason, which is kept on the coat's record.
 * Times are epoch milliseconds.
 */

export const TIMING_RULES = ["flash", "dry", "recoat_window", "induction", "no_batch"] as const;
export type TimingRule = (typeof TIMING_RULES)[number];

export const TIMING_RULE_LABELS: Record<TimingRule, string> = {
  flash: "Flash time",
  dry: "Dry time",
  recoat_window: "Recoat window",
  induction: "Induction time",
  no_batch: "No batch recorded",
};

/** A sprayed layer with what the timing rules need. */
export type TimingLayer = BoothLayerTiming & {
  name: string;
  /** How long a mixed batch stands before it is sprayed, minutes (null or 0: none). */
  inductionMinutes: number | null;
  /** The window for the next layer over this one, minutes after this layer's last coat (null: no limit). */
  recoatMinMinutes: number | null;
  recoatMaxMinutes: number | null;
  /** The mix has a hardener (2K): a coat needs a batch recorded as mixed. */
  catalysed: boolean;
};

/** Material data-sheet timing figures. */
export type MaterialTiming = { inductionMinutes: number | null; recoatMinMinutes: number | null; recoatMaxMinutes: number | null };

/**
 * A layer's timing taken from its materials' data sheets: the longest induction, the latest window opening and the
 * earliest window closing (the window every material of the mix allows).
 */
export function layerTimingDefaults(materials: readonly MaterialTiming[]): MaterialTiming {
  const pick = (values: (number | null)[], f: (...n: number[]) => number) => {
    const known = values.filter((v): v is number => v != null);
    return known.length ? f(...known) : null;
  };
  return {
    inductionMinutes: pick(
      materials.map((m) => m.inductionMinutes),
      Math.max,
    ),
    recoatMinMinutes: pick(
      materials.map((m) => m.recoatMinMinutes),
      Math.max,
    ),
    recoatMaxMinutes: pick(
      materials.map((m) => m.recoatMaxMinutes),
      Math.min,
    ),
  };
}

/** The windows that govern the next coat: when each opens or closes (null: no such limit now). */
export type CoatWindows = {
  /** Next coat of the same layer: when the last coat's flash is over. */
  flashEndsAt: number | null;
  /** A layer's first coat: when the previous layer is dry (its dry time or its minimum recoat time, the later). */
  dryEndsAt: number | null;
  /** A layer's first coat: when the previous layer's recoat window closes. */
  recoatClosesAt: number | null;
  /** The open batch: when its induction time is over. */
  inductionEndsAt: number | null;
  /** A catalysed layer with no batch recorded as mixed. */
  needsBatch: boolean;
};

const MIN = 60_000;

/**
 * The windows for coat `coat` of `layers[layerIndex]`, from the coats that count (in time order) and the batch
 * recorded as mixed for that layer (null when none).
 */
export function coatWindows(layers: readonly TimingLayer[], coats: readonly EffectiveCoat[], layerIndex: number, coat: number, batch: { mixedAt: number } | null): CoatWindows {
  const layer = layers[layerIndex]!;
  const lastOf = (id: number) => coats.reduce<number | null>((at, c) => (c.layerId === id && (at == null || c.at > at) ? c.at : at), null);
  const w: CoatWindows = { flashEndsAt: null, dryEndsAt: null, recoatClosesAt: null, inductionEndsAt: null, needsBatch: layer.catalysed && batch == null };
  if (coat > 1) {
    const last = lastOf(layer.id);
    if (last != null) w.flashEndsAt = coatTiming(layer, last).flashEndsAt;
  } else if (layerIndex > 0) {
    const prev = layers[layerIndex - 1]!;
    const last = lastOf(prev.id);
    if (last != null) {
      w.dryEndsAt = Math.max(coatTiming(prev, last).nextLayerAt, last + Math.max(0, prev.recoatMinMinutes ?? 0) * MIN);
      if (prev.recoatMaxMinutes != null && prev.recoatMaxMinutes > 0) w.recoatClosesAt = last + prev.recoatMaxMinutes * MIN;
    }
  }
  if (batch && layer.inductionMinutes != null && layer.inductionMinutes > 0) w.inductionEndsAt = batch.mixedAt + layer.inductionMinutes * MIN;
  return w;
}

/** A span of minutes in words: "6 min", "2 h", "1 h 5 min", "3 d 2 h". */
export function spanInWords(ms: number): string {
  const minutes = Math.max(1, Math.ceil(ms / MIN));
  if (minutes < 60) return `${minutes} min`;
  const days = Math.floor(minutes / 1440);
  const hours = Math.floor((minutes % 1440) / 60);
  const rest = minutes % 60;
  if (days > 0) return [`${days} d`, hours ? `${hours} h` : ""].filter(Boolean).join(" ");
  return [`${hours} h`, rest ? `${rest} min` : ""].filter(Boolean).join(" ");
}

export type TimingBreach = { rule: TimingRule; message: string };

/** The rules a coat at `now` would break, each with what it means for the painter. Empty when the coat may go on. */
export function timingBreaches(layers: readonly TimingLayer[], layerIndex: number, w: CoatWindows, now: number): TimingBreach[] {
  const layer = layers[layerIndex]!;
  const prev = layerIndex > 0 ? layers[layerIndex - 1] : undefined;
  const out: TimingBreach[] = [];
  if (w.flashEndsAt != null && now < w.flashEndsAt)
    out.push({ rule: "flash", message: `Flash time: the last coat of ${layer.name} needs ${spanInWords(w.flashEndsAt - now)} more to flash` });
  if (w.dryEndsAt != null && now < w.dryEndsAt && prev)
    out.push({ rule: "dry", message: `Dry time: ${prev.name} needs ${spanInWords(w.dryEndsAt - now)} more before ${layer.name} goes on` });
  if (w.recoatClosesAt != null && now > w.recoatClosesAt && prev)
    out.push({
      rule: "recoat_window",
      message: `Recoat window: ${prev.name} had to be recoated within ${spanInWords((prev.recoatMaxMinutes ?? 0) * MIN)}; the window closed ${spanInWords(now - w.recoatClosesAt)} ago (see its data sheet: it may need scuffing first)`,
    });
  if (w.inductionEndsAt != null && now < w.inductionEndsAt)
    out.push({ rule: "induction", message: `Induction time: the batch of ${layer.name} must stand ${spanInWords(w.inductionEndsAt - now)} more before spraying` });
  if (w.needsBatch) out.push({ rule: "no_batch", message: `No batch recorded: ${layer.name} is catalysed (2K); record the batch on its mix sheet first` });
  return out;
}
