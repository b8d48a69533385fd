import type { BoothDto, CoatLogDto } from "@shared/schemas/booth.schema";
import type { QueuedEntry } from "@/lib/offline/queue";

/** A coat made on this tablet that is still waiting to send shows in the log with a negative id (booth-overlay.ts). */
export const isWaiting = (c: Pick<CoatLogDto, "id">) => c.id < 0;

/** A job's coats waiting on this tablet, in the order made: the one shown with id -n is the n-th (booth-overlay.ts). */
export const waitingCoats = (queue: readonly QueuedEntry[], jobId: number) => queue.filter((e) => e.kind === "coat" && e.jobId === jobId && e.state === "waiting");

/** The id the server gave a coat, read from its answer (the booth card after it): the latest entry of that layer and coat. */
export function coatIdIn(card: BoothDto, body: Record<string, unknown>): number | null {
  const matching = card.coatLogs.filter((c) => c.layerId === Number(body.layerId) && c.coatNumber === Number(body.coatNumber) && c.correctsId === null);
  return matching.at(-1)?.id ?? null;
}
