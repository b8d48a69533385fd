import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  endOfDate,
  findConflicts,
  instantOf,
  localTime,
  nextLayerWindow,
  nextSprayStart,
  sessionAt,
  sessionMinutes,
  suggestSchedule,
  type Booth,
  type ScheduleJob,
  type ScheduleLayer,
  type Session,
} from "../../shared/schedule";

const MIN = 60_000;
const booth = (over: Partial<Booth> = {}): Booth => ({
  id: 1,
  name: "Booth 1",
  setupMinutes: 20,
  canCureOutside: false,
  opensAtMinute: 7 * 60,
  closesAtMinute: 17 * 60,
  workDays: [1, 2, 3, 4, 5],
  timeZone: "UTC",
  ...over,
});
const layer = (over: Partial<ScheduleLayer> = {}): ScheduleLayer => ({
  id: 1,
  jobId: 1,
  position: 1,
  name: "Sealer",
  coats: 3,
  minutesPerCoat: 10,
  flashMinutes: 10,
  dryMinutes: 60,
  recoatMinMinutes: null,
  recoatMaxMinutes: null,
  ...over,
});
// Monday 7 December 2026, 08:00 UTC (a working day in these booths).
const MONDAY_8 = Date.UTC(2026, 11, 7, 8, 0);

describe("session length and the window for the next layer", () => {
  it("is set-up + coats × (spray + flash) + the cure time kept in the booth", () => {
    // 20 + 3 × (10 + 10) + 60 = 140 min (the rule as the schedule states it; figures invented for the check).
    expect(sessionMinutes(booth(), layer())).toBe(140);
    // Parts that may cure outside leave the booth after their last coat: 20 + 3 × 20 = 80 min.
    expect(sessionMinutes(booth({ canCureOutside: true }), layer())).toBe(80);
    const s = sessionAt(booth(), layer(), MONDAY_8);
    expect(s.endsAt - s.startsAt).toBe(140 * MIN);
  });

  it("opens when the layer under is dry (or at its earliest recoat, whichever is later) and closes at its latest recoat", () => {
    const s = { startsAt: MONDAY_8 };
    // Last coat down at 08:00 + 80 min = 09:20; dry 60 min → 10:20.
    expect(nextLayerWindow(s, booth(), layer())).toEqual({ opensAt: MONDAY_8 + 140 * MIN, closesAt: null });
    // Earliest recoat 90 min, latest 24 h after the last coat.
    expect(nextLayerWindow(s, booth(), layer({ recoatMinMinutes: 90, recoatMaxMinutes: 24 * 60 }))).toEqual({
      opensAt: MONDAY_8 + 170 * MIN,
      closesAt: MONDAY_8 + 80 * MIN + 24 * 60 * MIN,
    });
  });
});

describe("booth hours in the booth's own time zone", () => {
  it("finds wall-clock instants across a daylight-saving change (IANA tz database: US clocks go forward on 8 March 2026)", () => {
    // 07:00 CST (UTC−6) on Friday 6 March; 07:00 CDT (UTC−5) on Monday 9 March.
    expect(instantOf(2026, 3, 6, 7 * 60, "America/Chicago")).toBe(Date.UTC(2026, 2, 6, 13, 0));
    expect(instantOf(2026, 3, 9, 7 * 60, "America/Chicago")).toBe(Date.UTC(2026, 2, 9, 12, 0));
    expect(endOfDate("2026-03-08", "America/Chicago")).toBe(Date.UTC(2026, 2, 9, 5, 0) - 1);
    expect(localTime(Date.UTC(2026, 2, 9, 12, 0), "America/Chicago")).toMatchObject({ weekday: 1, minuteOfDay: 7 * 60 });
  });

  it("moves a start that does not fit to the next working day's opening", () => {
    const b = booth({ timeZone: "America/Chicago" });
    // Friday 6 March 2026 16:30 CST: 80 min of spraying no longer fits before 17:00, and the weekend is off.
    const friday = instantOf(2026, 3, 6, 16 * 60 + 30, "America/Chicago");
    expect(nextSprayStart(friday, 80, b)).toBe(instantOf(2026, 3, 9, 7 * 60, "America/Chicago"));
    // Within hours it stays where it is; longer than a working day it never fits.
    const monday9 = instantOf(2026, 3, 9, 9 * 60, "America/Chicago");
    expect(nextSprayStart(monday9, 80, b)).toBe(monday9);
    expect(nextSprayStart(monday9, 11 * 60, b)).toBeNull();
  });
});

