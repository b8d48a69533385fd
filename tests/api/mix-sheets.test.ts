import { describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { auditLog, materialLots, mixSheets, planVersions } from "../../server/db/schema";
import { makeShop, editAt } from "../support/test-app";
import { finishFixtures, keysOf, MONEY_KEY } from "../support/finish-fixtures";
import { roundForMeasuring } from "../../shared/mix/index";

// US customary units from NIST Handbook 44 App. C: 1 gal = 231 in³ = 3785.411784 mL exactly,
// so 1 qt = 946.352946 mL, 1 pt = 473.176473 mL, 1 fl oz = 29.5735295625 mL.
const QUART_ML = 946.352946;
const PINT_ML = 473.176473;
const GALLON_ML = 3785.411784;

const lotQty = (s: Awaited<ReturnType<typeof makeShop>>, id: number) => s.db.select().from(materialLots).where(eq(materialLots.id, id)).get()!.quantityOnHand;

describe("making a mix sheet", () => {
  it("splits a 4:1:1 batch by volume and gives cumulative scale targets from the densities", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    // The fixture's draft: 300 mL of 4:1:1 → 200 / 50 / 50 mL (references.md §7, 4:1:1 split, scaled [C]).
    expect(f.sheet.lines.map((l) => [l.label, l.amount])).toEqual([
      ["clear", 200],
      ["hardener", 50],
      ["reducer", 50],
    ]);
    // Densities 1.00 / 1.10 / 0.87 g/mL → 200.00 → 255.00 → 298.50 g cumulative (references.md §7 "cumulative scale").
    expect(f.sheet.lines.map((l) => l.scaleReads)).toEqual([200, 255, 298.5]);
    expect(f.sheet.lines.map((l) => l.scaleTarget)).toEqual([200, 55, 43.5]);
    expect(f.sheet).toMatchObject({ scaleUnit: "g", scaleStep: 0.1, scaleLastReading: 298.5 });
    // Each line says its amount as the plan gives it, and its share of the ready-to-spray mix (4/6, 1/6, 1/6).
    expect(f.sheet.lines.map((l) => l.asPlanned)).toEqual(["4 parts", "1 part", "1 part"]);
    expect(f.sheet.lines.map((l) => l.share)).toEqual([expect.closeTo(4 / 6, 12), expect.closeTo(1 / 6, 12), expect.closeTo(1 / 6, 12)]);
    expect(f.sheet).toMatchObject({ status: "draft", unit: "mL", total: 300, totalMl: 300, potLifeMinutes: 90, potLifeEndsAt: null, planVersion: 1, planChanged: false });
    expect(f.sheet.cautions.map((c) => c.id)).toEqual(["isocyanates", "flammable", "defer"]);
    // Expected VOC from the catalogue: (4·500 + 300 + 880)/6 = 530 g/L (volume-weighted, no water or exempt).
    expect(f.sheet.vocGPerL).toBeCloseTo(530, 9);
    // The lot to use: the only lot of each material.
    expect(f.sheet.lines.map((l) => l.suggestedLotId)).toEqual([f.clearLot.id, f.hardenerLot.id, f.reducerLot.id]);
  });

  it("scales from a component on hand, in US units, rounded for a cup with the ratio error (same engine: roundForMeasuring)", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    const res = await s.as("painter").post("/api/mix-sheets").send({ jobId: s.jobA.id, layerId: f.layer.id, mode: "component", knownLabel: "clear", amount: 8, unit: "floz", roundingStep: 0.5 });
    expect(res.status).toBe(201);
    // 8 fl oz of clear on hand at 4:1:1 → 2 fl oz hardener and 2 fl oz reducer; 12 fl oz in all.
    expect(res.body.lines.map((l: { amount: number }) => l.amount)).toEqual([8, 2, 2]);
    expect(res.body.total).toBe(12);
    // 12 fl oz = 354.88235475 mL (references.md §1b).
    expect(res.body.totalMl).toBeCloseTo(354.88235475, 8);
    expect(res.body.roundingUnit).toBe("floz");
    const expected = roundForMeasuring(
      res.body.lines.map((l: { label: string; amount: number; share: number }) => ({ name: l.label, volume: l.amount, unit: "floz", share: l.share })),
      0.5,
      "floz",
    );
    expect(res.body.lines.map((l: { rounded: number }) => l.rounded)).toEqual(expected.lines.map((l) => l.rounded));
    expect(res.body.worstRatioErrorPct).toBe(expected.worstRatioErrorPct);
  });

  it("names every component whose ratio rounding moves past the shop's tolerance, and never makes less than asked", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    // 4:1:1 of 100 mL on a 5 mL cup → 70 / 15 / 15 (worked by hand in tests/mix/rounding.test.ts): the hardener
    // and the reducer are each 14.3 % short of a quarter of the clear.
    let res = await s.as("painter").post("/api/mix-sheets").send({ jobId: s.jobA.id, layerId: f.layer.id, mode: "total", amount: 100, unit: "mL", roundingStep: 5 });
    expect(res.status).toBe(201);
    expect(res.body.lines.map((l: { rounded: number }) => l.rounded)).toEqual([70, 15, 15]);
    expect(res.body.roundedTotal).toBe(100);
    expect(res.body.movedComponents).toEqual(["hardener", "reducer"]);
    expect(res.body.lines[1].ratioReference).toEqual(["clear"]);
    expect(res.body.ratioTolerancePct).toBe(2);
    expect((await editAt(s, "owner", "/api/settings", { ratioTolerancePct: 15 })).status).toBe(200);
    res = await s.as("painter").get(`/api/mix-sheets/${res.body.id}`);
    expect(res.body.movedComponents).toEqual([]);
    expect(res.body.ratioTolerancePct).toBe(15);
    const bad = await editAt(s, "owner", "/api/settings", { ratioTolerancePct: 50 });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toContain("ratioTolerancePct");
  });

  it("refuses what cannot be mixed: a layer of another job, a missing density for weighing, a component not in the mix, bad numbers", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    const other = await s.as("owner").post(`/api/jobs/${s.jobB.id}/plan`).send({ fromPlanId: f.template.id });
    let res = await s.as("owner").post("/api/mix-sheets").send({ jobId: s.jobA.id, layerId: other.body.latest.layers[0].id, mode: "total", amount: 100, unit: "mL" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("layerId");
    // The painter does not reach job B at all.
    res = await s.as("painter").post("/api/mix-sheets").send({ jobId: s.jobB.id, layerId: other.body.latest.layers[0].id, mode: "total", amount: 100, unit: "mL" });
    expect(res.status).toBe(404);
    res = await s.as("owner").post("/api/mix-sheets").send({ jobId: s.jobA.id, layerId: f.layer.id, mode: "component", knownLabel: "toner", amount: 100, unit: "mL" });
    expect(res.body.error.fields).toHaveProperty("knownLabel");
    res = await s.as("owner").post("/api/mix-sheets").send({ jobId: s.jobA.id, layerId: f.layer.id, mode: "component", amount: 100, unit: "mL" });
    expect(res.body.error.fields).toHaveProperty("knownLabel");
    res = await s.as("owner").post("/api/mix-sheets").send({ jobId: s.jobA.id, layerId: f.layer.id, mode: "total", amount: "lots", unit: "bucket" });
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["amount", "unit"]);
    res = await s.as("owner").post("/api/mix-sheets").send({ jobId: s.jobA.id, layerId: f.layer.id, mode: "total", amount: 1e12, unit: "mL" });
    expect(res.status).toBe(400);
    await editAt(s, "owner", `/api/materials/${f.reducer.id}`, { densityGPerMl: null });
    res = await s.as("owner").post("/api/mix-sheets").send({ jobId: s.jobA.id, layerId: f.layer.id, mode: "total", amount: 100, unit: "mL", weigh: true });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.weigh).toMatch(/S9-B10/);
    expect((await s.as("customer").post("/api/mix-sheets").send({ jobId: s.jobA.id, layerId: f.layer.id, mode: "total", amount: 100, unit: "mL" })).status).toBe(403);
  });

  it("suggests the oldest unexpired lot with stock", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    const add = (lot: object) => s.as("owner").post(`/api/materials/${f.clear.id}/lots`).send(lot);
    await add({ lotNumber: "CL-EXPIRED", quantityOnHand: 5, receivedOn: "2024-01-01", expiresOn: "2025-01-01" });
    await add({ lotNumber: "CL-EMPTY", quantityOnHand: 0, receivedOn: "2025-06-01", expiresOn: "2099-01-01" });
    const oldest = (await add({ lotNumber: "CL-OLDEST", quantityOnHand: 1, receivedOn: "2025-09-01", expiresOn: "2099-01-01" })).body;
    await add({ lotNumber: "CL-NEW", quantityOnHand: 4, receivedOn: "2026-11-01", expiresOn: "2099-01-01" });
    const res = await s.as("painter").post("/api/mix-sheets").send({ jobId: s.jobA.id, layerId: f.layer.id, mode: "total", amount: 300, unit: "mL" });
    const clear = res.body.lines[0];
    expect(clear.suggestedLotId).toBe(oldest.id);
    expect(clear.lots.map((l: { lotNumber: string; expired: boolean }) => [l.lotNumber, l.expired])).toEqual([
      ["CL-EXPIRED", true],
      ["CL-EMPTY", false],
      ["CL-OLDEST", false],
      ["CL-A1", false],
      ["CL-NEW", false],
    ]);
  });
});

