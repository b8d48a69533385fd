import { coatCount } from "../domain/booth";
import type { Booth, ScheduleLayer, Session } from "./types";

export const MINUTE_MS = 60_000;

/** Set-up, then each coat sprayed and flashed off: the part of a session the painter is spraying. */
export function sprayMinutes(booth: Pick<Booth, "setupMinutes">, layer: Pick<ScheduleLayer, "coats" | "minutesPerCoat" | "flashMinutes">): number {
  return booth.setupMinutes + coatCount(layer.coats) * (layer.minutesPerCoat + layer.flashMinutes);
}

/** How long the layer keeps the booth after its last coat: its dry time, unless parts may cure elsewhere. */
export function cureInBoothMinutes(booth: Pick<Booth, "canCureOutside">, layer: Pick<ScheduleLayer, "dryMinutes">): number {
  return booth.canCureOutside ? 0 : layer.dryMinutes;
}

/** A session lasts set-up + coats × (spray time + flash) + the cure time spent in the booth (a 2.5-coat layer is 3 passes). */
export function sessionMinutes(booth: Booth, layer: ScheduleLayer): number {
  return sprayMinutes(booth, layer) + cureInBoothMinutes(booth, layer);
}

/** The session a layer needs in a booth from a start time. */
export function sessionAt(booth: Booth, layer: ScheduleLayer, startsAt: number): Session {
  return { boothId: booth.id, jobId: layer.jobId, layerId: layer.id, startsAt, endsAt: startsAt + sessionMinutes(booth, layer) * MINUTE_MS };
}

/** When the layer's last coat is down (the dry time and recoat window count from here). */
export function lastCoatAt(session: Pick<Session, "startsAt">, booth: Booth, layer: ScheduleLayer): number {
  return session.startsAt + sprayMinutes(booth, layer) * MINUTE_MS;
}

/**
 * When the next layer may start over `layer` sprayed in `session`: once it is dry and its earliest recoat time has
 * passed, and (when the data sheet sets a latest recoat time) before that closes.
 */
export function nextLayerWindow(session: Pick<Session, "startsAt">, booth: Booth, layer: ScheduleLayer): { opensAt: number; closesAt: number | null } {
  const down = lastCoatAt(session, booth, layer);
  const wait = Math.max(layer.dryMinutes, layer.recoatMinMinutes ?? 0);
  return { opensAt: down + wait * MINUTE_MS, closesAt: layer.recoatMaxMinutes == null ? null : down + layer.recoatMaxMinutes * MINUTE_MS };
}
