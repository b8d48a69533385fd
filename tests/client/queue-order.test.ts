import { describe, expect, it } from "vitest";
import type { QueuedEntry } from "../../src/lib/offline/queue";
import { discarded, heldBack, replaced, withOwner } from "../../src/lib/offline/queue-order";

/** A coat logged offline, then a photo of it (waiting for the coat's id), then a coat on another job. */
const coat: QueuedEntry = { key: "coat-key-1", userId: "u", kind: "coat", jobId: 7, path: "/coat-logs", body: { layerId: 3, coatNumber: 1 }, madeAt: 1, label: "Coat 1 of Ground", state: "waiting" };
const photo: QueuedEntry = { key: "photo-key-1", userId: "u", kind: "photo", jobId: 7, path: "/uploads", body: { ownerType: "coat_log", at: "x" }, madeAt: 2, label: "Photo of coat 1 of Ground", state: "waiting", waitsFor: "coat-key-1" };
const other: QueuedEntry = { ...coat, key: "coat-key-9", jobId: 8, label: "Coat 1 of Clear" };
const queue = [coat, photo, other];

describe("the tablet queue's order", () => {
  it("a photo waiting for its coat is held back; the coat and another job's entries are not", () => {
    expect(queue.map((e) => heldBack(e, queue))).toEqual([false, true, false]);
  });

  it("a refused entry holds back the later entries of its job only", () => {
    const refused = [{ ...coat, state: "refused" as const }, { ...photo, waitsFor: undefined }, other];
    expect(refused.map((e) => heldBack(e, refused))).toEqual([false, true, false]);
  });

  it("once the coat is stored, its photo gets the coat's id and may go", () => {
    const after = withOwner([photo, other], coat, 412);
    expect(after[0]).toMatchObject({ body: { ownerType: "coat_log", ownerId: 412 }, state: "waiting" });
    expect(after[0]!.waitsFor).toBeUndefined();
    expect(heldBack(after[0]!, after)).toBe(false);
    expect(after[1]).toBe(other);
  });

  it("a coat answer without the coat's id refuses the photo with a reason instead of sending it nowhere", () => {
    const [p] = withOwner([photo], coat, null);
    expect(p).toMatchObject({ state: "refused", problem: { status: 404 } });
    expect(p!.problem!.message).toMatch(/add the photo to the job instead, or discard it/);
  });

  it("a refused coat sent again as another coat (a new key) keeps its photo waiting for it", () => {
    const after = replaced([{ ...coat, state: "refused" }, photo], coat.key, { key: "coat-key-2", body: { layerId: 3, coatNumber: 2 }, label: "Coat 2 of Ground" });
    expect(after.map((e) => [e.key, e.state, e.waitsFor])).toEqual([
      ["coat-key-2", "waiting", undefined],
      ["photo-key-1", "waiting", "coat-key-2"],
    ]);
  });

  it("a discarded coat leaves its photo refused with the reason, not silently dropped or sent", () => {
    const after = discarded(queue, coat.key);
    expect(after.map((e) => e.key)).toEqual(["photo-key-1", "coat-key-9"]);
    expect(after[0]).toMatchObject({ state: "refused", problem: { status: 404 } });
    expect(after[0]!.problem!.message).toBe('"Coat 1 of Ground" was discarded, so this photo has nothing to go on; add it to the job instead, or discard it');
    expect(after[0]!.waitsFor).toBeUndefined();
  });
});
