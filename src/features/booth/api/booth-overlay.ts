import type { CoatEntry } from "@shared/domain/booth";
import { boothNext, openBatchFor } from "@shared/domain/booth-next";
import { EMPTY_SETUP } from "@shared/domain/spray-setup";
import type { BoothDto, CoatLogDto } from "@shared/schemas/booth.schema";
import type { QueuedEntry } from "@/lib/offline/queue";
import { waitingCoats } from "./waiting";

const num = (v: unknown) => (typeof v === "number" ? v : null);

/**
 * The booth card as the painter should see it: the server's card moved on over the coats logged on this tablet
 * that are still waiting to send (offline), with the next coat, the flash timer and the batch worked out by the same
 * rules as the server's (shared/domain/booth-next.ts). Times are the stored ones, so a reload shows the same.
 */
export function withWaitingCoats(card: BoothDto, queue: readonly QueuedEntry[], now: number): BoothDto {
  const waiting = waitingCoats(queue, card.job.id);
  if (!waiting.length) return card;
  const layerName = new Map(card.layers.map((l) => [l.id, l.name]));
  const extra: CoatLogDto[] = waiting.map((e, i) => {
    const b = e.body;
    return {
      id: -(i + 1),
      jobId: card.job.id,
      layerId: Number(b.layerId),
      layerName: layerName.get(Number(b.layerId)) ?? "Layer",
      coatNumber: Number(b.coatNumber),
      at: new Date(e.madeAt).toISOString(),
      loggedAt: new Date(e.madeAt).toISOString(),
      painterName: "this tablet",
      boothTemp: num(b.boothTemp),
      tempUnit: b.tempUnit === "F" ? "F" : b.boothTemp != null ? "C" : null,
      humidityPct: num(b.humidityPct),
      note: typeof b.note === "string" ? b.note : null,
      setup: { ...EMPTY_SETUP, gunName: null, summary: "" },
      mixSheetId: null,
      prepOverrideReason: typeof b.prepOverrideReason === "string" ? b.prepOverrideReason : null,
      timingOverrideReason: typeof b.timingOverrideReason === "string" ? b.timingOverrideReason : null,
      timingBreaches: null,
      correctsId: null,
      correctionReason: null,
      voids: false,
      status: "counts",
    };
  });
  const coatLogs = [...card.coatLogs, ...extra];
  const entries: CoatEntry[] = coatLogs.map((c) => ({ id: c.id, layerId: c.layerId, coatNumber: c.coatNumber, at: Date.parse(c.at), correctsId: c.correctsId, voids: c.voids }));
  const { next, progress } = boothNext(card.layers, entries, card.mixSheets, now);
  return {
    ...card,
    layers: card.layers.map((l) => {
      const p = progress.get(l.id);
      return p ? { ...l, coatsDone: p.coatsDone, status: p.status } : l;
    }),
    coatLogs,
    next,
    openBatch: openBatchFor(next, card.mixSheets),
    lastConditions: { boothTemp: extra.at(-1)!.boothTemp, tempUnit: extra.at(-1)!.tempUnit, humidityPct: extra.at(-1)!.humidityPct },
  };
}
