import { requireCount, requireDate, requireNonNegative, requirePositive } from "./errors";

const MS_PER_MINUTE = 60_000;

/** `at` plus `minutes`, to the nearest millisecond (a Date holds whole milliseconds). */
function addMinutes(at: Date, minutes: number): Date {
  return new Date(at.getTime() + Math.round(minutes * MS_PER_MINUTE));
}

/** When a batch mixed at `mixedAt` reaches the end of its pot life. */
export function potLifeEnds(mixedAt: Date, potLifeMinutes: number): Date {
  requireDate(mixedAt, "mixedAt");
  return addMinutes(mixedAt, requirePositive(potLifeMinutes, "potLifeMinutes"));
}

export interface LayerPlan {
  /** Number of coats in the layer (whole number ≥ 1). */
  coats: number;
  /** Flash time between one coat's end and the next coat's start, minutes (≥ 0). */
  flashMinutes: number;
  /** Time to spray one coat, minutes (> 0). */
  minutesPerCoat: number;
  /** Time from the end of the last coat until the next layer may go on, minutes (≥ 0). */
  dryMinutes: number;
}

export interface CoatSlot {
  /** 1-based coat number. */
  coat: number;
  startsAt: Date;
  endsAt: Date;
  /** End of this coat's flash: when the next coat may start (for the last coat, the layer's dry period starts at endsAt instead). */
  flashEndsAt: Date;
}

export interface LayerTimeline {
  coats: CoatSlot[];
  /** End of the last coat. */
  lastCoatEndsAt: Date;
  /** When the next layer may go on: last coat's end + dryMinutes. */
  nextLayerAt: Date;
}

/**
 * Plans one layer: each coat lasts minutesPerCoat, the next coat starts when the previous coat's
 * flash ends (so coat i starts at start + (i − 1) × (minutesPerCoat + flashMinutes)), and the next
 * layer may go on dryMinutes after the last coat ends.
 */
export function layerTimeline(plan: LayerPlan, startAt: Date): LayerTimeline {
  requireDate(startAt, "startAt");
  const coats = requireCount(plan.coats, "coats");
  const flash = requireNonNegative(plan.flashMinutes, "flashMinutes");
  const spray = requirePositive(plan.minutesPerCoat, "minutesPerCoat");
  const dry = requireNonNegative(plan.dryMinutes, "dryMinutes");

  const slots: CoatSlot[] = [];
  let startsAt = startAt;
  for (let i = 0; i < coats; i++) {
    const endsAt = addMinutes(startsAt, spray);
    const flashEndsAt = addMinutes(endsAt, flash);
    slots.push({ coat: i + 1, startsAt, endsAt, flashEndsAt });
    startsAt = flashEndsAt;
  }
  const lastCoatEndsAt = slots[slots.length - 1]!.endsAt;
  return { coats: slots, lastCoatEndsAt, nextLayerAt: addMinutes(lastCoatEndsAt, dry) };
}
