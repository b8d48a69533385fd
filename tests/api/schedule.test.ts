import { describe, expect, it } from "vitest";
import request from "supertest";
import { scheduleSessions, users } from "../../server/db/schema";
import { seedDemo } from "../../server/db/seed/index";
import { addBoothPlan, addCoat } from "../support/booth-fixtures";
import { addBooths, HOUR, MONDAY_8 } from "../support/schedule-fixtures";
import { cookieFor, editAt, makeApp, makeShop, type Shop } from "../support/test-app";

const MIN = 60_000;
const iso = (ms: number) => new Date(ms).toISOString();
const week = `from=${iso(MONDAY_8 - 8 * HOUR)}&to=${iso(MONDAY_8 + 7 * 24 * HOUR)}`;
type Conflict = { kind: string; sessionIds: (number | null)[]; message: string };

async function twoJobs() {
  const s = await makeShop();
  const booths = addBooths(s);
  const planA = addBoothPlan(s, s.jobA.id);
  const planB = addBoothPlan(s, s.jobB.id);
  // Prep is planned to be signed off before Monday morning for both jobs.
  for (const job of [s.jobA, s.jobB]) expect((await s.as("owner").put(`/api/schedule/jobs/${job.id}/prep`).send({ readyAt: iso(MONDAY_8 - HOUR) })).status).toBe(200);
  return { s, booths, planA, planB };
}
const book = (s: Shop, body: object) => s.as("estimator").post("/api/schedule/sessions").send(body);

describe("booths", () => {
  it("are kept by the owner with a clear 4xx naming the field for bad input", async () => {
    const s = await makeShop();
    const created = await s.as("owner").post("/api/booths").send({ name: "Main booth", timeZone: "America/Chicago", opensAt: "06:30", closesAt: "15:00", canCureOutside: true });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ name: "Main booth", opensAt: "06:30", closesAt: "15:00", workDays: [1, 2, 3, 4, 5], setupMinutes: 20, canCureOutside: true, timeZone: "America/Chicago" });
    const backwards = await s.as("owner").post("/api/booths").send({ name: "B", timeZone: "UTC", opensAt: "17:00", closesAt: "07:00" });
    expect([backwards.status, backwards.body.error.fields]).toEqual([400, { closesAt: "Closing time must be after opening time" }]);
    const zone = await s.as("owner").post("/api/booths").send({ name: "B", timeZone: "Mars/Olympus" });
    expect([zone.status, Object.keys(zone.body.error.fields)]).toEqual([400, ["timeZone"]]);
    expect((await s.as("owner").post("/api/booths").send({ name: "main BOOTH", timeZone: "UTC" })).status).toBe(409);
    const moved = await s.as("owner").patch(`/api/booths/${created.body.id}`).send({ opensAt: "16:00", version: created.body.version });
    expect([moved.status, moved.body.error.fields]).toEqual([400, { closesAt: "Must be after opening time" }]);
    expect((await s.as("owner").get("/api/booths")).body).toEqual([created.body]);
  });
});

