import { describe, expect, it } from "vitest";
import sharp from "sharp";
import { eq } from "drizzle-orm";
import { cookieFor, type Shop } from "../support/test-app";
import { addBoothPlan, addCoat, addMixedSheet, clockShop, readyForBooth, signOffPrep, T0 } from "../support/booth-fixtures";
import { auditLog, coatLogs, jobStageEvents, jobs, planVersions } from "../../server/db/schema";
import type { BoothDto } from "../../shared/schemas/booth.schema";
import request from "supertest";

const MIN = 60_000;

const booth = async (s: Shop, who: "owner" | "estimator" | "painter" = "painter") => (await s.as(who).get(`/api/jobs/${s.jobA.id}/booth`)).body as BoothDto;
const tap = (s: Shop, b: BoothDto, extra: object = {}) => {
  if (b.next.state !== "spray") throw new Error(`nothing to spray: ${b.next.state}`);
  return s.as("painter").post("/api/coat-logs").send({ jobId: s.jobA.id, layerId: b.next.layerId, coatNumber: b.next.coat, boothTemp: 21, tempUnit: "C", humidityPct: 50, ...extra });
};

/** Every key of a JSON value, at any depth. */
function keysOf(value: unknown, out: string[] = []): string[] {
  if (Array.isArray(value)) value.forEach((v) => keysOf(v, out));
  else if (value && typeof value === "object")
    for (const [k, v] of Object.entries(value)) {
      out.push(k);
      keysOf(v, out);
    }
  return out;
}
/** camelCase / snake_case words of a key that name money. */
const MONEY_WORDS = ["cost", "costs", "price", "prices", "amount", "amounts", "rate", "rates", "total", "totals", "cents", "margin", "markup"];
const moneyKeys = (value: unknown) =>
  keysOf(value).filter((k) =>
    k
      .replace(/([a-z0-9])([A-Z])/g, "$1 $2")
      .toLowerCase()
      .split(/[\s_]+/)
      .some((w) => MONEY_WORDS.includes(w)),
  );

