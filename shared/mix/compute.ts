import { MixError } from "./errors";
import { mixForTotal, mixFromComponent, type MixComponent, type MixLine } from "./mix";
import { weighingPlan, type WeighingPlan } from "./weighing";
import { isMassUnit } from "./units";
import { roundForMeasuring, type MeasuringResult, type MeasuringUnit } from "./rounding";
import type { VolumeUnit } from "./units";

/** What the Mix calculator asks: a mix in the painter's terms, how much to make, and how it will be measured. */
export type MixRequest = {
  components: MixComponent[];
  /** "total": make `amount` of ready-to-spray mix; "component": `amount` of `knownName` is on hand. */
  mode: "total" | "component";
  amount: number;
  unit: VolumeUnit;
  knownName?: string;
  /** Round for a mixing cup (volume unit) or a scale (mass unit); name ratio moves beyond `tolerancePct`. */
  rounding?: { step: number; unit: MeasuringUnit; tolerancePct?: number; keep?: string[]; allowUnder?: boolean };
};

export type MixResult = {
  lines: MixLine[];
  total: number;
  unit: VolumeUnit;
  /** Scale targets (rounded to the scale step, readings summed from them), when every component has a density. */
  scale: WeighingPlan | null;
  rounded: MeasuringResult | null;
};

/** One function used by the browser (live) and by POST /api/mix/compute, so both give the same answer. */
export function computeMix(req: MixRequest): MixResult {
  let lines: MixLine[];
  if (req.mode === "component") {
    if (!req.knownName) throw new MixError("Name the component you have on hand", { field: "knownName" });
    lines = mixFromComponent(req.components, req.knownName, req.amount, req.unit);
  } else {
    lines = mixForTotal(req.components, req.amount, req.unit);
  }
  const total = lines.reduce((sum, l) => sum + l.volume, 0);
  const r = req.rounding;
  const scale = lines.every((l) => l.grams !== undefined)
    ? weighingPlan(lines, {
        ...(r && isMassUnit(r.unit) ? { unit: r.unit, step: r.step } : {}),
        components: req.components,
        keep: r?.keep,
        tolerancePct: r?.tolerancePct,
      })
    : null;
  const rounded = r
    ? roundForMeasuring(lines, r.step, r.unit, { components: req.components, tolerancePct: r.tolerancePct, keep: r.keep, allowUnder: r.allowUnder })
    : null;
  return { lines, total, unit: req.unit, scale, rounded };
}
