import type { LayerKind } from "./layers";
import { effectiveCoats, nextBoothStep, type BoothLayerTiming, type CoatEntry, type LayerProgress } from "./booth";
import type { BoothMixSheetDto, BoothNextDto, BoothDto } from "../schemas/booth.schema";

type Layer = BoothLayerTiming & { kind: LayerKind; name: string };

const timerDto = (t: { kind: "flash" | "dry"; startedAt: number; endsAt: number } | null) =>
  t ? { kind: t.kind, startedAt: new Date(t.startedAt).toISOString(), endsAt: new Date(t.endsAt).toISOString() } : null;

/**
 * The booth card's next step from the plan's layers and the coat entries, as the card sends it. The server builds the
 * card with it; the tablet uses it too, to move the card on over coats it logged offline that are still waiting to
 * send. A "prep" layer is done through the prep records, not sprayed, so it is not part of the coat sequence.
 */
export function boothNext(layers: readonly Layer[], entries: readonly CoatEntry[], now: number): { next: BoothNextDto; progress: Map<number, LayerProgress> } {
  const sprayLayers = layers.filter((l) => l.kind !== "prep");
  const layerIds = new Set(sprayLayers.map((l) => l.id));
  const effective = effectiveCoats(entries.filter((e) => layerIds.has(e.layerId)));
  const step = nextBoothStep(sprayLayers, effective, now);
  const progress = new Map(step.layers.map((p) => [p.layerId, p]));
  if (step.state === "no_layers") return { next: { state: "no_layers" }, progress };
  if (step.state === "done") return { next: { state: "done", lastCoatAt: new Date(step.lastCoatAt).toISOString(), timer: timerDto(step.timer)! }, progress };
  const layer = sprayLayers[step.layerIndex]!;
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
      timer: timerDto(step.timer),
      layerDoneAt: new Date(step.layerDoneAt).toISOString(),
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
