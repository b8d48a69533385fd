import { MixError, requirePositive } from "./errors";
import type { MixComponent, MixLine } from "./mix";
import { convertMass, convertVolume, isMassUnit, isVolumeUnit, type MassUnit, type VolumeUnit } from "./units";

/*
 * Rounding a computed mix to what a mixing cup or a scale can show.
 *
 * Every amount is rounded down or up to a whole number of `step` (never further) and never to zero.
 * Among those choices, in this order of importance:
 *  1. the batch is not smaller than asked (unless `allowUnder`): Σ rounded ≥ Σ exact;
 *  2. the ratio between the parts components (paint : hardener, as in 4:1:1 or 2:1) stays as close as
 *     the step allows: the largest "ratio move" over the parts components (and any named in `keep`);
 *  3. the largest ratio move over every component (a percent component against what it is a percent of);
 *  4. the rounded total closest to the exact total, then the smallest summed amount error.
 *
 * A component's ratio move is how far, in %, its ratio to its reference moves:
 *  - a parts component against the base (the parts component with the most parts, first on a tie):
 *      |(r_i / r_base) / (e_i / e_base) − 1|;
 *  - a percent component against the sum of the components it is a percent of:
 *      |(r_i / Σ r_of) / (e_i / Σ e_of) − 1|;
 *  - the base itself moves 0 (the others are measured against it).
 * Every component moved beyond `tolerancePct` is named in `moved`, so the sheet can warn about each.
 *
 * The choices are enumerated exactly (2^f for f components that are not already whole steps; a mix
 * has at most 12 components), so the result is the true best under the order above.
 */

export type MeasuringUnit = VolumeUnit | MassUnit;

/** Default tolerance for naming a component whose ratio moves (a shop setting overrides it; common practice). */
export const DEFAULT_RATIO_TOLERANCE_PCT = 2;

export interface RoundingOptions {
  /** The mix as written, to measure each ratio against its own reference; without it every line counts as parts. */
  components?: readonly MixComponent[];
  /** Names whose ratio is kept first besides the parts components (e.g. a hardener given as a percent). */
  keep?: readonly string[];
  /** A move beyond this (in %) is named in `moved`. */
  tolerancePct?: number;
  /** Allow a rounded batch smaller than asked. */
  allowUnder?: boolean;
}

export interface RoundedLine {
  name: string;
  /** Exact amount in `unit`. */
  exact: number;
  /** Amount to measure: a whole number of steps, never zero. */
  rounded: number;
  unit: MeasuringUnit;
  exactShare: number;
  roundedShare: number;
  /** What this component's ratio is measured against: the base's name, or the names it is a percent of. */
  reference: string[];
  /** How far its ratio to `reference` moves, in % (0 for the base). */
  ratioErrorPct: number;
}

export interface MeasuringResult {
  lines: RoundedLine[];
  step: number;
  unit: MeasuringUnit;
  /** Largest ratioErrorPct over the components. */
  worstRatioErrorPct: number;
  /** Component with the largest ratio move. */
  worstComponent: string;
  /** Every component whose ratio moved beyond `tolerancePct`, worst first. */
  moved: string[];
  tolerancePct: number;
  /** Components below half a step, which would have rounded to zero and were set to one step. */
  raisedFromZero: string[];
  exactTotal: number;
  roundedTotal: number;
}

/** Decimals needed to print multiples of `step` cleanly (e.g. 0.125 → 3), or undefined if none ≤ 12. */
function stepDecimals(step: number): number | undefined {
  for (let d = 0; d <= 12; d++) {
    const scaled = step * 10 ** d;
    if (Math.abs(scaled - Math.round(scaled)) <= 1e-9 * Math.max(1, scaled)) return d;
  }
  return undefined;
}

function exactAmount(line: MixLine, unit: MeasuringUnit): number {
  if (isVolumeUnit(unit)) return convertVolume(line.volume, line.unit, unit);
  if (line.grams === undefined) {
    throw new MixError(`Component "${line.name}": has no density, so it cannot be weighed`, {
      component: line.name,
      field: "densityGPerMl",
    });
  }
  return convertMass(line.grams, "g", unit);
}

/** For each line: the indexes of its reference, and whether its ratio is kept first. */
function references(lines: readonly MixLine[], exact: number[], options: RoundingOptions): { ref: number[][]; key: boolean[] } {
  const index = new Map(lines.map((l, i) => [l.name, i]));
  const byName = new Map((options.components ?? []).map((c) => [c.name, c]));
  const percentOf = (name: string): string[] | null => {
    const c = byName.get(name);
    if (c === undefined || !("percentOf" in c) || c.percentOf === undefined) return null;
    return typeof c.percentOf === "string" ? [c.percentOf] : [...c.percentOf];
  };
  const parts = lines.map((l, i) => i).filter((i) => percentOf(lines[i]!.name) === null);
  const base = parts.reduce((b, i) => (exact[i]! > exact[b]! ? i : b), parts[0] ?? 0);
  const keep = new Set(options.keep ?? []);
  const ref = lines.map((l, i) => {
    const of = percentOf(l.name);
    if (of === null) return i === base ? [] : [base];
    return of.map((n) => index.get(n)).filter((j): j is number => j !== undefined);
  });
  const key = lines.map((l) => percentOf(l.name) === null || keep.has(l.name));
  return { ref, key };
}

