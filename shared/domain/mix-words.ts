import { MixError, resolveShares } from "../mix/index";
import { toMixComponents } from "./layer-mix";

/** A layer component as every screen has it: its label in the mix, its material, parts or a percent of others. */
export type WordedComponent = {
  label: string;
  materialCode: string;
  materialName: string;
  parts: number | null;
  percent: number | null;
  percentOf: readonly string[] | null;
};

export type ComponentWords = {
  label: string;
  /** "S5-B02 Intercoat clear": components are named by material, since a label such as "clear" can mean two products. */
  material: string;
  /** "2 parts", or "10 % of S5-B02 Intercoat clear" (what the percent is of, by material, exactly as the plan gives it). */
  amount: string;
  /** Share of the ready-to-spray mix, in % (null when the mix does not resolve). */
  readyPct: number | null;
};

/** Up to `digits` decimals, without trailing zeros: 4.7619 → "4.76", 10 → "10". */
export function plainNumber(value: number, digits = 2): string {
  return String(Number(value.toFixed(digits)));
}

const materialOf = (c: WordedComponent) => `${c.materialCode} ${c.materialName}`.trim();

/** Each component in words: its material, what its amount is (and of what), and its share of the ready-to-spray mix. */
export function mixComponentWords(components: readonly WordedComponent[]): ComponentWords[] {
  const byLabel = new Map(components.map((c) => [c.label, c]));
  let shares: number[] | null = null;
  try {
    shares = resolveShares(toMixComponents(components)).map((s) => s.share);
  } catch (error) {
    if (!(error instanceof MixError)) throw error;
  }
  return components.map((c, i) => {
    const of = (c.percentOf ?? []).map((l) => (byLabel.has(l) ? materialOf(byLabel.get(l)!) : l));
    const amount = c.parts != null ? `${plainNumber(c.parts, 3)} ${c.parts === 1 ? "part" : "parts"}` : `${plainNumber(c.percent ?? 0)} % of ${of.join(" + ") || "the rest"}`;
    return { label: c.label, material: materialOf(c), amount, readyPct: shares ? shares[i]! * 100 : null };
  });
}

/**
 * The whole mix in one line, e.g.
 * "S5-B01 Intercoat clear 1 part, S6-B02 Reducer 1 part, S4-B04 Candy toner 10 % of S5-B01 Intercoat clear
 *  (ready to spray: 47.62 % / 47.62 % / 4.76 %)".
 */
export function mixSentence(components: readonly WordedComponent[]): string {
  if (components.length === 0) return "";
  const words = mixComponentWords(components);
  const list = words.map((w) => `${w.material} ${w.amount}`).join(", ");
  const ready = words.every((w) => w.readyPct !== null) ? ` (ready to spray: ${words.map((w) => `${plainNumber(w.readyPct!)} %`).join(" / ")})` : "";
  return list + ready;
}
