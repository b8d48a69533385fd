import type { LayerKind } from "./layers";
import { effectiveCoats, nextBoothStep, type CoatEntry, type LayerProgress } from "./booth";
import { coatWindows, timingBreaches, type TimingLayer } from "./booth-timing";
import type { BoothMixSheetDto, BoothNextDto, BoothDto } from "../schemas/booth.schema";

type Layer = TimingLayer & { kind: LayerKind };
const isoOrNull = (t: number | null) => (t == null ? null : new Date(t).toISOString());

const timerDto = (t: { kind: "flash" | "dry"; startedAt: number; endsAt: number } | null) =>
  t ? { kind: t.kind, startedAt: new Date(t.startedAt).toISOString(), endsAt: new Date(t.endsAt).toISOString() } : null;

/**
 * The booth card's next step from the plan's layers and the coat entries, as the card sends it, by the same shared
 * rules the server's card uses (booth.ts, booth-timing.ts): the tablet moves the card on with it over coats it logged
 * offline that are still waiting to send. A "prep" layer is done through the prep records, not sprayed, so it is not part of the coat sequence.
 */
export function boothNext(layers: readonly Layer[], entries: readonly CoatEntry[], sheets: readonly BoothMixSheetDto[], now: number): { next: BoothNextDto; progress: Map<number, LayerProgress> } {
  const sprayLayers = layers.filter((l) => l.kind !== "prep");
  const layerIds = new Set(sprayLayers.map((l) => l.id));
  const effective = effectiveCoats(entries.filter((e) => layerIds.has(e.layerId)));
  const step = nextBoothStep(sprayLayers, effective, now);
  const progress = new Map(step.layers.map((p) => [p.layerId, p]));
  if (step.state === "no_layers") return { next: { state: "no_layers" }, progress };
  if (step.state === "done") return { next: { state: "done", lastCoatAt: new Date(step.lastCoatAt).toISOString(), timer: timerDto(step.timer)! }, progress };
  const layer = sprayLayers[step.layerIndex]!;
  const batch = sheets.find((s) => s.layerId === layer.id && s.status === "mixed" && s.mixedAt);
  const w = coatWindows(sprayLayers, effective, step.layerIndex, step.coat, batch?.mixedAt ? { mixedAt: Date.parse(batch.mixedAt) } : null);
  // A minimum recoat time longer than the dry time holds the next layer back: the dry timer runs to the later.
  const stepTimer = step.timer?.kind === "dry" && w.dryEndsAt ? { ...step.timer, endsAt: Math.max(step.timer.endsAt, w.dryEndsAt) } : step.timer;
  return {
    next: {
      state: "spray",
      layerId: layer.id,
      layerName: layer.name,
      layerKind: layer.kind,
      coat: step.coat,
      of: step.of,
      isLastLayer: step.isLastLayer,
      isFirstCoatOfJob: effective.length === 0,
      timer: timerDto(stepTimer),
      layerDoneAt: new Date(step.layerDoneAt).toISOString(),
      windows: {
        flashEndsAt: isoOrNull(w.flashEndsAt),
        dryEndsAt: isoOrNull(w.dryEndsAt),
        recoatClosesAt: isoOrNull(w.recoatClosesAt),
        inductionEndsAt: isoOrNull(w.inductionEndsAt),
        needsBatch: w.needsBatch,
      },
      breaches: timingBreaches(sprayLayers, step.layerIndex, w, now),
    },
    progress,
  };
}

/** The latest batch recorded as mixed for the layer to spray next, with its pot-life end. */
export function openBatchFor(next: BoothNextDto, sheets: readonly BoothMixSheetDto[]): BoothDto["openBatch"] {
  if (next.state !== "spray") return null;
  const batch = sheets.find((s) => s.layerId === next.layerId && s.status === "mixed" && s.mixedAt);
  return batch ? { mixSheetId: batch.id, layerId: batch.layerId, mixedAt: batch.mixedAt!, potLifeEndsAt: batch.potLifeEndsAt } : null;
}