describe("recording a batch as mixed", () => {
  it("takes stock in each material's purchase unit, copies the figures onto the lines, sets the batch VOC and freezes the plan version", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    // 250 mL of clear on hand → 62.5 mL hardener and 62.5 mL reducer.
    const made = await s.as("painter").post("/api/mix-sheets").send({ jobId: s.jobA.id, layerId: f.layer.id, mode: "component", knownLabel: "clear", amount: 250, unit: "mL" });
    const lines = made.body.lines as { id: number; label: string }[];
    const res = await s.as("painter").post(`/api/mix-sheets/${made.body.id}/record`).send({
      lines: lines.map((l) => ({ lineId: l.id, lotId: l.label === "clear" ? f.clearLot.id : l.label === "hardener" ? f.hardenerLot.id : f.reducerLot.id })),
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: "mixed", mixedByName: "Test painter", totalMl: 375 });
    expect(res.body.lines.map((l: { lotNumber: string; actualMl: number }) => [l.lotNumber, l.actualMl])).toEqual([
      ["CL-A1", 250],
      ["HD-A1", 62.5],
      ["RD-A1", 62.5],
    ]);
    // Stock: 250 mL from a lot kept in quarts is 250 / 946.352946 qt (NIST HB 44 quart); pints and gallons likewise.
    expect(lotQty(s, f.clearLot.id)).toBeCloseTo(2 - 250 / QUART_ML, 12);
    expect(lotQty(s, f.hardenerLot.id)).toBeCloseTo(2 - 62.5 / PINT_ML, 12);
    expect(lotQty(s, f.reducerLot.id)).toBeCloseTo(1 - 62.5 / GALLON_ML, 12);
    // Batch VOC, volume-weighted (40 CFR 59.104 form, no water/exempt): (250·500 + 62.5·300 + 62.5·880)/375 = 530 g/L.
    expect(res.body.vocGPerL).toBeCloseTo(530, 9);
    // Pot life: the hardener's 90 minutes from the mixing time.
    expect(Date.parse(res.body.potLifeEndsAt) - Date.parse(res.body.mixedAt)).toBe(90 * 60_000);
    // The painter sees no money; the office sees each line's cost: 250 mL × 9500/946.352946 ¢/mL = 2509.63 → 2510 ¢.
    expect(keysOf(res.body).filter((k) => MONEY_KEY.test(k))).toEqual([]);
    const office = await s.as("owner").get(`/api/mix-sheets/${made.body.id}`);
    expect(office.body.lines[0].costCents).toBe(2510);
    expect(office.body.lines[0]).toMatchObject({ vocGPerL: 500, densityGPerMl: 1 });
    // The version is frozen and the job points at it; the freeze is audited as a plan change.
    expect(s.db.select().from(planVersions).where(eq(planVersions.id, f.jobPlan.latest.id)).get()!.frozenAt).not.toBeNull();
    expect(s.db.select().from(auditLog).all().some((a) => a.kind === "plan" && a.action === "frozen" && a.userId === s.painter.id)).toBe(true);
    // Changing the catalogue later does not change the record.
    await editAt(s, "owner", `/api/materials/${f.clear.id}`, { vocGPerL: 420, densityGPerMl: 0.95 });
    const again = await s.as("owner").get(`/api/mix-sheets/${made.body.id}`);
    expect(again.body.vocGPerL).toBeCloseTo(530, 9);
    expect(again.body.lines[0]).toMatchObject({ vocGPerL: 500, densityGPerMl: 1 });
  });

  it("records actual amounts weighed in grams (converted through each density) and pours from the suggested lot when none is named", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    const lines = f.sheet.lines;
    const res = await s.as("owner").post(`/api/mix-sheets/${f.sheet.id}/record`).send({
      actualUnit: "g",
      lines: [
        { lineId: lines[0]!.id, actual: 210 },
        { lineId: lines[1]!.id, actual: 55 },
        { lineId: lines[2]!.id, lotId: null },
      ],
    });
    expect(res.status).toBe(200);
    // 210 g at 1.00 g/mL = 210 mL; 55 g at 1.10 g/mL = 50 mL; the reducer as planned (50 mL), from no lot.
    expect(res.body.lines.map((l: { actualMl: number }) => l.actualMl)).toEqual([210, expect.closeTo(50, 9), 50]);
    expect(res.body.lines.map((l: { lotNumber: string | null }) => l.lotNumber)).toEqual(["CL-A1", "HD-A1", null]);
    expect(lotQty(s, f.clearLot.id)).toBeCloseTo(2 - 210 / QUART_ML, 12);
    expect(lotQty(s, f.reducerLot.id)).toBe(1);
  });

  it("refuses a lot that holds too little with a 409 naming the line, and changes nothing", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    await editAt(s, "owner", `/api/materials/${f.hardener.id}/lots/${f.hardenerLot.id}`, { quantityOnHand: 0.05 }, { read: `/api/materials/${f.hardener.id}`, pick: (b) => (b.lots as { id: number; version: number }[]).find((l) => l.id === f.hardenerLot.id)! });
    const res = await s.as("painter").post(`/api/mix-sheets/${f.sheet.id}/record`).send({
      lines: f.sheet.lines.map((l) => ({ lineId: l.id, lotId: l.suggestedLotId })),
    });
    expect(res.status).toBe(409);
    expect(Object.keys(res.body.error.fields)).toEqual(["lines.1.lotId"]);
    expect(lotQty(s, f.clearLot.id)).toBe(2);
    expect(s.db.select().from(mixSheets).where(eq(mixSheets.id, f.sheet.id)).get()!.status).toBe("draft");
    expect(s.db.select().from(planVersions).where(eq(planVersions.id, f.jobPlan.latest.id)).get()!.frozenAt).toBeNull();
    const wrongLot = await s.as("painter").post(`/api/mix-sheets/${f.sheet.id}/record`).send({ lines: [{ lineId: f.sheet.lines[0]!.id, lotId: f.reducerLot.id }] });
    expect(wrongLot.status).toBe(400);
    expect(wrongLot.body.error.fields).toHaveProperty("lines.0.lotId");
    const future = await s.as("painter").post(`/api/mix-sheets/${f.sheet.id}/record`).send({ lines: [], mixedAt: "2999-01-01T00:00:00Z" });
    expect(future.body.error.fields).toHaveProperty("mixedAt");
  });

  it("a recorded sheet is never recorded again or deleted; it is voided with a reason and the stock stays taken", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    expect((await s.as("painter").post(`/api/mix-sheets/${f.sheet.id}/record`).send({ lines: [] })).status).toBe(200);
    const taken = lotQty(s, f.clearLot.id);
    expect(taken).toBeCloseTo(2 - 200 / QUART_ML, 12);
    expect((await s.as("painter").post(`/api/mix-sheets/${f.sheet.id}/record`).send({ lines: [] })).status).toBe(409);
    expect((await s.as("painter").delete(`/api/mix-sheets/${f.sheet.id}`)).status).toBe(409);
    expect((await s.as("painter").post(`/api/mix-sheets/${f.sheet.id}/void`).send({ reason: "  " })).status).toBe(400);
    const voided = await s.as("painter").post(`/api/mix-sheets/${f.sheet.id}/void`).send({ reason: "Kicked over the cup" });
    expect(voided.status).toBe(200);
    expect(voided.body).toMatchObject({ status: "void", voidReason: "Kicked over the cup", voidedByName: "Test painter", mixedByName: "Test painter" });
    expect(lotQty(s, f.clearLot.id)).toBe(taken);
    expect((await s.as("painter").post(`/api/mix-sheets/${f.sheet.id}/void`).send({ reason: "again" })).status).toBe(409);
  });
});

