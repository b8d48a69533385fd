import type { BoothDto } from "../schemas/booth.schema";
import { timingBreaches, type CoatWindows, type TimingBreach } from "./booth-timing";

const ms = (iso: string | null) => (iso == null ? null : Date.parse(iso));

/** The next coat's windows as times, from the booth card. */
export function cardWindows(next: Extract<BoothDto["next"], { state: "spray" }>): CoatWindows {
  const w = next.windows;
  return { flashEndsAt: ms(w.flashEndsAt), dryEndsAt: ms(w.dryEndsAt), recoatClosesAt: ms(w.recoatClosesAt), inductionEndsAt: ms(w.inductionEndsAt), needsBatch: w.needsBatch };
}

/**
 * The timing rules a coat made at `at` would break, from the booth card alone: the tablet warns with it as the clock
 * runs, and the server checks a coat against the time it was made (an entry queued offline keeps its own time).
 */
export function cardBreaches(card: BoothDto, at: number): TimingBreach[] {
  const next = card.next;
  if (next.state !== "spray") return [];
  const layers = card.layers.filter((l) => !l.isPrep);
  const index = layers.findIndex((l) => l.id === next.layerId);
  if (index < 0) return next.breaches;
  return timingBreaches(layers, index, cardWindows(next), at);
}
