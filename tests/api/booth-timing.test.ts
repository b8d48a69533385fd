import { describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { makeShop, type Shop } from "../support/test-app";
import { addBoothPlan, addMixedSheet, clockShop, readyForBooth, signOffPrep, T0 } from "../support/booth-fixtures";
import { addMaterial } from "../support/finish-fixtures";
import { coatLogs, mixSheets, planLayers } from "../../server/db/schema";
import type { BoothDto } from "../../shared/schemas/booth.schema";
import type { FinishRecordDto } from "../../shared/schemas/finish-record.schema";

/*
 * The booth's timing rules (issue 14, item 1), with a clock the test moves: every server time comes from deps.now.
 * The plan (tests/support/booth-fixtures.ts DEFAULT_LAYERS): sealer 2 coats, flash 10 min, dry 30 min; candy 3 coats,
 * flash 8 min, dry 20 min; 2K clear 2 coats (isocyanate hardener), flash 12 min.
 */
const MIN = 60_000;
const SEC = 1000;

const booth = async (s: Shop) => (await s.as("painter").get(`/api/jobs/${s.jobA.id}/booth`)).body as BoothDto;
async function tap(s: Shop, extra: object = {}) {
  const b = await booth(s);
  if (b.next.state !== "spray") throw new Error(`nothing to spray: ${b.next.state}`);
  return s.as("painter").post("/api/coat-logs").send({ jobId: s.jobA.id, layerId: b.next.layerId, coatNumber: b.next.coat, ...extra });
}
const coatCount = (s: Shop) => s.db.select().from(coatLogs).all().length;

describe("timing rules on POST /api/coat-logs", () => {
  it("refuses a coat 11 s into a 10-minute flash with 409 naming the rule; a reason lets it through, flagged on the record", async () => {
    const { s, clock } = await clockShop();
    readyForBooth(s);
    expect((await tap(s)).status).toBe(201);

    clock.now = T0 + 11 * SEC;
    const refused = await tap(s);
    expect(refused.status).toBe(409);
    expect(refused.body.error.rules).toEqual(["flash"]);
    expect(refused.body.error.message).toMatch(/Flash time: the last coat of Grey sealer needs 10 min more to flash/);
    expect(refused.body.error.fields).toHaveProperty("timingOverrideReason");
    expect(coatCount(s)).toBe(1); // nothing written

    const ok = await tap(s, { timingOverrideReason: "Thin mist coat, checked by touch" });
    expect(ok.status).toBe(201);
    const row = s.db.select().from(coatLogs).where(eq(coatLogs.coatNumber, 2)).get()!;
    expect(row.timingOverrideReason).toBe("Thin mist coat, checked by touch");
    expect(row.timingBreaches).toEqual([{ rule: "flash", message: expect.stringMatching(/^Flash time/) }]);
    const b = ok.body as BoothDto;
    expect(b.coatLogs.at(-1)).toMatchObject({ coatNumber: 2, timingOverrideReason: "Thin mist coat, checked by touch", timingBreaches: [expect.objectContaining({ rule: "flash" })] });
    expect(b.coatLogs[0]!.timingOverrideReason).toBeNull();
    expect(b.timingOverrides).toEqual([
      expect.objectContaining({ layerName: "Grey sealer", coatNumber: 2, reason: "Thin mist coat, checked by touch", byName: "Test painter", breaches: [expect.objectContaining({ rule: "flash" })] }),
    ]);
  });

  it("a coat exactly at the end of its flash needs no reason", async () => {
    const { s, clock } = await clockShop();
    readyForBooth(s);
    await tap(s);
    clock.now = T0 + 10 * MIN - 1;
    expect((await booth(s)).next).toMatchObject({ breaches: [expect.objectContaining({ rule: "flash" })], windows: { flashEndsAt: new Date(T0 + 10 * MIN).toISOString() } });
    clock.now = T0 + 10 * MIN;
    expect((await booth(s)).next).toMatchObject({ breaches: [] });
    expect((await tap(s)).status).toBe(201);
  });

  it("refuses a layer's first coat 19 s into the previous layer's dry time, and takes it once the dry time is over", async () => {
    const { s, clock } = await clockShop();
    readyForBooth(s);
    await tap(s);
    clock.now = T0 + 10 * MIN;
    await tap(s);
    // Sealer's last coat at 09:10, dry 30 min: the candy may go on from 09:40.
    clock.now = T0 + 10 * MIN + 19 * SEC;
    const refused = await tap(s);
    expect(refused.status).toBe(409);
    expect(refused.body.error.rules).toEqual(["dry"]);
    expect(refused.body.error.message).toMatch(/Dry time: Grey sealer needs 30 min more before Candy garnet goes on/);
    clock.now = T0 + 40 * MIN;
    const ok = await tap(s);
    expect(ok.status).toBe(201);
    expect(s.db.select().from(coatLogs).all().at(-1)!.timingOverrideReason).toBeNull();
  });

  it("holds the next layer for the minimum recoat time and refuses it after the maximum recoat window", async () => {
    const { s, clock } = await clockShop();
    const plan = readyForBooth(s);
    s.db.update(planLayers).set({ recoatMinMinutes: 45, recoatMaxMinutes: 60 }).where(eq(planLayers.id, plan.layers[0]!.id)).run();
    await tap(s);
    clock.now = T0 + 10 * MIN;
    await tap(s);
    // Last sealer coat 09:10: dry 30 min, but the data sheet says recoat no sooner than 45 min and no later than 60.
    clock.now = T0 + 20 * MIN;
    const b = await booth(s);
    expect(b.next).toMatchObject({
      timer: { kind: "dry", endsAt: new Date(T0 + 55 * MIN).toISOString() },
      windows: { dryEndsAt: new Date(T0 + 55 * MIN).toISOString(), recoatClosesAt: new Date(T0 + 70 * MIN).toISOString() },
    });
    expect(b.layers[0]).toMatchObject({ recoatMinMinutes: 45, recoatMaxMinutes: 60 });
    clock.now = T0 + 50 * MIN; // dry time over, minimum recoat not
    expect((await tap(s)).body.error.rules).toEqual(["dry"]);
    clock.now = T0 + 71 * MIN;
    const late = await tap(s);
    expect(late.status).toBe(409);
    expect(late.body.error.rules).toEqual(["recoat_window"]);
    expect(late.body.error.message).toMatch(/Recoat window: Grey sealer had to be recoated within 1 h; the window closed 1 min ago/);
    const ok = await tap(s, { timingOverrideReason: "Scuffed the sealer with grey pad first" });
    expect(ok.status).toBe(201);
    expect(s.db.select().from(coatLogs).all().at(-1)!.timingBreaches).toEqual([expect.objectContaining({ rule: "recoat_window" })]);
  });

  it("refuses a 2K coat with no recorded batch, then one still in its induction time; takes it once the batch has stood", async () => {
    const { s, clock } = await clockShop();
    const plan = addBoothPlan(s, s.jobA.id, [{ kind: "clear", name: "2K clear", coats: 2, flashMinutes: 12, dryMinutes: 0, hazardous: true }]);
    signOffPrep(s, s.jobA.id, s.itemA.id, s.painter.id);
    const clear = plan.layers[0]!;
    s.db.update(planLayers).set({ inductionMinutes: 15 }).where(eq(planLayers.id, clear.id)).run();
    expect((await booth(s)).layers[0]).toMatchObject({ catalysed: true, inductionMinutes: 15 });

    const noBatch = await tap(s);
    expect(noBatch.status).toBe(409);
    expect(noBatch.body.error.rules).toEqual(["no_batch"]);
    expect(noBatch.body.error.message).toMatch(/No batch recorded: 2K clear is catalysed \(2K\)/);

    const sheet = addMixedSheet(s, s.jobA.id, plan.version.id, clear.id, T0 - 5 * MIN);
    const inducing = await tap(s);
    expect(inducing.status).toBe(409);
    expect(inducing.body.error.rules).toEqual(["induction"]);
    expect(inducing.body.error.message).toMatch(/Induction time: the batch of 2K clear must stand 10 min more/);
    expect((await booth(s)).next).toMatchObject({ windows: { inductionEndsAt: new Date(T0 + 10 * MIN).toISOString(), needsBatch: false } });

    clock.now = T0 + 10 * MIN;
    const ok = await tap(s);
    expect(ok.status).toBe(201);
    expect(s.db.select().from(coatLogs).get()!.mixSheetId).toBe(sheet.id);
  });

  it("names every rule broken at once, and one reason covers them all", async () => {
    const { s, clock } = await clockShop();
    const plan = addBoothPlan(s, s.jobA.id, [{ kind: "clear", name: "2K clear", coats: 2, flashMinutes: 12, dryMinutes: 0, hazardous: true }]);
    signOffPrep(s, s.jobA.id, s.itemA.id, s.painter.id);
    addMixedSheet(s, s.jobA.id, plan.version.id, plan.layers[0]!.id, T0 - 60 * MIN);
    await tap(s);
    // The batch is voided (say it was spilt): the second coat is early and has no batch.
    s.db.update(coatLogs).set({ mixSheetId: null }).run();
    s.db.update(mixSheets).set({ status: "void" }).run();
    clock.now = T0 + 1 * MIN;
    const refused = await tap(s);
    expect(refused.body.error.rules).toEqual(["flash", "no_batch"]);
    const ok = await tap(s, { timingOverrideReason: "Last of the batch in the cup" });
    expect(ok.status).toBe(201);
    expect((ok.body as BoothDto).timingOverrides[0]!.breaches.map((b) => b.rule)).toEqual(["flash", "no_batch"]);
  });

  it("shows an overridden coat flagged with its reason on the finish record (office), not to the customer", async () => {
    const { s, clock } = await clockShop();
    readyForBooth(s);
    await tap(s);
    clock.now = T0 + 2 * MIN;
    expect((await tap(s, { timingOverrideReason: "Customer waiting at the counter" })).status).toBe(201);
    const record = (await s.as("owner").get(`/api/jobs/${s.jobA.id}/finish-record`)).body as FinishRecordDto;
    const sealer = record.layers.find((l) => l.name === "Grey sealer")!;
    expect(sealer.coats[0]!.overrides).toEqual([]);
    expect(sealer.coats[1]!.overrides).toEqual([{ rule: "timing", reason: expect.stringMatching(/^Customer waiting at the counter \(Flash time: the last coat of Grey sealer needs 8 min more/) }]);
    const customer = await s.as("customer").get(`/api/jobs/${s.jobA.id}/finish-record`);
    expect(JSON.stringify(customer.body)).not.toMatch(/Customer waiting at the counter/);
  });
});

describe("induction and recoat figures from the catalogue", () => {
  it("a plan layer takes them from its materials' data sheets unless the plan gives its own", async () => {
    const s = await makeShop();
    const sealer = addMaterial(s, { code: "S9-B14", name: "Test epoxy sealer", category: "sealer", purchaseUnit: "quart", costCents: 5000, inductionMinutes: 10, recoatMinMinutes: 30, recoatMaxMinutes: 4320 });
    const activator = addMaterial(s, { code: "S9-B01", name: "Test activator", category: "hardener", purchaseUnit: "pint", costCents: 3000, inductionMinutes: 20, recoatMinMinutes: 15, recoatMaxMinutes: 1440 });
    expect(sealer).toMatchObject({ inductionMinutes: 10, recoatMinMinutes: 30, recoatMaxMinutes: 4320 });
    const layer = (extra: object = {}) => ({
      kind: "sealer",
      name: "Epoxy sealer",
      coats: 2,
      flashMinutes: 10,
      dryMinutes: 30,
      components: [
        { materialId: sealer.id, label: "sealer", parts: 1 },
        { materialId: activator.id, label: "activator", parts: 1 },
      ],
      ...extra,
    });
    const res = await s.as("estimator").post("/api/plans").send({ name: "Epoxy", layers: [layer(), layer({ name: "Own window", recoatMaxMinutes: 600, inductionMinutes: "" })] });
    expect(res.status).toBe(201);
    // The longest induction, the latest opening and the earliest closing of the two data sheets.
    expect(res.body.latest.layers[0]).toMatchObject({ inductionMinutes: 20, recoatMinMinutes: 30, recoatMaxMinutes: 1440, catalysed: true });
    expect(res.body.latest.layers[1]).toMatchObject({ inductionMinutes: 20, recoatMinMinutes: 30, recoatMaxMinutes: 600 });
  });

  it("refuses a recoat window that closes before it opens, naming the field", async () => {
    const s = await makeShop();
    const bad = await s.as("owner").post("/api/materials").send({ code: "T-X-1", name: "Bad window", category: "sealer", purchaseUnit: "quart", costCents: 100, recoatMinMinutes: 60, recoatMaxMinutes: 30 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty("recoatMaxMinutes");
    const m = addMaterial(s, { code: "T-X-2", name: "Plain", category: "sealer", purchaseUnit: "quart", costCents: 100 });
    const plan = await s
      .as("estimator")
      .post("/api/plans")
      .send({ name: "Bad", layers: [{ kind: "sealer", name: "S", coats: 1, flashMinutes: 5, dryMinutes: 5, recoatMinMinutes: 90, recoatMaxMinutes: 30, components: [{ materialId: m.id, label: "s", parts: 1 }] }] });
    expect(plan.status).toBe(400);
    expect(plan.body.error.fields).toHaveProperty(["layers.0.recoatMaxMinutes"]);
    const word = await s.as("owner").post("/api/materials").send({ code: "T-X-3", name: "Words", category: "sealer", purchaseUnit: "quart", costCents: 100, inductionMinutes: "ten" });
    expect(word.status).toBe(400);
    expect(word.body.error.fields).toHaveProperty("inductionMinutes");
  });
});

describe("an entry queued offline is checked at the time it was made", () => {
  it("a coat made inside the flash is refused even when it arrives after; one made in time is taken however late it arrives", async () => {
    const { s, clock } = await clockShop();
    readyForBooth(s);
    await tap(s);
    // Made at 09:03 (inside the 10-minute flash), sent at 09:30.
    clock.now = T0 + 30 * MIN;
    const early = await tap(s, { at: new Date(T0 + 3 * MIN).toISOString() });
    expect(early.status).toBe(409);
    expect(early.body.error.rules).toEqual(["flash"]);
    // Made at 09:12 (flash over), sent at 09:30: taken, with its own time and no flag.
    const inTime = await tap(s, { at: new Date(T0 + 12 * MIN).toISOString() });
    expect(inTime.status).toBe(201);
    const row = s.db.select().from(coatLogs).all().at(-1)!;
    expect(row.at).toBe(T0 + 12 * MIN);
    expect(row.timingOverrideReason).toBeNull();
  });
});