describe("conflicts", () => {
  const jobs: ScheduleJob[] = [
    { id: 1, title: "Tank", dueDate: "2026-12-08", prepReadyAt: MONDAY_8 - 60 * MIN, layers: [layer(), layer({ id: 2, position: 2, name: "Ground coat", dryMinutes: 30 })] },
    { id: 2, title: "Helmet", dueDate: null, prepReadyAt: MONDAY_8, layers: [layer({ id: 3, jobId: 2, name: "Clear" })] },
  ];
  const facts = { booths: [booth(), booth({ id: 2, name: "Booth 2" })], jobs };

  it("flags two jobs in one booth at once, and clears when one moves to the other booth", () => {
    const a = sessionAt(booth(), jobs[0]!.layers[0]!, MONDAY_8);
    const b = sessionAt(booth(), jobs[1]!.layers[0]!, MONDAY_8 + 60 * MIN);
    const found = findConflicts([a, b], facts);
    expect(found.map((c) => [c.kind, c.sessions])).toEqual([["booth_overlap", [0, 1]]]);
    expect(found[0]!.message).toBe("Booth 1 is booked twice at once: Tank and Helmet");
    expect(findConflicts([a, { ...b, boothId: 2 }], facts)).toEqual([]);
  });

  it("flags a layer before the one under it is dry, after its recoat window, or before it", () => {
    const first = sessionAt(booth(), jobs[0]!.layers[0]!, MONDAY_8);
    const ground = jobs[0]!.layers[1]!;
    // Dry at 10:20 (see above): 10:00 is too soon, 10:30 is fine.
    expect(findConflicts([first, sessionAt(booth({ id: 2 }), ground, MONDAY_8 + 120 * MIN)], facts).map((c) => c.kind)).toEqual(["too_soon"]);
    expect(findConflicts([first, sessionAt(booth({ id: 2 }), ground, MONDAY_8 + 150 * MIN)], facts)).toEqual([]);
    expect(findConflicts([first, sessionAt(booth({ id: 2 }), ground, MONDAY_8 - 180 * MIN)], facts).map((c) => c.kind)).toContain("out_of_order");
    const windowed = { ...facts, jobs: [{ ...jobs[0]!, layers: [layer({ recoatMaxMinutes: 120 }), ground] }, jobs[1]!] };
    // Last coat 09:20 + 120 min = 11:20 closes the window: 11:30 is too late.
    expect(findConflicts([first, sessionAt(booth({ id: 2 }), ground, MONDAY_8 + 210 * MIN)], windowed).map((c) => c.kind)).toEqual(["too_late"]);
  });

  it("flags a job finishing after its due date, a session before prep, and spraying outside hours", () => {
    const late = sessionAt(booth(), jobs[0]!.layers[0]!, Date.UTC(2026, 11, 9, 8, 0));
    expect(findConflicts([late], facts).map((c) => c.kind)).toEqual(["due_at_risk"]);
    const early = sessionAt(booth(), jobs[1]!.layers[0]!, MONDAY_8 - 60 * MIN);
    expect(findConflicts([early], facts).map((c) => c.kind)).toEqual(["before_prep"]);
    const evening = sessionAt(booth(), jobs[1]!.layers[0]!, Date.UTC(2026, 11, 7, 16, 30));
    expect(findConflicts([evening], facts).map((c) => c.kind)).toEqual(["outside_hours"]);
    const unplanned = { ...facts, jobs: [{ ...jobs[1]!, prepReadyAt: null }] };
    expect(findConflicts([sessionAt(booth(), jobs[1]!.layers[0]!, MONDAY_8)], unplanned).map((c) => c.kind)).toEqual(["before_prep"]);
  });
});

// ---- Properties of the suggestion -----------------------------------------------------------------------------

const ZONES = ["UTC", "America/Chicago", "Europe/Berlin", "Australia/Sydney"];
const boothsArb = fc
  .record({
    count: fc.integer({ min: 1, max: 3 }),
    zone: fc.constantFrom(...ZONES),
    setup: fc.integer({ min: 0, max: 45 }),
    cureOutside: fc.array(fc.boolean(), { minLength: 3, maxLength: 3 }),
    opens: fc.integer({ min: 5 * 60, max: 9 * 60 }),
    hours: fc.integer({ min: 6 * 60, max: 12 * 60 }),
  })
  .map(({ count, zone, setup, cureOutside, opens, hours }) =>
    Array.from({ length: count }, (_, i) => booth({ id: i + 1, name: `Booth ${i + 1}`, setupMinutes: setup, canCureOutside: cureOutside[i]!, opensAtMinute: opens, closesAtMinute: opens + hours, timeZone: zone })),
  );