describe("GET /api/jobs/:id/booth", () => {
  it("returns the layers in order with gun settings and cautions, the next step, and no money anywhere", async () => {
    const { s } = await clockShop();
    const plan = readyForBooth(s);
    addMixedSheet(s, s.jobA.id, plan.version.id, plan.layers[0]!.id, T0 - 10 * MIN, 120);
    const b = await booth(s);
    expect(b.layers.map((l) => l.name)).toEqual(["Grey sealer", "Candy garnet", "2K clear"]);
    expect(b.layers[0]).toMatchObject({ coats: 2, flashMinutes: 10, dryMinutes: 30, gunTip: "1.3 mm", pressurePsi: 26, status: "current", coatsDone: 0 });
    // The clear uses an isocyanate hardener and a flammable base: both cautions plus the safety-data-sheet line.
    expect(b.layers[2]!.cautions.map((c) => c.id)).toEqual(["isocyanates", "flammable", "defer"]);
    expect(b.layers[0]!.cautions).toEqual([]);
    expect(b.next).toMatchObject({ state: "spray", layerName: "Grey sealer", coat: 1, of: 2, isFirstCoatOfJob: true, timer: null });
    expect(b.prepReady).toBe(true);
    expect(b.canLog).toBe(true);
    // Pot life from the stored mixing time: mixed 08:50 + 120 min (mix engine potLifeEnds).
    expect(b.openBatch).toMatchObject({ layerId: plan.layers[0]!.id, potLifeEndsAt: new Date(T0 - 10 * MIN + 120 * MIN).toISOString() });
    // Materials and the batch line carry costs in the database; none reaches the painter.
    expect(moneyKeys(b)).toEqual([]);
    expect(JSON.stringify(b)).not.toMatch(/1234|4200|5100/);
  });

  it("the key walk does catch money keys (guards the guard)", () => {
    expect(moneyKeys({ a: [{ lineCostCents: 1 }], b: { unit_price: 2 }, totalMl: 3, potLifeEndsAt: 4, generatedAt: 5 })).toEqual(["lineCostCents", "unit_price", "totalMl"]);
  });

  it("painters reach only their assigned jobs; customers are refused; estimators read but may not log", async () => {
    const { s } = await clockShop();
    readyForBooth(s);
    const other = await cookieFor(s, s.painter2.id);
    expect((await request(s.app).get(`/api/jobs/${s.jobA.id}/booth`).set("Cookie", other)).status).toBe(404);
    expect((await s.as("customer").get(`/api/jobs/${s.jobA.id}/booth`)).status).toBe(403);
    const est = await booth(s, "estimator");
    expect(est.canLog).toBe(false);
    expect((await s.as("estimator").post("/api/coat-logs").send({ jobId: s.jobA.id, layerId: est.layers[0]!.id, coatNumber: 1 })).status).toBe(403);
    expect((await s.as("owner").get(`/api/jobs/${s.jobB.id}/booth`)).body.next).toEqual({ state: "no_plan" });
  });

  it("a plan's prep layer is done through the prep records, not tapped coat by coat", async () => {
    const { s } = await clockShop();
    addBoothPlan(s, s.jobA.id, [
      { kind: "prep", name: "Scuff, clean and tack", coats: 1, flashMinutes: 0, dryMinutes: 10 },
      { kind: "sealer", name: "Sealer", coats: 1, flashMinutes: 5, dryMinutes: 20 },
    ]);
    let b = await booth(s);
    expect(b.layers.map((l) => [l.isPrep, l.status])).toEqual([
      [true, "current"],
      [false, "current"],
    ]);
    expect(b.next).toMatchObject({ state: "spray", layerName: "Sealer", coat: 1 });
    signOffPrep(s, s.jobA.id, s.itemA.id, s.painter.id);
    b = await booth(s);
    expect(b.layers[0]).toMatchObject({ isPrep: true, status: "done", coatsDone: 1 });
  });

  it("rejects malformed ids with a 400, not a 500", async () => {
    const { s } = await clockShop();
    const res = await s.as("owner").get("/api/jobs/abc/booth");
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("id");
  });
});