describe("listing and reach", () => {
  it("lists a job's sheets; a painter sees only their jobs' sheets and never a cost; a sheet from an older version says so", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    const other = await s.as("owner").post(`/api/jobs/${s.jobB.id}/plan`).send({ fromPlanId: f.template.id });
    const sheetB = await s.as("owner").post("/api/mix-sheets").send({ jobId: s.jobB.id, layerId: other.body.latest.layers[0].id, mode: "total", amount: 1, unit: "cup" });
    expect(sheetB.status).toBe(201);
    const mine = await s.as("painter").get("/api/mix-sheets");
    expect(mine.body.map((x: { id: number }) => x.id)).toEqual([f.sheet.id]);
    expect((await s.as("owner").get("/api/mix-sheets")).body).toHaveLength(2);
    expect((await s.as("owner").get(`/api/mix-sheets?jobId=${s.jobB.id}`)).body.map((x: { id: number }) => x.id)).toEqual([sheetB.body.id]);
    expect((await s.as("painter").get(`/api/mix-sheets/${sheetB.body.id}`)).status).toBe(404);
    expect((await s.as("owner").get("/api/mix-sheets?status=spilled")).status).toBe(400);
    const detail = await s.as("painter").get(`/api/mix-sheets/${f.sheet.id}`);
    expect(keysOf(detail.body).filter((k) => MONEY_KEY.test(k))).toEqual([]);

    // The office changes the plan: version 1 is locked by the draft, so version 2 is made; the draft says it is behind.
    await s.as("owner").put(`/api/plans/${f.jobPlan.id}`).send({ name: "Changed", layers: [], version: 1 });
    expect((await s.as("painter").get(`/api/mix-sheets/${f.sheet.id}`)).body).toMatchObject({ planChanged: true, planVersion: 1 });
  });
});

describe("a job with batches", () => {
  it("cannot be deleted even when moved back to inquiry (409, not a server error); its records stay", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    expect((await s.as("painter").post(`/api/mix-sheets/${f.sheet.id}/record`).send({ lines: [] })).status).toBe(200);
    await s.as("owner").post(`/api/jobs/${s.jobA.id}/stage`).send({ stage: "booked" });
    await s.as("owner").post(`/api/jobs/${s.jobA.id}/stage`).send({ stage: "quoted" });
    await s.as("owner").post(`/api/jobs/${s.jobA.id}/stage`).send({ stage: "inquiry" });
    const res = await s.as("owner").delete(`/api/jobs/${s.jobA.id}`);
    expect(res.status).toBe(409);
    expect((await s.as("owner").get(`/api/mix-sheets/${f.sheet.id}`)).body.status).toBe("mixed");
  });
});
