import { badRequest } from "./http-error";

/** A tablet's clock may run a little ahead of the server's. */
const CLOCK_SLACK_MS = 60_000;

/**
 * The time an entry was made (`at`, sent by a tablet that was offline), checked against what it belongs to: not in
 * the future, not before any of `floors` (the job, the batch). Without `at`, the entry was made now.
 */
export function madeAt(at: string | undefined, now: number, floors: { time: number | null | undefined; what: string }[]): number {
  if (at === undefined) return now;
  const t = Date.parse(at);
  if (t > now + CLOCK_SLACK_MS) throw badRequest("The entry's time is in the future; check the tablet's clock", { at: "In the future" });
  for (const f of floors)
    if (f.time != null && t < f.time) throw badRequest(`The entry's time is before ${f.what} (${new Date(f.time).toISOString()})`, { at: `Before ${f.what}` });
  return t;
}