describe("POST /api/coat-logs", () => {
  it("walks a job through every coat: flash and dry timers from the stored times, layers move on, the job ends curing", async () => {
    const { s, clock } = await clockShop();
    const plan = readyForBooth(s);
    let b = await booth(s);

    // Sealer coat 1 at 09:00. Flash 10 min → next coat from 09:10 (layerTimeline: coat end + flash).
    let res = await tap(s, b);
    expect(res.status).toBe(201);
    b = res.body;
    expect(b.job.stage).toBe("in_booth"); // the first coat moves the job from prep into the booth
    expect(b.next).toMatchObject({ state: "spray", layerName: "Grey sealer", coat: 2, of: 2, isFirstCoatOfJob: false });
    expect(b.next.state === "spray" && b.next.timer).toEqual({ kind: "flash", startedAt: new Date(T0).toISOString(), endsAt: new Date(T0 + 10 * MIN).toISOString() });
    // The plan version is frozen by the first coat, and the job points at it; the freeze is audited.
    expect(s.db.select().from(planVersions).where(eq(planVersions.id, plan.version.id)).get()!.frozenAt).toBe(T0);
    expect(s.db.select().from(jobs).where(eq(jobs.id, s.jobA.id)).get()!.sprayedPlanVersionId).toBe(plan.version.id);
    expect(s.db.select().from(auditLog).all().some((a) => a.kind === "plan" && a.action === "frozen")).toBe(true);

    // A reload five minutes later computes the same timer end from the stored time.
    clock.now = T0 + 5 * MIN;
    const reloaded = await booth(s);
    expect(reloaded.next.state === "spray" && reloaded.next.timer?.endsAt).toBe(new Date(T0 + 10 * MIN).toISOString());
    expect(reloaded.serverNow).toBe(new Date(T0 + 5 * MIN).toISOString());

    // Sealer coat 2 at 09:12: the layer is done; the candy waits for the sealer's 30 min dry (to 09:42).
    clock.now = T0 + 12 * MIN;
    b = (await tap(s, reloaded)).body;
    expect(b.layers.map((l) => l.status)).toEqual(["done", "current", "upcoming"]);
    expect(b.next).toMatchObject({ layerName: "Candy garnet", coat: 1, of: 3 });
    expect(b.next.state === "spray" && b.next.timer).toEqual({ kind: "dry", startedAt: new Date(T0 + 12 * MIN).toISOString(), endsAt: new Date(T0 + 42 * MIN).toISOString() });

    // Candy ×3 then clear ×2 (its 2K batch recorded as mixed first); the last coat of the last layer moves the job to curing with a stage event.
    addMixedSheet(s, s.jobA.id, plan.version.id, plan.layers[2]!.id, T0 + 12 * MIN);
    // Candy at 09:42 (sealer dry), 09:57, 10:12 (flash 8 min); clear at 10:32 (candy dry 20 min) and 10:50 (flash 12 min).
    for (const at of [42, 57, 72, 92, 110]) {
      clock.now = T0 + at * MIN;
      res = await tap(s, b);
      expect(res.status).toBe(201);
      b = res.body;
    }
    expect(b.next.state).toBe("done");
    expect(b.job.stage).toBe("curing");
    expect(b.layers.every((l) => l.status === "done")).toBe(true);
    const events = s.db.select().from(jobStageEvents).where(eq(jobStageEvents.jobId, s.jobA.id)).orderBy(jobStageEvents.id).all();
    expect(events.map((e) => e.toStage)).toEqual(["in_prep", "in_booth", "curing"]);
    expect(events.at(-1)!.note).toMatch(/Last coat/);
    expect(s.db.select().from(coatLogs).all()).toHaveLength(7);

    // Nothing left to log.
    expect((await s.as("painter").post("/api/coat-logs").send({ jobId: s.jobA.id, layerId: plan.layers[2]!.id, coatNumber: 3 })).status).toBe(409);
  });

  it("refuses a second tap for the same coat (a stale card) instead of counting it twice", async () => {
    const { s } = await clockShop();
    readyForBooth(s);
    const b = await booth(s);
    expect((await tap(s, b)).status).toBe(201);
    const again = await tap(s, b);
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/next coat is coat 2 of 2 of Grey sealer/);
    expect(s.db.select().from(coatLogs).all()).toHaveLength(1);
  });

  it("refuses the first coat when prep is not signed off, unless the painter gives a reason, which is kept and shown", async () => {
    const { s, clock } = await clockShop();
    addBoothPlan(s, s.jobA.id);
    const b = await booth(s);
    expect(b.prepReady).toBe(false);
    expect(b.items).toEqual([expect.objectContaining({ name: "Helmet shell", prepStatus: "none" })]);
    const refused = await tap(s, b);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/Prep is not signed off for Helmet shell/);
    expect(refused.body.error.fields).toHaveProperty("prepOverrideReason");
    const ok = await tap(s, b, { prepOverrideReason: "Customer collecting Friday; prep checked verbally with the owner" });
    expect(ok.status).toBe(201);
    expect(ok.body.prepOverrides).toEqual([
      expect.objectContaining({ reason: expect.stringMatching(/^Customer collecting Friday.*\(prep not signed off: Helmet shell\)$/), byName: "Test painter" }),
    ]);
    // Only the first coat needs it (the second goes on once the first has flashed, 10 min).
    clock.now += 10 * MIN;
    expect((await tap(s, ok.body)).status).toBe(201);
  });

  it("remembers the booth conditions of the last entry and accepts °F", async () => {
    const { s } = await clockShop();
    readyForBooth(s);
    const b = await booth(s);
    expect(b.lastConditions).toBeNull();
    const res = await tap(s, b, { boothTemp: 72, tempUnit: "F", humidityPct: 44 });
    expect(res.body.lastConditions).toEqual({ boothTemp: 72, tempUnit: "F", humidityPct: 44 });
    expect(res.body.coatLogs[0]).toMatchObject({ boothTemp: 72, tempUnit: "F", humidityPct: 44, painterName: "Test painter" });
  });

  it("names each bad field: a temperature outside the booth range, humidity over 100, unknown unit, words for numbers", async () => {
    const { s } = await clockShop();
    const plan = readyForBooth(s);
    const res = await s.as("painter").post("/api/coat-logs").send({ jobId: s.jobA.id, layerId: plan.layers[0]!.id, coatNumber: "one", boothTemp: 95, tempUnit: "C", humidityPct: 140 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["coatNumber", "humidityPct"]);
    const hot = await s.as("painter").post("/api/coat-logs").send({ jobId: s.jobA.id, layerId: plan.layers[0]!.id, coatNumber: 1, boothTemp: 95, tempUnit: "C" });
    expect(hot.body.error.fields).toEqual({ boothTemp: "Booth temperature in °C must be between -10 and 60" });
    const unit = await s.as("painter").post("/api/coat-logs").send({ jobId: s.jobA.id, layerId: plan.layers[0]!.id, coatNumber: 1, boothTemp: 20, tempUnit: "K" });
    expect(unit.body.error.fields).toHaveProperty("tempUnit");
    const huge = await s.as("painter").post("/api/coat-logs").send({ jobId: 1e20, layerId: plan.layers[0]!.id, coatNumber: 1 });
    expect(huge.status).toBe(400);
    expect(huge.body.error.fields).toHaveProperty("jobId");
  });

  it("refuses coats on a job with no plan, or not yet in prep", async () => {
    const { s } = await clockShop();
    signOffPrep(s, s.jobA.id, s.itemA.id, s.painter.id);
    const noPlan = await s.as("owner").post("/api/coat-logs").send({ jobId: s.jobA.id, layerId: 1, coatNumber: 1 });
    expect(noPlan.status).toBe(409);
    expect(noPlan.body.error.message).toMatch(/no finish plan/);
    const inquiry = await s.as("painter").post("/api/coat-logs").send({ jobId: s.inquiryA.id, layerId: 1, coatNumber: 1 });
    expect(inquiry.status).toBe(409);
    expect(inquiry.body.error.message).toMatch(/inquiry/);
  });
});

