import { MixError, requirePositive } from "./errors";
import type { MixLine } from "./mix";
import { convertMass, convertVolume, isMassUnit, isVolumeUnit, type MassUnit, type VolumeUnit } from "./units";

/*
 * Rounding a computed mix to what a mixing cup or a scale can show.
 *
 * Meaning: every amount is rounded either down or up to a whole number of `step` (never further),
 * and never to zero. Among those choices we pick the one whose rounded ratio is closest to the exact
 * ratio, measured by the worst relative share error
 *     worst = max_i |roundedShare_i − exactShare_i| / exactShare_i,
 * where share_i = amount_i / Σ amounts. Ties go to the rounded total closest to the exact total,
 * then to the smallest summed amount error.
 *
 * Algorithm (exact, no guessing, O(n³) for n components):
 *  1. In step units, q_i = exact_i / step; candidates are floor(q_i) and ceil(q_i) (one candidate
 *     when q_i is a whole number; only ceil when floor would be 0).
 *  2. Let k be how many components are rounded up. For a fixed k the rounded total T is fixed, so
 *     each component's error for "down" and for "up" is known independently of the others.
 *  3. For that k, the smallest achievable worst error is the smallest threshold t (taken from the
 *     candidate errors) for which: every component has a choice with error ≤ t, the components that
 *     can only go up number ≤ k, and the components that may go up number ≥ k. Assign the forced
 *     ups, then the remaining ups to the components that the up choice suits best.
 *  4. Keep the best k.
 */

export type MeasuringUnit = VolumeUnit | MassUnit;

export interface RoundedLine {
  name: string;
  /** Exact amount in `unit`. */
  exact: number;
  /** Amount to measure: a whole number of steps, never zero. */
  rounded: number;
  unit: MeasuringUnit;
  exactShare: number;
  roundedShare: number;
  /** |roundedShare − exactShare| / exactShare × 100. */
  ratioErrorPct: number;
}

export interface MeasuringResult {
  lines: RoundedLine[];
  step: number;
  unit: MeasuringUnit;
  /** Largest ratioErrorPct over the components: what the screen should warn about. */
  worstRatioErrorPct: number;
  /** Component with the largest ratio error. */
  worstComponent: string;
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

interface Choice {
  units: number[];
  worst: number;
  totalGap: number;
  sumGap: number;
}

/** Rounds mix lines to multiples of `step` in `unit` (a volume unit, or a mass unit to weigh). */
export function roundForMeasuring(lines: readonly MixLine[], step: number, unit: MeasuringUnit): MeasuringResult {
  if (!Array.isArray(lines) || lines.length === 0) {
    throw new MixError("lines: nothing to round", { field: "lines" });
  }
  requirePositive(step, "step");
  if (!isVolumeUnit(unit) && !isMassUnit(unit)) {
    throw new MixError(`unit: unknown unit ${JSON.stringify(unit)}`, { field: "unit" });
  }

  const exact = lines.map((line) => requirePositive(exactAmount(line, unit), "amount", line.name));
  const exactTotal = exact.reduce((a, b) => a + b, 0);
  const share = exact.map((e) => e / exactTotal);

  // Step 1: candidates in whole steps. Snap values within float noise of a whole step.
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
  const baseUnits = low.reduce((a, b) => a + b, 0);

  const error = (i: number, units: number, total: number): number => Math.abs(units / total - share[i]!) / share[i]!;

  let best: Choice | undefined;
  for (let k = 0; k <= free.length; k++) {
    const total = baseUnits + k;
    // Step 2: errors for down (ef) and up (ec) of each free component at this total.
    const ef = free.map((i) => error(i, low[i]!, total));
    const ec = free.map((i) => error(i, high[i]!, total));
    const fixedWorst = Math.max(0, ...low.map((u, i) => (high[i] === u ? error(i, u, total) : 0)));

    // Step 3: smallest feasible threshold.
    const thresholds = [fixedWorst, ...ef, ...ec].filter((t) => t >= fixedWorst).sort((a, b) => a - b);
    const threshold = thresholds.find((t) => {
      let mustUp = 0;
      let mayUp = 0;
      for (let j = 0; j < free.length; j++) {
        if (ef[j]! > t && ec[j]! > t) return false;
        if (ef[j]! > t) mustUp++;
        if (ec[j]! <= t) mayUp++;
      }
      return mustUp <= k && k <= mayUp;
    })!;
    const order = free
      .map((_, j) => j)
      .filter((j) => ef[j]! <= threshold && ec[j]! <= threshold)
      .sort((x, y) => ec[x]! - ef[x]! - (ec[y]! - ef[y]!));
    const up = new Set(free.filter((_, j) => ef[j]! > threshold));
    for (const j of order) {
      if (up.size >= k) break;
      up.add(free[j]!);
    }
    const units = low.map((u, i) => (up.has(i) ? high[i]! : u));

    const choice: Choice = {
      units,
      worst: Math.max(...units.map((u, i) => error(i, u, total))),
      totalGap: Math.abs(total * step - exactTotal),
      sumGap: units.reduce((a, u, i) => a + Math.abs(u * step - exact[i]!), 0),
    };
    // Step 4: keep the best (compare errors with a small tolerance so float noise does not decide).
    const better =
      best === undefined ||
      choice.worst < best.worst - 1e-12 ||
      (Math.abs(choice.worst - best.worst) <= 1e-12 &&
        (choice.totalGap < best.totalGap - 1e-12 ||
          (Math.abs(choice.totalGap - best.totalGap) <= 1e-12 && choice.sumGap < best.sumGap)));
    if (better) best = choice;
  }

  const { units } = best!;
  const roundedUnits = units.reduce((a, b) => a + b, 0);
  const decimals = stepDecimals(step);
  const tidy = (v: number): number => (decimals === undefined ? v : Number(v.toFixed(decimals)));
  const out: RoundedLine[] = lines.map((line, i) => {
    const roundedShare = units[i]! / roundedUnits;
    return {
      name: line.name,
      exact: exact[i]!,
      rounded: tidy(units[i]! * step),
      unit,
      exactShare: share[i]!,
      roundedShare,
      ratioErrorPct: (Math.abs(roundedShare - share[i]!) / share[i]!) * 100,
    };
  });
  const worst = out.reduce((w, l) => (l.ratioErrorPct > w.ratioErrorPct ? l : w), out[0]!);
  return {
    lines: out,
    step,
    unit,
    worstRatioErrorPct: worst.ratioErrorPct,
    worstComponent: worst.name,
    raisedFromZero,
    exactTotal,
    roundedTotal: tidy(roundedUnits * step),
  };
}
