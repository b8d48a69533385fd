import { MixError } from "./errors";
import { mixForTotal, mixFromComponent, scaleTargets, type MixComponent, type MixLine, type ScaleTarget } from "./mix";
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
  /** Cumulative scale targets, when every component has a density. */
  scale: ScaleTarget[] | null;
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
  const scale = lines.every((l) => l.grams !== undefined) ? scaleTargets(lines) : null;
  const r = req.rounding;
  const rounded = r
    ? roundForMeasuring(lines, r.step, r.unit, { components: req.components, tolerancePct: r.tolerancePct, keep: r.keep, allowUnder: r.allowUnder })
    : null;
  return { lines, total, unit: req.unit, scale, rounded };
}