describe("POST /api/coat-logs/:id/corrections", () => {
  it("corrects by a new entry that names the original; the original is never changed", async () => {
    const { s, clock } = await clockShop();
    readyForBooth(s);
    const first = (await tap(s, await booth(s), { boothTemp: 12, tempUnit: "C" })).body as BoothDto;
    const originalId = first.coatLogs[0]!.id;
    clock.now = T0 + 3 * MIN;
    const res = await s.as("painter").post(`/api/coat-logs/${originalId}/corrections`).send({ reason: "Read the wrong dial", boothTemp: 21, tempUnit: "C" });
    expect(res.status).toBe(201);
    const logs = (res.body as BoothDto).coatLogs;
    expect(logs).toHaveLength(2);
    expect(logs[0]).toMatchObject({ id: originalId, boothTemp: 12, status: "corrected" });
    expect(logs[1]).toMatchObject({ correctsId: originalId, correctionReason: "Read the wrong dial", boothTemp: 21, humidityPct: 50, status: "correction", at: new Date(T0).toISOString() });
    expect(s.db.select().from(coatLogs).where(eq(coatLogs.id, originalId)).get()!.boothTemp).toBe(12);
  });

  it("a late tap is corrected to the real time and the flash timer follows it", async () => {
    const { s } = await clockShop();
    readyForBooth(s);
    const first = (await tap(s, await booth(s))).body as BoothDto;
    const real = new Date(T0 - 4 * MIN).toISOString();
    const res = await s.as("painter").post(`/api/coat-logs/${first.coatLogs[0]!.id}/corrections`).send({ reason: "Tapped late", at: real });
    expect(res.body.next.timer.endsAt).toBe(new Date(T0 - 4 * MIN + 10 * MIN).toISOString());
    const future = await s.as("painter").post(`/api/coat-logs/${first.coatLogs[0]!.id}/corrections`).send({ reason: "x", at: new Date(T0 + 60 * MIN).toISOString() });
    expect(future.status).toBe(400);
    expect(future.body.error.fields).toHaveProperty("at");
  });

  it("only the latest coat can be marked as not sprayed; then it stops counting and the card steps back", async () => {
    const { s, clock } = await clockShop();
    readyForBooth(s);
    let b = (await tap(s, await booth(s))).body as BoothDto;
    clock.now += 11 * MIN;
    b = (await tap(s, b)).body;
    const [c1, c2] = b.coatLogs;
    const early = await s.as("painter").post(`/api/coat-logs/${c1!.id}/corrections`).send({ reason: "Mistake", void: true });
    expect(early.status).toBe(409);
    const ok = await s.as("painter").post(`/api/coat-logs/${c2!.id}/corrections`).send({ reason: "Tapped twice by mistake", void: true });
    expect(ok.status).toBe(201);
    expect(ok.body.next).toMatchObject({ layerName: "Grey sealer", coat: 2 });
    expect(ok.body.coatLogs.find((l: { id: number }) => l.id === c2!.id).status).toBe("voided");
    const twice = await s.as("painter").post(`/api/coat-logs/${c2!.id}/corrections`).send({ reason: "again", void: true });
    expect(twice.status).toBe(409);
    const ofCorrection = await s.as("painter").post(`/api/coat-logs/${ok.body.coatLogs.at(-1).id}/corrections`).send({ reason: "x", note: "y" });
    expect(ofCorrection.status).toBe(409);
  });

  it("needs a reason and something to correct; other painters cannot reach the entry", async () => {
    const { s } = await clockShop();
    const plan = readyForBooth(s);
    const coat = addCoat(s, s.jobA.id, plan.version.id, plan.layers[0]!.id, 1, T0, s.painter.id);
    const empty = await s.as("painter").post(`/api/coat-logs/${coat.id}/corrections`).send({});
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields).toHaveProperty("reason");
    const nothing = await s.as("painter").post(`/api/coat-logs/${coat.id}/corrections`).send({ reason: "because" });
    expect(nothing.status).toBe(400);
    const other = await cookieFor(s, s.painter2.id);
    expect((await request(s.app).post(`/api/coat-logs/${coat.id}/corrections`).set("Cookie", other).send({ reason: "x", note: "y" })).status).toBe(404);
  });
});

