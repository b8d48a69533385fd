import type { QueuedEntry } from "./queue";

/**
 * The queue's rules of order, kept pure (tests/client/queue-order.test.ts): which entry may go next, and what happens
 * to the entries that wait for another (a photo of a coat still waiting to send) when that one is stored, replaced
 * or discarded.
 */

/** The problem shown on an entry whose owner never reached the server (the booth card offers "Add it to the job"). */
const ownerGone = (message: string) => ({ status: 404, code: "not_found", message, fields: {} });

/** Entries of a job after one the server refused stay back until that one is fixed or discarded; so does one waiting for its owner. */
export function heldBack(entry: QueuedEntry, entries: readonly QueuedEntry[]) {
  if (entry.waitsFor !== undefined) return true;
  return entries.some((e) => e.jobId === entry.jobId && e.state === "refused" && entries.indexOf(e) < entries.indexOf(entry));
}

/** After `sent` is stored as record `id`, the entries waiting for it get that owner id (or are refused when there is none). */
export function withOwner(entries: readonly QueuedEntry[], sent: QueuedEntry, id: number | null): QueuedEntry[] {
  return entries.map((e) => {
    if (e.waitsFor !== sent.key) return e;
    if (id == null) return { ...e, waitsFor: undefined, state: "refused", problem: ownerGone(`The server's answer for "${sent.label}" did not name it; add the photo to the job instead, or discard it`) };
    return { ...e, waitsFor: undefined, body: { ...e.body, ownerId: id } };
  });
}

export type Replacement = Pick<QueuedEntry, "key" | "body" | "label"> & Partial<Pick<QueuedEntry, "waitsFor">>;

/** A refused entry replaced by a changed one (its new key): it waits to send again, and its dependants now wait for the new key. */
export function replaced(entries: readonly QueuedEntry[], key: string, changed: Replacement): QueuedEntry[] {
  return entries.map((e) => (e.key === key ? { ...e, ...changed, state: "waiting", problem: undefined } : e.waitsFor === key ? { ...e, waitsFor: changed.key } : e));
}

/** An entry dropped; its dependants can no longer get an owner and are shown as refused, with the way out. */
export function discarded(entries: readonly QueuedEntry[], key: string): QueuedEntry[] {
  const gone = entries.find((e) => e.key === key);
  const why = `"${gone?.label ?? "Its coat"}" was discarded, so this photo has nothing to go on; add it to the job instead, or discard it`;
  return entries.filter((e) => e.key !== key).map((e) => (e.waitsFor === key ? { ...e, waitsFor: undefined, state: "refused", problem: ownerGone(why) } : e));
}
