import { describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { makeShop, type Shop, editAt } from "../support/test-app";
import { addBoothPlan, addCoat, addMixedSheet, addPanel, addPhoto, readyForBooth } from "../support/booth-fixtures";
import { binary, pdfText } from "../support/pdf-text";
import { coatLogs, guns, jobs, materialLots, materials, mixSheetLines, planLayers } from "../../server/db/schema";
import { PSI_PER_BAR, toCm, toPsi } from "../../shared/domain/spray-setup";
import type { FinishRecordDto, RepeatFinishDto } from "../../shared/schemas/finish-record.schema";
import type { PanelDto, PanelLadderDto } from "../../shared/schemas/panel.schema";
import type { BoothDto } from "../../shared/schemas/booth.schema";

const MIN = 60_000;
const T0 = Date.parse("2035-06-01T09:00:00Z");

function addGun(s: Shop, name = "Gun 2 (candy)") {
  return s.db.insert(guns).values({ name, description: "HVLP, 1.3 mm" }).returning().get();
}

describe("unit conversions of the spray set-up", () => {
  it("bar → psi and in → cm follow the exact definitions", () => {
    // NIST SP 811 appendix B: 1 psi = 6.894 757 kPa, 1 bar = 100 kPa → 1 bar = 14.5038 psi.
    expect(PSI_PER_BAR).toBeCloseTo(14.5038, 4);
    expect(toPsi(2, "bar")).toBeCloseTo(29.0075, 4);
    expect(toPsi(26, "psi")).toBe(26);
    // 1 in = 2.54 cm exactly (international yard and pound agreement, 1959).
    expect(toCm(6, "in")).toBeCloseTo(15.24, 12);
  });
});

describe("the shop's gun list", () => {
  it("the office adds and renames guns, names are unique, painters read the list", async () => {
    const s = await makeShop();
    const created = await s.as("estimator").post("/api/guns").send({ name: "Gun 1 (primer)", description: "HVLP, 1.8 mm" });
    expect(created.status).toBe(201);
    expect((await s.as("owner").post("/api/guns").send({ name: "gun 1 (PRIMER)" })).status).toBe(409);
    expect((await s.as("owner").post("/api/guns").send({ name: "" })).body.error.fields).toHaveProperty("name");
    const renamed = await s.as("owner").patch(`/api/guns/${created.body.id}`).send({ name: "Gun 1 (sealer)", active: false, version: created.body.version });
    expect(renamed.body).toMatchObject({ name: "Gun 1 (sealer)", active: false });
    addGun(s);
    const list = await s.as("painter").get("/api/guns");
    expect(list.body.map((g: { name: string }) => g.name)).toEqual(["Gun 2 (candy)", "Gun 1 (sealer)"]); // active first
    expect((await s.as("painter").post("/api/guns").send({ name: "Mine" })).status).toBe(403);
  });
});

describe("spray set-up on coat logs", () => {
  it("keeps the gun, tip, pressure, distance, fan and overlap of each coat, and says which unit is missing", async () => {
    const clock = { now: T0 };
    const s = await makeShop({ now: () => clock.now });
    readyForBooth(s);
    const gun = addGun(s);
    const b = (await s.as("painter").get(`/api/jobs/${s.jobA.id}/booth`)).body as BoothDto;
    if (b.next.state !== "spray") throw new Error("expected a coat to spray");
    const base = { jobId: s.jobA.id, layerId: b.next.layerId, coatNumber: 1 };

    const noUnit = await s.as("painter").post("/api/coat-logs").send({ ...base, inletPressure: 26, distance: 15 });
    expect(noUnit.status).toBe(400);
    expect(Object.keys(noUnit.body.error.fields).sort()).toEqual(["distanceUnit", "pressureUnit"]);
    const tooHigh = await s.as("painter").post("/api/coat-logs").send({ ...base, inletPressure: 26, pressureUnit: "bar" });
    expect(tooHigh.body.error.fields.inletPressure).toMatch(/bar must be between 0.1 and 7/);
    expect((await s.as("painter").post("/api/coat-logs").send({ ...base, gunId: 4242 })).body.error.fields).toHaveProperty("gunId");

    const ok = await s
      .as("painter")
      .post("/api/coat-logs")
      .send({ ...base, gunId: gun.id, tipMm: 1.3, inletPressure: 1.8, pressureUnit: "bar", distance: 15, fanWidth: 25, distanceUnit: "cm", overlapPct: 50 });
    expect(ok.status).toBe(201);
    const entry = (ok.body as BoothDto).coatLogs.at(-1)!;
    expect(entry.setup).toMatchObject({ gunId: gun.id, gunName: "Gun 2 (candy)", tipMm: 1.3, inletPressure: 1.8, pressureUnit: "bar", distance: 15, fanWidth: 25, distanceUnit: "cm", overlapPct: 50 });
    expect(entry.setup.summary).toBe("Gun 2 (candy) · 1.3 mm tip · 1.8 bar at the inlet · 15 cm from the part · fan 25 cm · 50 % overlap");

    // A correction of the time keeps the set-up of the coat it corrects.
    clock.now += 10 * MIN;
    const fixed = await s.as("painter").post(`/api/coat-logs/${entry.id}/corrections`).send({ reason: "Tapped late", at: new Date(T0 - MIN).toISOString() });
    expect(fixed.status).toBe(201);
    expect((fixed.body as BoothDto).coatLogs.at(-1)!.setup.tipMm).toBe(1.3);
  });
});

describe("test panels as a spray record", () => {
  it("a panel keeps its ground from the catalogue, its set-up, readings under several lights and its batch with lots", async () => {
    const s = await makeShop();
    const plan = addBoothPlan(s, s.jobA.id);
    const sheet = addMixedSheet(s, s.jobA.id, plan.version.id, plan.layers[1]!.id, Date.now());
    const ground = s.db.insert(materials).values({ code: "G-117", name: "Silver ground, fine", category: "ground_coat", purchaseUnit: "L", costCents: 4000 }).returning().get();
    const gun = addGun(s);
    const res = await s
      .as("painter")
      .post("/api/panels")
      .send({
        groundMaterialId: ground.id,
        candyName: "Candy garnet",
        letDownClear: 6,
        letDownToner: 1,
        coats: 4,
        jobId: s.jobA.id,
        planLayerId: plan.layers[1]!.id,
        mixSheetId: sheet.id,
        labL: 34.2,
        labA: 48.1,
        labB: 20.3,
        readings: [
          { light: "booth", illuminant: "F11", labL: 33.9, labA: 46.5, labB: 22.4 },
          { light: "warm_indoor", illuminant: "A", labL: 35.1, labA: 52.7, labB: 27.9 },
        ],
        gunId: gun.id,
        tipMm: 1.3,
        inletPressure: 26,
        pressureUnit: "psi",
        distance: 6,
        fanWidth: 10,
        distanceUnit: "in",
        overlapPct: 75,
        boothTemp: 70,
        tempUnit: "F",
        humidityPct: 45,
      });
    expect(res.status).toBe(201);
    const panel = res.body as PanelDto;
    expect(panel.groundName).toBe("Silver ground, fine");
    expect(panel.readings).toEqual([
      { light: "booth", illuminant: "F11", lab: { L: 33.9, a: 46.5, b: 22.4 } },
      { light: "warm_indoor", illuminant: "A", lab: { L: 35.1, a: 52.7, b: 27.9 } },
    ]);
    expect(panel.setup.summary).toBe("Gun 2 (candy) · 1.3 mm tip · 26 psi at the inlet · 6 in from the part · fan 10 in · 75 % overlap");
    expect(panel.conditions).toEqual({ boothTemp: 70, tempUnit: "F", humidityPct: 45 });
    expect(panel.planLayer).toMatchObject({ id: plan.layers[1]!.id, name: "Candy garnet", version: 1 });
    expect(panel.mixSheet).toMatchObject({ id: sheet.id, status: "mixed", lots: [{ lotNumber: "LOT-T1" }] });

    // One reading per light; a photo says which light it was taken under.
    const twice = await editAt(s, "painter", `/api/panels/${panel.id}`, { readings: [panel.readings[0]!, panel.readings[0]!].map((r) => ({ light: r.light, illuminant: r.illuminant, labL: 1, labA: 1, labB: 1 })) });
    expect(twice.status).toBe(400);
    const photo = await addPhoto(s, { ownerType: "panel", ownerId: panel.id, jobId: s.jobA.id });
    const lit = await s.as("painter").patch(`/api/uploads/${photo.id}`).send({ light: "warm_indoor", version: photo.version });
    expect(lit.body.light).toBe("warm_indoor");
    const again = (await s.as("painter").get(`/api/panels/${panel.id}`)).body as PanelDto;
    expect(again.photos.map((p) => p.light)).toEqual(["warm_indoor"]);
    // An update that leaves the readings out keeps them.
    await editAt(s, "painter", `/api/panels/${panel.id}`, { notes: "Sprayed late in the day" });
    expect(((await s.as("painter").get(`/api/panels/${panel.id}`)).body as PanelDto).readings).toHaveLength(2);
    // No ground at all is refused, naming the field to pick it in.
    const none = await s.as("painter").post("/api/panels").send({ candyName: "Candy garnet", letDownClear: 6, letDownToner: 1, coats: 4 });
    expect(none.body.error.fields).toHaveProperty("groundMaterialId");
  });

  it("the depth ladder follows depth, not the coat count: 4 coats at 10:1 come before 3 coats at 6:1", async () => {
    const s = await makeShop();
    // Depth = toner fraction × coats (Beer–Lambert, references.md §6): 3 × 1/7 = 0.4286 > 4 × 1/11 = 0.3636.
    const six = addPanel(s, { coats: 3, letDownClear: 6, letDownToner: 1, labL: 30, labA: 50, labB: 25 });
    const ten = addPanel(s, { coats: 4, letDownClear: 10, letDownToner: 1, labL: 36, labA: 47, labB: 22 });
    const deep = addPanel(s, { coats: 5, letDownClear: 6, letDownToner: 1, labL: 26, labA: 49, labB: 24 });
    const ladder = (await s.as("painter").get("/api/panels/ladder?ground=Fine%20silver&candy=Candy%20garnet")).body as PanelLadderDto;
    expect(ladder.rungs.map((r) => r.panel.id)).toEqual([ten.id, six.id, deep.id]);
    expect(ladder.rungs.map((r) => r.depth)).toEqual([...ladder.rungs.map((r) => r.depth)].sort((a, b) => a - b));
    expect(ladder.rungs[0]!.depth).toBeCloseTo(4 / 11, 12);
    expect(ladder.rungs[1]!.depth).toBeCloseTo(3 / 7, 12);
  });
});

/** Job A sprayed: sealer 2 coats, candy 3 coats with a correction and a voided extra, a recorded batch with lots. */
async function sprayedJob() {
  const s = await makeShop();
  const plan = readyForBooth(s);
  const gun = addGun(s);
  const [sealer, candy, clear] = plan.layers;
  const sheet = addMixedSheet(s, s.jobA.id, plan.version.id, candy!.id, T0 - 60 * MIN);
  const line = s.db.select().from(mixSheetLines).where(eq(mixSheetLines.mixSheetId, sheet.id)).get()!;
  const lot = s.db.insert(materialLots).values({ materialId: line.materialId, lotNumber: "CG-0412", quantityOnHand: 0 }).returning().get();
  s.db.update(mixSheetLines).set({ lotId: lot.id, lotNumber: "CG-0412" }).where(eq(mixSheetLines.mixSheetId, sheet.id)).run();
  let t = T0;
  for (const n of [1, 2]) addCoat(s, s.jobA.id, plan.version.id, sealer!.id, n, (t += 12 * MIN), s.painter.id);
  const coats = [1, 2, 3, 4].map((n) => addCoat(s, s.jobA.id, plan.version.id, candy!.id, n, (t += 10 * MIN), s.painter.id));
  s.db.update(coatLogs).set({ gunId: gun.id, tipMm: 1.3, inletPressure: 1.8, pressureUnit: "bar", overlapPct: 50, note: "Internal: a run on the left cover", prepOverrideReason: null }).where(eq(coatLogs.layerId, candy!.id)).run();
  s.db.update(coatLogs).set({ prepOverrideReason: "Customer waiting; prep checked by eye" }).where(eq(coatLogs.id, coats[0]!.id)).run();
  // Coat 2's time corrected; coat 4 never happened.
  s.db.insert(coatLogs).values({ ...coats[1]!, id: undefined, at: coats[1]!.at - 2 * MIN, correctsId: coats[1]!.id, correctionReason: "Tapped late", createdAt: t + MIN }).run();
  s.db.insert(coatLogs).values({ ...coats[3]!, id: undefined, voids: true, correctsId: coats[3]!.id, correctionReason: "Logged twice", createdAt: t + 2 * MIN }).run();
  s.db.update(jobs).set({ stage: "delivered", sprayedPlanVersionId: plan.version.id }).where(eq(jobs.id, s.jobA.id)).run();
  return { s, plan, gun, sheet, lot, sealer: sealer!, candy: candy!, clear: clear!, coats };
}

describe("GET /api/jobs/:id/finish-record", () => {
  it("gives every layer with its mix, batches with poured amounts and lots, and the coats as they stand", async () => {
    const { s, plan, candy, sheet } = await sprayedJob();
    const res = await s.as("owner").get(`/api/jobs/${s.jobA.id}/finish-record`);
    expect(res.status).toBe(200);
    const r = res.body as FinishRecordDto;
    expect(r.layers.map((l) => [l.name, l.coats.length])).toEqual([
      ["Grey sealer", 2],
      ["Candy garnet", 3],
      ["2K clear", 0],
    ]);
    const c = r.layers[1]!;
    expect(c.id).toBe(candy.id);
    expect(c.batches).toEqual([expect.objectContaining({ id: sheet.id, totalMl: 300, lines: [expect.objectContaining({ plannedMl: 300, pouredMl: 301, lotNumber: "CG-0412" })] })]);
    // The layer's own material, and the batch's (with the lot poured).
    expect(c.materials).toEqual([
      { code: plan.materials.safe.code, name: "Test waterborne", lots: [] },
      { code: plan.materials.base.code, name: "Test base", lots: ["CG-0412"] },
    ]);
    expect(c.coats.map((x) => x.coatNumber)).toEqual([1, 2, 3]);
    expect(c.coats[1]!.correctionReason).toBe("Tapped late");
    expect(c.coats[1]!.at).toBe(new Date(T0 + 24 * MIN + 20 * MIN - 2 * MIN).toISOString());
    expect(c.coats[0]!.overrides).toEqual([{ rule: "prep", reason: "Customer waiting; prep checked by eye" }]);
    expect(c.coats[0]!.setup.summary).toBe("Gun 2 (candy) · 1.3 mm tip · 1.8 bar at the inlet · 50 % overlap");
    expect(c.coats[0]!.note).toBe("Internal: a run on the left cover");
    expect(r.layers[2]!.cautions.map((x) => x.id)).toContain("isocyanates");
    expect(r.painters).toEqual(["Test painter"]);
    expect(JSON.stringify(r)).not.toMatch(/cost|cents|price/i);
  });

  it("the customer's version leaves out internal notes and override reasons; other customers and painters get 404", async () => {
    const { s } = await sprayedJob();
    const mine = await s.as("customer").get(`/api/jobs/${s.jobA.id}/finish-record`);
    expect(mine.status).toBe(200);
    const r = mine.body as FinishRecordDto;
    expect(r.customerView).toBe(true);
    expect(r.layers[1]!.coats).toHaveLength(3);
    expect(JSON.stringify(r)).not.toMatch(/Internal: a run|Customer waiting|Tapped late/);
    expect((await s.as("customer").get(`/api/jobs/${s.jobB.id}/finish-record`)).status).toBe(404);
    expect((await s.as("painter").get(`/api/jobs/${s.jobB.id}/finish-record`)).status).toBe(404);
  });

  it("the PDF carries the same record", async () => {
    const { s } = await sprayedJob();
    const res = await s.as("owner").get(`/api/jobs/${s.jobA.id}/finish-record.pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toBe("application/pdf");
    const text = await pdfText(res.body as Buffer);
    for (const expected of ["Finish record", "Helmet in candy teal", "CANDY GARNET", "lot CG-0412", "poured 301 mL", "Coat 3", "1.8 bar at", "Customer waiting; prep checked by eye"])
      expect(text.replace(/\s+/g, " ")).toContain(expected);
    const customer = await pdfText((await s.as("customer").get(`/api/jobs/${s.jobA.id}/finish-record.pdf`).buffer(true).parse(binary)).body as Buffer);
    expect(customer).not.toContain("Customer waiting");
  });
});

describe("repeating a recorded finish", () => {
  it("POST /api/jobs/:id/repeat starts a job and plan with the coats and set-up as sprayed, and flags used-up lots", async () => {
    const { s, plan } = await sprayedJob();
    const res = await s.as("estimator").post(`/api/jobs/${s.jobA.id}/repeat`).send({ title: "Second helmet, same teal" });
    expect(res.status).toBe(201);
    const out = res.body as RepeatFinishDto;
    expect(out.usedUpLots).toEqual([{ materialCode: plan.materials.base.code, materialName: "Test base", lotNumber: "CG-0412" }]);
    const job = (await s.as("owner").get(`/api/jobs/${out.id}`)).body;
    expect(job).toMatchObject({ title: "Second helmet, same teal", stage: "inquiry", customerId: s.customerA.id });
    expect(job.items.map((i: { name: string }) => i.name)).toEqual(["Helmet shell"]);
    const copy = (await s.as("owner").get(`/api/jobs/${out.id}/plan`)).body.plan;
    const layers = copy.latest.layers as { name: string; coats: number; gunTip: string | null; pressurePsi: number | null; overlapPct: number | null; notes: string | null }[];
    // Planned 3 candy coats, 3 counted (a fourth was voided); the set-up of the last counted coat: 1.8 bar = 26.1 psi.
    expect(layers.map((l) => [l.name, l.coats])).toEqual([
      ["Grey sealer", 2],
      ["Candy garnet", 3],
      ["2K clear", 2],
    ]);
    expect(layers[1]).toMatchObject({ gunTip: "1.3 mm", pressurePsi: 26.1, overlapPct: 50 });
    expect(layers[1]!.notes).toContain("As sprayed: Gun 2 (candy)");
    // The source is untouched.
    expect((await s.as("owner").get(`/api/jobs/${s.jobA.id}`)).body.stage).toBe("delivered");
  });

  it("counts the coats really sprayed when they differ from the plan", async () => {
    const { s, plan, candy } = await sprayedJob();
    addCoat(s, s.jobA.id, plan.version.id, candy.id, 5, T0 + 200 * MIN, s.painter.id);
    addCoat(s, s.jobA.id, plan.version.id, candy.id, 6, T0 + 210 * MIN, s.painter.id);
    const out = (await s.as("owner").post(`/api/jobs/${s.jobA.id}/repeat`).send({})).body as RepeatFinishDto;
    const copy = (await s.as("owner").get(`/api/jobs/${out.id}/plan`)).body.plan;
    expect(copy.latest.layers[1].coats).toBe(5);
  });

  it("refuses a job with nothing sprayed, and a panel not linked to a plan layer", async () => {
    const s = await makeShop();
    addBoothPlan(s, s.jobB.id);
    expect((await s.as("owner").post(`/api/jobs/${s.jobB.id}/repeat`).send({})).status).toBe(409);
    const loose = addPanel(s);
    const res = await s.as("owner").post(`/api/panels/${loose.id}/repeat`).send({ customerId: s.customerB.id });
    expect(res.status).toBe(409);
    expect(res.body.error.fields).toHaveProperty("planLayerId");
  });

  it("POST /api/panels/:id/repeat copies the panel's plan with its coats and set-up, and approves the panel", async () => {
    const { s, candy } = await sprayedJob();
    const panel = addPanel(s, { jobId: s.jobA.id, planLayerId: candy.id, coats: 5, tipMm: 1.4, inletPressure: 24, pressureUnit: "psi" });
    const res = await s.as("owner").post(`/api/panels/${panel.id}/repeat`).send({ customerId: s.customerB.id, title: "Guitar in the garnet" });
    expect(res.status).toBe(201);
    const job = s.db.select().from(jobs).where(eq(jobs.id, res.body.id)).get()!;
    expect(job).toMatchObject({ customerId: s.customerB.id, approvedPanelId: panel.id });
    const layer = s.db.select().from(planLayers).where(eq(planLayers.name, "Candy garnet")).all().at(-1)!;
    expect(layer).toMatchObject({ coats: 5, gunTip: "1.4 mm", pressurePsi: 24 });
  });
});

describe("film build and coverage on the plan", () => {
  it("each layer shows its wet film per coat and its coverage at its transfer efficiency", async () => {
    const s = await makeShop();
    const plan = addBoothPlan(s, s.jobA.id);
    s.db.update(materials).set({ volumeSolidsPct: 52 }).where(eq(materials.id, plan.materials.safe.id)).run();
    s.db.update(planLayers).set({ dryFilmPerCoat: 1.5, dryFilmUnit: "mil", transferEfficiencyPct: 30 }).where(eq(planLayers.id, plan.layers[0]!.id)).run();
    const est = (await s.as("painter").get(`/api/jobs/${s.jobA.id}/plan`)).body.estimate;
    const film = est.layers[0].film;
    // Ron Joseph, PCRC "Calculating Paint Coverage": 1 gal at VS 52 %, TE 30 %, 1.5 mil dry covers 166.8 ft²
    // (references.md §2: 1604.1667 × 0.52 × 0.30 / 1.5).
    expect(film.ft2PerGal).toBeCloseTo(166.83, 2);
    // Same figure in metric: 1000 m²/(L·µm) × 0.52 × 0.30 / 38.1 µm.
    expect(film.m2PerL).toBeCloseTo((1000 * 0.52 * 0.3) / 38.1, 9);
    // Wet film = dry film / volume solids (references.md §2): 1.5 / 0.52 mil.
    expect(film.wetFilmPerCoat).toBeCloseTo(1.5 / 0.52, 12);
    expect(film).toMatchObject({ dryFilmPerCoat: 1.5, unit: "mil", transferEfficiencyPct: 30 });
    // A layer without a dry film figure has no film line.
    expect(est.layers[1].film).toBeNull();
  });
});