describe("GET /api/jobs/:id/ticket", () => {
  it("gives a QR code (PNG) for the booth card address and the job's layers", async () => {
    const { s } = await clockShop();
    readyForBooth(s);
    const res = await s.as("painter").get(`/api/jobs/${s.jobA.id}/ticket`);
    expect(res.status).toBe(200);
    expect(res.body.boothUrl).toBe(`http://coatwright.test/booth/${s.jobA.id}`);
    expect(res.body.layers.map((l: { name: string }) => l.name)).toEqual(["Grey sealer", "Candy garnet", "2K clear"]);
    expect(res.body.layers[2].cautions).toEqual(["Isocyanates (2K hardener)", "Flammable solvents"]);
    expect(res.body.layers[0].cautions).toEqual([]);
    const png = Buffer.from(res.body.qrDataUrl.replace(/^data:image\/png;base64,/, ""), "base64");
    const meta = await sharp(png).metadata();
    expect(meta).toMatchObject({ format: "png", width: 320, height: 320 });
    expect(moneyKeys(res.body)).toEqual([]);
  });
});

describe("GET /api/coat-logs", () => {
  it("lists a job's entries for the staff who reach it", async () => {
    const { s } = await clockShop();
    const plan = readyForBooth(s);
    addCoat(s, s.jobA.id, plan.version.id, plan.layers[0]!.id, 1, T0, s.painter.id);
    const res = await s.as("owner").get(`/api/coat-logs?jobId=${s.jobA.id}`);
    expect(res.body).toEqual([expect.objectContaining({ layerName: "Grey sealer", coatNumber: 1, status: "counts" })]);
    expect((await s.as("owner").get("/api/coat-logs")).status).toBe(400);
  });
});
