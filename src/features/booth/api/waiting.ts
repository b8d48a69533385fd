import type { CoatLogDto } from "@shared/schemas/booth.schema";

/** A coat made on this tablet that is still waiting to send shows in the log with a negative id (booth-overlay.ts). */
export const isWaiting = (c: Pick<CoatLogDto, "id">) => c.id < 0;