const layerArb = fc.record({
  coats: fc.integer({ min: 1, max: 5 }),
  minutesPerCoat: fc.integer({ min: 3, max: 25 }),
  flashMinutes: fc.integer({ min: 0, max: 20 }),
  dryMinutes: fc.integer({ min: 0, max: 8 * 60 }),
  recoatMinMinutes: fc.option(fc.integer({ min: 0, max: 12 * 60 }), { nil: null }),
  recoatMaxMinutes: fc.option(fc.integer({ min: 24 * 60, max: 7 * 24 * 60 }), { nil: null }),
});
const jobsArb = fc.array(
  fc.record({
    layers: fc.array(layerArb, { minLength: 1, maxLength: 4 }),
    dueInDays: fc.option(fc.integer({ min: 0, max: 20 }), { nil: null }),
    prepInHours: fc.option(fc.integer({ min: -48, max: 96 }), { nil: null }),
  }),
  { minLength: 1, maxLength: 7 },
);
function buildJobs(raw: { layers: Omit<ScheduleLayer, "id" | "jobId" | "position" | "name">[]; dueInDays: number | null; prepInHours: number | null }[]): ScheduleJob[] {
  let layerId = 0;
  return raw.map((j, i) => ({
    id: i + 1,
    title: `Job ${i + 1}`,
    dueDate: j.dueInDays == null ? null : new Date(MONDAY_8 + j.dueInDays * 86_400_000).toISOString().slice(0, 10),
    prepReadyAt: j.prepInHours == null ? null : MONDAY_8 + j.prepInHours * 60 * MIN,
    layers: j.layers.map((l, k) => ({ ...l, id: ++layerId, jobId: i + 1, position: k + 1, name: `Layer ${k + 1}` })),
  }));
}

describe("the suggested schedule (fast-check properties)", () => {
  it("never books a booth twice, keeps each job's layers in order, keeps every dry time and recoat window, sprays in hours, after prep", () => {
    fc.assert(
      fc.property(boothsArb, jobsArb, (booths, raw) => {
        const jobs = buildJobs(raw);
        const { sessions, unplaced } = suggestSchedule({ booths, jobs, from: MONDAY_8 });
        // The suggestion passes its own checker, apart from due dates (a date can be impossible to meet).
        const found = findConflicts(sessions, { booths, jobs }).filter((c) => c.kind !== "due_at_risk");
        expect(found).toEqual([]);
        // Every job is either placed whole, in plan order, or listed once as unplaced.
        for (const job of jobs) {
          const mine = sessions.filter((s) => s.jobId === job.id);
          const listed = unplaced.filter((u) => u.jobId === job.id);
          expect(mine.length === job.layers.length ? listed.length : mine.length + listed.length - 1).toBe(0);
          expect(mine.map((s) => s.layerId)).toEqual(mine.length ? job.layers.map((l) => l.id) : []);
          for (let k = 1; k < mine.length; k++) expect(mine[k]!.startsAt).toBeGreaterThanOrEqual(mine[k - 1]!.startsAt);
          if (job.prepReadyAt == null) expect(listed).toHaveLength(1);
        }
        // No booth holds two sessions at once (checked directly too, not only through findConflicts).
        for (const b of booths) {
          const mine = sessions.filter((s) => s.boothId === b.id).sort((x, y) => x.startsAt - y.startsAt);
          for (let k = 1; k < mine.length; k++) expect(mine[k]!.startsAt).toBeGreaterThanOrEqual(mine[k - 1]!.endsAt);
          for (const s of mine) expect(s.endsAt - s.startsAt).toBe(sessionMinutes(b, jobs.find((j) => j.id === s.jobId)!.layers.find((l) => l.id === s.layerId)!) * MIN);
        }
      }),
      { numRuns: 150 },
    );
  });

  it("puts the earliest due date first: with one booth, a job due sooner starts before a job due later", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 10 }), fc.integer({ min: 1, max: 10 }), (a, b) => {
        fc.pre(a !== b);
        const jobs = buildJobs([
          { layers: [{ coats: 2, minutesPerCoat: 8, flashMinutes: 5, dryMinutes: 30, recoatMinMinutes: null, recoatMaxMinutes: null }], dueInDays: a, prepInHours: 0 },
          { layers: [{ coats: 2, minutesPerCoat: 8, flashMinutes: 5, dryMinutes: 30, recoatMinMinutes: null, recoatMaxMinutes: null }], dueInDays: b, prepInHours: 0 },
        ]);
        const { sessions } = suggestSchedule({ booths: [booth()], jobs, from: MONDAY_8 });
        const start = (id: number) => sessions.find((s) => s.jobId === id)!.startsAt;
        expect(start(1) < start(2)).toBe(a < b);
      }),
    );
  });

  it("leaves kept sessions where they are and books around them", () => {
    const jobs = buildJobs([{ layers: [{ coats: 2, minutesPerCoat: 8, flashMinutes: 5, dryMinutes: 30, recoatMinMinutes: null, recoatMaxMinutes: null }], dueInDays: 2, prepInHours: 0 }]);
    const kept: Session = { boothId: 1, jobId: 99, layerId: 99, startsAt: MONDAY_8, endsAt: MONDAY_8 + 3 * 60 * MIN };
    const { sessions } = suggestSchedule({ booths: [booth()], jobs, keep: [kept], from: MONDAY_8 });
    expect(sessions).toHaveLength(1);
    expect(sessions[0]!.startsAt).toBe(kept.endsAt);
  });
});
