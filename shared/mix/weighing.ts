import { MixError } from "./errors";
import type { MixComponent, MixLine } from "./mix";
import { roundForMeasuring, type MeasuringResult } from "./rounding";
import { isMassUnit, type MassUnit } from "./units";

/** A bench scale's usual resolution when the sheet names none (common practice: 0.1 g scales). */
export const DEFAULT_SCALE_STEP_G = 0.1;

export interface ScaleTarget {
  name: string;
  /** Exact weight, in `unit`. */
  exact: number;
  /** What to pour after taring: a whole number of scale steps (the rounded amount shown). */
  target: number;
  /** What the scale reads once this component is in, poured into one cup without taring in between:
   *  the sum of the targets so far, so the last reading is exactly the stated total. */
  scaleReads: number;
  unit: MassUnit;
}

export interface WeighingPlan {
  steps: ScaleTarget[];
  unit: MassUnit;
  step: number;
  /** Σ targets = the last scale reading. */
  total: number;
  rounded: MeasuringResult;
}

/**
 * Scale targets for weighing a mix: every component is rounded to the scale's step with the rounding rules
 * (ratio first, never less than asked), and the running readings are sums of those rounded targets, so the
 * figures on the sheet always add up to the total it states.
 */
export function weighingPlan(
  lines: readonly MixLine[],
  options: { unit?: MassUnit; step?: number; components?: readonly MixComponent[]; keep?: readonly string[]; tolerancePct?: number } = {},
): WeighingPlan {
  const unit = options.unit ?? "g";
  if (!isMassUnit(unit)) throw new MixError(`unit: ${JSON.stringify(unit)} is not a unit a scale shows`, { field: "unit" });
  const step = options.step ?? DEFAULT_SCALE_STEP_G;
  const rounded = roundForMeasuring(lines, step, unit, { components: options.components, keep: options.keep, tolerancePct: options.tolerancePct });
  let units = 0;
  const steps = rounded.lines.map((l) => {
    units += Math.round(l.rounded / step);
    return { name: l.name, exact: l.exact, target: l.rounded, scaleReads: tidy(units * step, step), unit };
  });
  return { steps, unit, step, total: tidy(units * step, step), rounded };
}

/** A multiple of `step` printed without float noise (0.1 × 3 → 0.3). */
function tidy(value: number, step: number): number {
  for (let d = 0; d <= 12; d++) {
    const scaled = step * 10 ** d;
    if (Math.abs(scaled - Math.round(scaled)) <= 1e-9 * Math.max(1, scaled)) return Number(value.toFixed(d));
  }
  return value;
}