/** Rounds mix lines to multiples of `step` in `unit` (a volume unit, or a mass unit to weigh). */
export function roundForMeasuring(
  lines: readonly MixLine[],
  step: number,
  unit: MeasuringUnit,
  options: RoundingOptions = {},
): MeasuringResult {
  if (!Array.isArray(lines) || lines.length === 0) {
    throw new MixError("lines: nothing to round", { field: "lines" });
  }
  requirePositive(step, "step");
  if (!isVolumeUnit(unit) && !isMassUnit(unit)) {
    throw new MixError(`unit: unknown unit ${JSON.stringify(unit)}`, { field: "unit" });
  }
  const tolerancePct = options.tolerancePct ?? DEFAULT_RATIO_TOLERANCE_PCT;
  if (!(tolerancePct >= 0) || !Number.isFinite(tolerancePct)) {
    throw new MixError("tolerancePct: must be 0 or more", { field: "tolerancePct" });
  }

  const exact = lines.map((line) => requirePositive(exactAmount(line, unit), "amount", line.name));
  const exactTotal = exact.reduce((a, b) => a + b, 0);
  const { ref, key } = references(lines, exact, options);

  // Candidates in whole steps; values within float noise of a whole step are snapped.
  const raisedFromZero: string[] = [];
  const low: number[] = [];
  const high: number[] = [];
  exact.forEach((e, i) => {
    let q = e / step;
    if (Math.abs(q - Math.round(q)) <= 1e-9 * Math.max(1, q)) q = Math.round(q);
    if (q < 0.5) raisedFromZero.push(lines[i]!.name);
    low.push(Math.max(1, Math.floor(q)));
    high.push(Math.max(1, Math.ceil(q)));
  });
  const free = low.map((_, i) => i).filter((i) => high[i]! > low[i]!);
  const exactUnits = exactTotal / step;
  const refExact = ref.map((r) => r.reduce((a, j) => a + exact[j]!, 0));

  const moves = (units: number[]): number[] =>
    units.map((u, i) => {
      if (ref[i]!.length === 0) return 0;
      const refUnits = ref[i]!.reduce((a, j) => a + units[j]!, 0);
      return Math.abs(u / refUnits / (exact[i]! / refExact[i]!) - 1) * 100;
    });

  type Score = [number, number, number, number];
  let best: { units: number[]; score: Score } | undefined;
  const better = (a: Score, b: Score): boolean => {
    for (let k = 0; k < a.length; k++) {
      const tol = 1e-9 * Math.max(1, Math.abs(b[k]!));
      if (a[k]! < b[k]! - tol) return true;
      if (a[k]! > b[k]! + tol) return false;
    }
    return false;
  };
  const units = [...low];
  for (let mask = 0; mask < 2 ** free.length; mask++) {
    free.forEach((i, bit) => (units[i] = mask & (1 << bit) ? high[i]! : low[i]!));
    const total = units.reduce((a, b) => a + b, 0);
    if (!options.allowUnder && total < exactUnits - 1e-9 * Math.max(1, exactUnits)) continue;
    const m = moves(units);
    const score: Score = [
      Math.max(0, ...m.filter((_, i) => key[i])),
      Math.max(...m),
      Math.abs(total - exactUnits),
      units.reduce((a, u, i) => a + Math.abs(u * step - exact[i]!), 0),
    ];
    if (best === undefined || better(score, best.score)) best = { units: [...units], score };
  }

  const chosen = best!.units;
  const roundedUnits = chosen.reduce((a, b) => a + b, 0);
  const decimals = stepDecimals(step);
  const tidy = (v: number): number => (decimals === undefined ? v : Number(v.toFixed(decimals)));
  const m = moves(chosen);
  const out: RoundedLine[] = lines.map((line, i) => ({
    name: line.name,
    exact: exact[i]!,
    rounded: tidy(chosen[i]! * step),
    unit,
    exactShare: exact[i]! / exactTotal,
    roundedShare: chosen[i]! / roundedUnits,
    reference: ref[i]!.map((j) => lines[j]!.name),
    ratioErrorPct: m[i]!,
  }));
  const worst = out.reduce((w, l) => (l.ratioErrorPct > w.ratioErrorPct ? l : w), out[0]!);
  const moved = out
    .filter((l) => l.ratioErrorPct > tolerancePct)
    .sort((a, b) => b.ratioErrorPct - a.ratioErrorPct)
    .map((l) => l.name);
  return {
    lines: out,
    step,
    unit,
    worstRatioErrorPct: worst.ratioErrorPct,
    worstComponent: worst.name,
    moved,
    tolerancePct,
    raisedFromZero,
    exactTotal,
    roundedTotal: tidy(roundedUnits * step),
  };
}