describe("booth sessions", () => {
  it("last set-up + coats × (spray + flash) + the cure kept in the booth", async () => {
    const { s, booths, planA } = await twoJobs();
    // Grey sealer: 2 coats × (4 min spray + 10 min flash) + 30 min dry. Booth 1 (set-up 20, cures inside): 78 min;
    // booth 2 (set-up 15, parts cure outside): 43 min.
    const one = await book(s, { boothId: booths.one.id, jobId: s.jobA.id, layerId: planA.layers[0]!.id, startsAt: iso(MONDAY_8) });
    expect(one.status).toBe(201);
    const mine = one.body.sessions.find((x: { layerId: number }) => x.layerId === planA.layers[0]!.id);
    expect(mine).toMatchObject({ startsAt: iso(MONDAY_8), sprayEndsAt: iso(MONDAY_8 + 48 * MIN), endsAt: iso(MONDAY_8 + 78 * MIN), jobTitle: s.jobA.title, layerName: "Grey sealer" });
    const moved = await s.as("owner").patch(`/api/schedule/sessions/${mine.id}`).send({ boothId: booths.two.id, version: mine.version });
    expect(moved.body.sessions.find((x: { id: number }) => x.id === mine.id)).toMatchObject({ boothId: booths.two.id, endsAt: iso(MONDAY_8 + 43 * MIN) });
  });

  it("two jobs in one booth at once are flagged, and moving one clears it", async () => {
    const { s, booths, planA, planB } = await twoJobs();
    await book(s, { boothId: booths.one.id, jobId: s.jobA.id, layerId: planA.layers[0]!.id, startsAt: iso(MONDAY_8) });
    const second = await book(s, { boothId: booths.one.id, jobId: s.jobB.id, layerId: planB.layers[0]!.id, startsAt: iso(MONDAY_8 + 30 * MIN) });
    expect(second.status).toBe(201);
    const schedule = (await s.as("owner").get(`/api/schedule?${week}`)).body;
    expect(schedule.conflicts.map((c: Conflict) => c.kind)).toEqual(["booth_overlap"]);
    expect(schedule.conflicts[0].message).toBe(`Booth 1 is booked twice at once: ${s.jobA.title} and ${s.jobB.title}`);
    const id = schedule.sessions.find((x: { jobId: number }) => x.jobId === s.jobB.id).id;
    const moved = await s.as("estimator").patch(`/api/schedule/sessions/${id}`).send({ startsAt: iso(MONDAY_8 + 78 * MIN), version: 1 });
    expect(moved.status).toBe(200);
    expect((await s.as("owner").get(`/api/schedule?${week}`)).body.conflicts).toEqual([]);
  });

  it("a layer before the one under it is dry is flagged; the painter sees only their own jobs and no conflicts", async () => {
    const { s, booths, planA, planB } = await twoJobs();
    await book(s, { boothId: booths.one.id, jobId: s.jobA.id, layerId: planA.layers[0]!.id, startsAt: iso(MONDAY_8) });
    // The sealer's last coat is down at 08:48 and it dries 30 min: the candy may start at 09:18 in booth 2.
    await book(s, { boothId: booths.two.id, jobId: s.jobA.id, layerId: planA.layers[1]!.id, startsAt: iso(MONDAY_8 + 60 * MIN) });
    await book(s, { boothId: booths.two.id, jobId: s.jobB.id, layerId: planB.layers[0]!.id, startsAt: iso(MONDAY_8 + 4 * HOUR) });
    const owner = (await s.as("owner").get(`/api/schedule?${week}`)).body;
    expect(owner.conflicts.map((c: Conflict) => c.kind)).toEqual(["too_soon"]);
    expect(owner.conflicts[0].message).toMatch(/^Helmet in candy teal: Candy garnet starts before Grey sealer is ready for it/);
    const painter = (await s.as("painter").get(`/api/schedule?${week}`)).body;
    expect(painter.sessions.map((x: { jobId: number }) => x.jobId)).toEqual([s.jobA.id, s.jobA.id]);
    expect(painter.conflicts).toEqual([]);
    const candy = owner.sessions.find((x: { layerId: number }) => x.layerId === planA.layers[1]!.id).id;
    await s.as("owner").patch(`/api/schedule/sessions/${candy}`).send({ startsAt: iso(MONDAY_8 + 78 * MIN), version: 1 });
    expect((await s.as("owner").get(`/api/schedule?${week}`)).body.conflicts).toEqual([]);
  });

  it("refuses bad input with 400 naming the field, and saves nothing", async () => {
    const { s, booths, planA, planB } = await twoJobs();
    const cases: [object, string][] = [
      [{ boothId: booths.one.id, jobId: s.jobA.id, layerId: planA.layers[0]!.id, startsAt: "Monday" }, "startsAt"],
      [{ boothId: 999, jobId: s.jobA.id, layerId: planA.layers[0]!.id, startsAt: iso(MONDAY_8) }, "boothId"],
      [{ boothId: booths.one.id, jobId: s.jobA.id, layerId: planB.layers[0]!.id, startsAt: iso(MONDAY_8) }, "layerId"],
      [{ boothId: "0x1", jobId: s.jobA.id, layerId: planA.layers[0]!.id, startsAt: iso(MONDAY_8) }, "boothId"],
    ];
    for (const [body, field] of cases) {
      const res = await book(s, body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(Object.keys(res.body.error.fields)).toEqual([field]);
    }
    expect(s.db.select().from(scheduleSessions).all()).toEqual([]);
    await book(s, { boothId: booths.one.id, jobId: s.jobA.id, layerId: planA.layers[0]!.id, startsAt: iso(MONDAY_8) });
    const twice = await book(s, { boothId: booths.two.id, jobId: s.jobA.id, layerId: planA.layers[0]!.id, startsAt: iso(MONDAY_8 + HOUR) });
    expect([twice.status, twice.body.error.fields]).toEqual([400, { layerId: "Already booked" }]);
    expect(s.db.select().from(scheduleSessions).all()).toHaveLength(1);
  });

  it("a layer already sprayed is not offered and cannot be booked", async () => {
    const { s, booths, planA } = await twoJobs();
    const sealer = planA.layers[0]!;
    addCoat(s, s.jobA.id, planA.version.id, sealer.id, 1, MONDAY_8 - 3 * HOUR, s.painter.id);
    addCoat(s, s.jobA.id, planA.version.id, sealer.id, 2, MONDAY_8 - 2 * HOUR, s.painter.id);
    const jobs = (await s.as("owner").get("/api/schedule/jobs")).body;
    expect(jobs.find((j: { id: number }) => j.id === s.jobA.id).layers.map((l: { name: string }) => l.name)).toEqual(["Candy garnet", "2K clear"]);
    const res = await book(s, { boothId: booths.one.id, jobId: s.jobA.id, layerId: sealer.id, startsAt: iso(MONDAY_8) });
    expect([res.status, res.body.error.fields]).toEqual([400, { layerId: "Already sprayed" }]);
  });
});

describe("suggested schedule", () => {
  it("is a proposal that passes the rules, saved only when accepted; a job without a prep plan is left out with the reason", async () => {
    const { s, planA, planB } = await twoJobs();
    await editAt(s, "owner", `/api/jobs/${s.jobB.id}`, { dueDate: "2026-12-08" });
    await editAt(s, "owner", `/api/jobs/${s.jobA.id}`, { dueDate: "2026-12-11" });
    const proposal = (await s.as("owner").post("/api/schedule/suggest").send({ from: iso(MONDAY_8) })).body;
    expect(proposal.sessions).toHaveLength(6);
    expect(proposal.conflicts).toEqual([]);
    expect(proposal.unplaced).toEqual([]);
    // Earliest due first: job B's first layer starts at 08:00 on Monday.
    const first = [...proposal.sessions].sort((a, b) => a.startsAt.localeCompare(b.startsAt))[0];
    expect([first.jobId, first.layerId, first.startsAt]).toEqual([s.jobB.id, planB.layers[0]!.id, iso(MONDAY_8)]);
    expect(s.db.select().from(scheduleSessions).all()).toEqual([]);

    const accepted = await s.as("estimator").post("/api/schedule/accept").send({ from: proposal.from, sessions: proposal.sessions.map(({ boothId, jobId, layerId, startsAt }: Record<string, unknown>) => ({ boothId, jobId, layerId, startsAt })) });
    expect(accepted.status).toBe(200);
    expect(s.db.select().from(scheduleSessions).all()).toHaveLength(6);
    expect(accepted.body.conflicts).toEqual([]);
    expect(accepted.body.sessions.filter((x: { jobId: number }) => x.jobId === s.jobA.id).map((x: { layerId: number }) => x.layerId)).toEqual(planA.layers.map((l) => l.id));

    await s.as("owner").put(`/api/schedule/jobs/${s.jobB.id}/prep`).send({ readyAt: null });
    const again = (await s.as("owner").post("/api/schedule/suggest").send({ from: iso(MONDAY_8) })).body;
    expect(again.unplaced).toEqual([{ jobId: s.jobB.id, jobTitle: s.jobB.title, reason: "Plan when prep will be signed off first" }]);
  });
});

describe("demo shop", () => {
  it("has two booths and the coming two weeks booked, with no booth booked twice and every layer in its window", async () => {
    const t = makeApp();
    const now = Date.now();
    await seedDemo(t.db, now);
    const owner = t.db.select().from(users).all().find((u) => u.role === "owner")!;
    const cookie = await cookieFor(t, owner.id);
    const booths = (await request(t.app).get("/api/booths").set("Cookie", cookie)).body;
    expect(booths.map((b: { name: string }) => b.name).sort()).toEqual(["North booth", "Side booth"]);
    const res = await request(t.app).get(`/api/schedule?from=${iso(now)}&to=${iso(now + 14 * 24 * HOUR)}`).set("Cookie", cookie);
    expect(res.status).toBe(200);
    expect(res.body.sessions.length).toBeGreaterThanOrEqual(10);
    expect(new Set(res.body.sessions.map((x: { jobId: number }) => x.jobId)).size).toBeGreaterThanOrEqual(4);
    // Due dates can be out of reach in the demo; nothing else may be wrong.
    expect(res.body.conflicts.filter((c: Conflict) => c.kind !== "due_at_risk")).toEqual([]);
  });
});
