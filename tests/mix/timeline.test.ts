import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { layerTimeline, potLifeEnds } from "../../shared/mix/index";
import { catchMixError } from "./helpers";

// Times are ISO 8601 instants in UTC; 1 min = 60 s = 60 000 ms (SI definition of the minute).

describe("pot life", () => {
  it("a batch mixed at 09:00 with a 2 h pot life ends at 11:00", () => {
    // 2K urethane clear pot life typically 1–4 h at 21 °C (common practice); the product's data governs.
    expect(potLifeEnds(new Date("2025-03-01T09:00:00Z"), 120).toISOString()).toBe("2025-03-01T11:00:00.000Z");
  });

  it("is counted in elapsed time, across midnight and a daylight-saving change", () => {
    // US DST began 2025-03-09 at 02:00 local (second Sunday in March, from memory); elapsed minutes are
    // unaffected because instants are UTC.
    expect(potLifeEnds(new Date("2025-03-09T06:30:00Z"), 90).toISOString()).toBe("2025-03-09T08:00:00.000Z");
    expect(potLifeEnds(new Date("2025-03-01T23:30:00Z"), 45).toISOString()).toBe("2025-03-02T00:15:00.000Z");
  });

  it("rejects an invalid date and a non-positive pot life", () => {
    expect(catchMixError(() => potLifeEnds(new Date("nonsense"), 60)).field).toBe("mixedAt");
    expect(catchMixError(() => potLifeEnds(new Date(), 0)).field).toBe("potLifeMinutes");
    expect(catchMixError(() => potLifeEnds(new Date(), Number.NaN)).field).toBe("potLifeMinutes");
  });
});

describe("layer timeline", () => {
  it("3 coats, 5 min each, 10 min flash, 30 min before the next layer, from 10:00", () => {
    // Flash 5–15 min between coats at 21 °C, each coat dry to the touch before the next (common practice).
    const t = layerTimeline(
      { coats: 3, flashMinutes: 10, minutesPerCoat: 5, dryMinutes: 30 },
      new Date("2025-03-01T10:00:00Z"),
    );
    const iso = (d: Date) => d.toISOString().slice(11, 16);
    expect(t.coats.map((c) => [c.coat, iso(c.startsAt), iso(c.endsAt), iso(c.flashEndsAt)])).toEqual([
      [1, "10:00", "10:05", "10:15"],
      [2, "10:15", "10:20", "10:30"],
      [3, "10:30", "10:35", "10:45"],
    ]);
    expect(iso(t.lastCoatEndsAt)).toBe("10:35");
    expect(iso(t.nextLayerAt)).toBe("11:05");
  });

  it("properties: one slot per coat, in order, each flash before the next coat", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 12 }),
        fc.double({ min: 0, max: 60, noNaN: true }),
        fc.double({ min: 0.5, max: 30, noNaN: true }),
        fc.double({ min: 0, max: 600, noNaN: true }),
        (coats, flashMinutes, minutesPerCoat, dryMinutes) => {
          const start = new Date("2025-06-01T08:00:00Z");
          const t = layerTimeline({ coats, flashMinutes, minutesPerCoat, dryMinutes }, start);
          expect(t.coats).toHaveLength(coats);
          expect(t.coats[0]!.startsAt.getTime()).toBe(start.getTime());
          t.coats.forEach((c, i) => {
            // A Date holds whole milliseconds, so durations are exact to ±0.5 ms.
            expect(Math.abs(c.endsAt.getTime() - c.startsAt.getTime() - minutesPerCoat * 60_000)).toBeLessThanOrEqual(0.5);
            if (i > 0) expect(c.startsAt.getTime()).toBe(t.coats[i - 1]!.flashEndsAt.getTime());
          });
          expect(Math.abs(t.nextLayerAt.getTime() - t.lastCoatEndsAt.getTime() - dryMinutes * 60_000)).toBeLessThanOrEqual(0.5);
          const perCoat = (minutesPerCoat + flashMinutes) * 60_000;
          expect(Math.abs(t.coats[coats - 1]!.startsAt.getTime() - start.getTime() - (coats - 1) * perCoat)).toBeLessThanOrEqual(coats);
        },
      ),
    );
  });

  it("rejects fractional or zero coats and negative times, naming the field", () => {
    const start = new Date("2025-03-01T10:00:00Z");
    const plan = { coats: 2, flashMinutes: 10, minutesPerCoat: 5, dryMinutes: 30 };
    expect(catchMixError(() => layerTimeline({ ...plan, coats: 2.5 }, start)).field).toBe("coats");
    expect(catchMixError(() => layerTimeline({ ...plan, coats: 0 }, start)).field).toBe("coats");
    expect(catchMixError(() => layerTimeline({ ...plan, flashMinutes: -1 }, start)).field).toBe("flashMinutes");
    expect(catchMixError(() => layerTimeline({ ...plan, minutesPerCoat: 0 }, start)).field).toBe("minutesPerCoat");
    expect(catchMixError(() => layerTimeline({ ...plan, dryMinutes: Number.NaN }, start)).field).toBe("dryMinutes");
    expect(catchMixError(() => layerTimeline(plan, new Date(Number.NaN))).field).toBe("startAt");
  });
});
