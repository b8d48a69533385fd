import { HttpError } from "../../http/http-error";
import { isoOrNull } from "../../http/dates";
import type { LoadedLayer } from "../plans/plans.service";
import type { EffectiveCoat } from "../../../shared/domain/booth";
import { coatWindows, timingBreaches, TIMING_RULE_LABELS, type TimingBreach, type TimingLayer } from "../../../shared/domain/booth-timing";
import type { BoothDto, CoatWindowsDto } from "../../../shared/schemas/booth.schema";
import { cardBreaches } from "../../../shared/domain/booth-card-timing";


/**
 * The next coat's timing windows and the rules a coat now would break, from what the booth card already loaded
 * (the job's coats in one query, its batches in another): checking the rules costs no query of its own.
 */
export function nextCoatTiming(
  sprayLayers: readonly LoadedLayer[],
  coats: readonly EffectiveCoat[],
  layerIndex: number,
  coat: number,
  batchMixedAt: string | null,
  now: number,
): { windows: CoatWindowsDto; breaches: TimingBreach[] } {
  const layers: readonly TimingLayer[] = sprayLayers; // a loaded layer carries every figure the rules read
  const w = coatWindows(layers, coats, layerIndex, coat, batchMixedAt ? { mixedAt: Date.parse(batchMixedAt) } : null);
  return {
    windows: {
      flashEndsAt: isoOrNull(w.flashEndsAt),
      dryEndsAt: isoOrNull(w.dryEndsAt),
      recoatClosesAt: isoOrNull(w.recoatClosesAt),
      inductionEndsAt: isoOrNull(w.inductionEndsAt),
      needsBatch: w.needsBatch,
    },
    breaches: timingBreaches(layers, layerIndex, w, now),
  };
}

/**
 * A coat against a timing rule is refused (409, naming each rule) unless the painter gives a reason; with one, the
 * reason and the rules as they stood go on the coat's record. The rules are checked at the time the coat was made
 * (`at`: now, or the time an entry queued offline was made). Returns null when no rule is broken.
 */
export function timingOverride(card: BoothDto, at: number, reason: string | null | undefined): { reason: string; breaches: TimingBreach[] } | null {
  const breaches = cardBreaches(card, at);
  if (breaches.length === 0) return null;
  if (!reason) {
    const rules = breaches.map((b) => TIMING_RULE_LABELS[b.rule].toLowerCase()).join(", ");
    throw new HttpError(
      409,
      "conflict",
      `Not logged: ${breaches.map((b) => b.message).join(". ")}. Wait, or give a reason to go ahead (it is kept on the record).`,
      { timingOverrideReason: `Give a reason to spray against the ${rules} rule` },
      { rules: breaches.map((b) => b.rule), breaches },
    );
  }
  return { reason, breaches };
}
