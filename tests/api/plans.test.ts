import { describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { auditLog, jobs, planVersions } from "../../server/db/schema";
import { addItem, addJob, makeShop } from "../support/test-app";
import { addMaterial, finishFixtures, keysOf, MONEY_KEY, type FinishFixtures } from "../support/finish-fixtures";
import { estimateJobPlan } from "../../server/modules/plans/plan-estimate.service";
import { jobItems } from "../../server/db/schema";

const clearLayer = (f: FinishFixtures, extra: object = {}) => ({
  kind: "clear",
  name: "Clear",
  coats: 1,
  flashMinutes: 10,
  dryMinutes: 60,
  dryFilmPerCoat: 2,
  dryFilmUnit: "mil",
  transferEfficiencyPct: 65,
  components: [
    { materialId: f.clear.id, label: "clear", parts: 4 },
    { materialId: f.hardener.id, label: "hardener", parts: 1 },
    { materialId: f.reducer.id, label: "reducer", parts: 1 },
  ],
  ...extra,
});

const sealerLayer = (f: FinishFixtures) => ({
  kind: "sealer",
  name: "Sealer",
  coats: 2,
  flashMinutes: 5,
  dryMinutes: 30,
  components: [
    { materialId: f.clear.id, label: "sealer", parts: 2 },
    { materialId: f.reducer.id, label: "reducer", percent: 10, percentOf: ["sealer"] },
  ],
});

describe("plan templates", () => {
  it("the office saves a template; layers come back in order with their components, catalogue figures and cautions", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    const res = await s.as("estimator").post("/api/plans").send({ name: "Sealer and clear", layers: [sealerLayer(f), clearLayer(f)] });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ name: "Sealer and clear", isTemplate: true, jobId: null, versionCount: 1 });
    const layers = res.body.latest.layers;
    expect(layers.map((l: { name: string; position: number }) => [l.position, l.name])).toEqual([
      [1, "Sealer"],
      [2, "Clear"],
    ]);
    expect(layers[0].components[1]).toMatchObject({ label: "reducer", percent: 10, percentOf: ["sealer"], parts: null, materialCode: "S9-B10", flammable: true });
    expect(layers[1].components.map((c: { label: string }) => c.label)).toEqual(["clear", "hardener", "reducer"]);
    // The clear layer uses an isocyanate hardener and a solvent reducer (shared/domain/safety.ts).
    expect(layers[1].cautions.map((c: { id: string }) => c.id)).toEqual(["isocyanates", "flammable", "defer"]);
    expect(layers[1].potLifeMinutes).toBe(90);
    expect(layers[1].components[0].costCents).toBe(9500);

    const list = await s.as("painter").get("/api/plans");
    expect(list.body.map((p: { name: string }) => p.name)).toEqual(["Sealer and clear", "Test clear over anything"]);
    expect(list.body[0]).toMatchObject({ layerCount: 2, layerKinds: ["sealer", "clear"] });
    const asPainter = await s.as("painter").get(`/api/plans/${res.body.id}`);
    expect(asPainter.status).toBe(200);
    expect(keysOf(asPainter.body).filter((k) => MONEY_KEY.test(k))).toEqual([]);
    expect((await s.as("painter").put(`/api/plans/${res.body.id}`).send({ name: "x", layers: [] })).status).toBe(403);
    expect((await s.as("customer").get(`/api/plans/${res.body.id}`)).status).toBe(403);
  });

  it("a mix that does not resolve is a 400 naming that layer's component field", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    const unknownName = clearLayer(f, {
      components: [
        { materialId: f.clear.id, label: "clear", parts: 4 },
        { materialId: f.reducer.id, label: "reducer", percent: 10, percentOf: ["base"] },
      ],
    });
    let res = await s.as("owner").post("/api/plans").send({ name: "Broken", layers: [sealerLayer(f), unknownName] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ "layers.1.components.1.percentOf": expect.stringMatching(/unknown component "base"/) });
    expect(res.body.error.message).toMatch(/^Layer 2 \(Clear\)/);

    const both = clearLayer(f, { components: [{ materialId: f.clear.id, label: "clear", parts: 4, percent: 5, percentOf: ["clear"] }] });
    res = await s.as("owner").post("/api/plans").send({ name: "Broken", layers: [both] });
    expect(Object.keys(res.body.error.fields)).toEqual(["layers.0.components.0.parts"]);

    const twice = clearLayer(f, { components: [{ materialId: f.clear.id, label: "clear", parts: 4 }, { materialId: f.hardener.id, label: "clear", parts: 1 }] });
    res = await s.as("owner").post("/api/plans").send({ name: "Broken", layers: [twice] });
    expect(Object.keys(res.body.error.fields)).toEqual(["layers.0.components.0.label"]);

    const noMaterial = clearLayer(f, { components: [{ materialId: 99999, label: "clear", parts: 4 }] });
    res = await s.as("owner").post("/api/plans").send({ name: "Broken", layers: [noMaterial] });
    expect(Object.keys(res.body.error.fields)).toEqual(["layers.0.components.0.materialId"]);

    res = await s.as("owner").post("/api/plans").send({ name: "Broken", layers: [{ ...clearLayer(f), kind: "primer", coats: "many" }] });
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["layers.0.coats", "layers.0.kind"]);
  });
});

describe("a job's plan and its versions", () => {
  it("starts a job's plan from a template, refuses a second one, and copies another job's plan", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    // Job A's plan was started from the template in the fixtures.
    expect(f.jobPlan).toMatchObject({ jobId: s.jobA.id, isTemplate: false, copiedFromPlanId: f.template.id, copiedFromName: "Test clear over anything" });
    expect(f.jobPlan.latest.layers).toHaveLength(1);
    const again = await s.as("owner").post(`/api/jobs/${s.jobA.id}/plan`).send({ fromPlanId: f.template.id });
    expect(again.status).toBe(409);

    const copy = await s.as("estimator").post(`/api/jobs/${s.jobB.id}/plan`).send({ fromJobId: s.jobA.id });
    expect(copy.status).toBe(201);
    expect(copy.body.latest.layers.map((l: { name: string }) => l.name)).toEqual(["Clear"]);
    expect(copy.body.latest.note).toMatch(/Copied from/);
    const blank = await s.as("owner").post(`/api/jobs/${s.inquiryA.id}/plan`).send({});
    expect(blank.status).toBe(201);
    expect(blank.body.latest.layers).toEqual([]);
    const none = await s.as("owner").post(`/api/jobs/${s.inquiryA.id}/plan`).send({ fromJobId: 99999 });
    expect(none.status).toBe(409);
    const job = addJob(s, s.customerB.id, { title: "Fender" });
    expect((await s.as("owner").post(`/api/jobs/${job.id}/plan`).send({ fromJobId: 99999 })).status).toBe(400);
    expect((await s.as("owner").post(`/api/jobs/${job.id}/plan`).send({ fromPlanId: "x" })).status).toBe(400);
  });

  it("saving an unused version changes it in place; once used at the booth it is frozen: a save makes version 2 and version 1 reads the same", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    // A draft mix sheet refers to version 1: drop it so the version is free, then save in place.
    expect((await s.as("owner").delete(`/api/mix-sheets/${f.sheet.id}`)).status).toBe(204);
    let saved = await s.as("owner").put(`/api/plans/${f.jobPlan.id}`).send({ name: "Helmet plan", layers: [sealerLayer(f), clearLayer(f)], version: 1 });
    expect(saved.status).toBe(200);
    expect(saved.body).toMatchObject({ name: "Helmet plan", versionCount: 1 });
    expect(saved.body.latest).toMatchObject({ version: 1, locked: false, frozenAt: null });
    const v1Id = saved.body.latest.id;

    // Used at the booth: record a batch of the clear layer.
    const clear = saved.body.latest.layers[1];
    const sheet = await s.as("painter").post("/api/mix-sheets").send({ jobId: s.jobA.id, layerId: clear.id, mode: "total", amount: 300, unit: "mL" });
    expect((await s.as("painter").post(`/api/mix-sheets/${sheet.body.id}/record`).send({ lines: [] })).status).toBe(200);
    const before = await s.as("owner").get(`/api/plans/${f.jobPlan.id}/versions/${v1Id}`);
    expect(before.body.frozenAt).not.toBeNull();
    expect(s.db.select().from(jobs).where(eq(jobs.id, s.jobA.id)).get()!.sprayedPlanVersionId).toBe(v1Id);

    // More candy coats: a save now makes version 2.
    saved = await s.as("estimator").put(`/api/plans/${f.jobPlan.id}`).send({ name: "Helmet plan", versionNote: "Three coats of clear", layers: [clearLayer(f, { coats: 3 })], version: saved.body.version });
    expect(saved.status).toBe(200);
    expect(saved.body).toMatchObject({ versionCount: 2, sprayedVersionId: v1Id });
    expect(saved.body.latest).toMatchObject({ version: 2, locked: false, note: "Three coats of clear" });
    expect(saved.body.latest.layers.map((l: { coats: number }) => l.coats)).toEqual([3]);

    const after = await s.as("owner").get(`/api/plans/${f.jobPlan.id}/versions/${v1Id}`);
    expect(after.body).toEqual(before.body);
    const versions = await s.as("painter").get(`/api/plans/${f.jobPlan.id}/versions`);
    expect(versions.body.map((v: { version: number; locked: boolean; sprayed: boolean; layerCount: number }) => [v.version, v.locked, v.sprayed, v.layerCount])).toEqual([
      [2, false, false, 1],
      [1, true, true, 2],
    ]);
    // Saving again changes version 2 in place (it is not used yet).
    saved = await s.as("estimator").put(`/api/plans/${f.jobPlan.id}`).send({ name: "Helmet plan", layers: [clearLayer(f, { coats: 2 })], version: saved.body.version });
    expect(saved.body.versionCount).toBe(2);
    expect(s.db.select().from(planVersions).where(eq(planVersions.planId, f.jobPlan.id)).all()).toHaveLength(2);

    // Every change is in the audit log as a plan change.
    const entries = s.db.select().from(auditLog).where(eq(auditLog.kind, "plan")).all();
    expect(entries.map((e) => e.action)).toEqual(["created", "created", "updated", "frozen", "version_created", "updated"]);
    // A plan that was used cannot be deleted.
    expect((await s.as("owner").delete(`/api/plans/${f.jobPlan.id}`)).status).toBe(409);
  });

  it("a version of another plan, or a plan of a job the painter does not reach, reads as not found", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    expect((await s.as("owner").get(`/api/plans/${f.template.id}/versions/${f.jobPlan.latest.id}`)).status).toBe(404);
    const other = await s.as("owner").post(`/api/jobs/${s.jobB.id}/plan`).send({ fromPlanId: f.template.id });
    expect((await s.as("painter").get(`/api/plans/${other.body.id}`)).status).toBe(404);
    expect((await s.as("painter").get(`/api/jobs/${s.jobB.id}/plan`)).status).toBe(404);
    const jobPlans = await s.as("painter").get("/api/plans?kind=job");
    expect(jobPlans.body.map((p: { jobId: number }) => p.jobId)).toEqual([s.jobA.id]);
    expect((await s.as("owner").get("/api/plans?kind=job")).body).toHaveLength(2);
    expect((await s.as("owner").get("/api/plans?kind=recipe")).status).toBe(400);
  });

  it("saves a job's plan as a new template", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    const res = await s.as("estimator").post(`/api/plans/${f.jobPlan.id}/copy-as-template`).send({ name: "Teal helmet recipe" });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ name: "Teal helmet recipe", isTemplate: true, copiedFromPlanId: f.jobPlan.id });
    expect(res.body.latest.layers).toHaveLength(1);
  });
});

describe("estimate", () => {
  it("works out the clear's volume, cost and VOC from the job's areas (references.md §2 and §7)", async () => {
    const s = await makeShop();
    finishFixtures(s);
    // Job A's only item is 0.6 m²; make it 25 ft² (the worked job-volume case).
    s.db.update(jobItems).set({ surfaceArea: 25, areaUnit: "ft2" }).where(eq(jobItems.id, s.itemA.id)).run();
    const res = await s.as("owner").get(`/api/jobs/${s.jobA.id}/plan`);
    expect(res.status).toBe(200);
    const layer = res.body.estimate.layers[0];
    // 25 ft², 2.0 mil DFT, 50 % volume solids (4:1:1 of 60/60/0 %), 65 % TE → 0.095904 gal = 363.04 mL RTS
    // (references.md §2 "job volume (US)", computed from the 1604.1667 ft²·mil/gal constant).
    expect(layer.volumeSolidsPct).toBeCloseTo(50, 10);
    expect(layer.volumeMl).toBeCloseTo(363.04, 2);
    // 4:1:1 clear $95.00/qt, hardener $60.00/pt, reducer $40.00/gal → $0.089818/mL → $32.61 (references.md §7, rounded once).
    expect(layer.costCents).toBe(3261);
    expect(res.body.estimate.totalCostCents).toBe(3261);
    // VOC of the mix, volume-weighted (no water or exempt compounds; 40 CFR 59.104 form): (4·500 + 300 + 880)/6 = 530 g/L.
    expect(layer.vocGPerL).toBeCloseTo(530, 9);
    expect(layer.cautions.map((c: { id: string }) => c.id)).toEqual(["isocyanates", "flammable", "defer"]);

    const painter = await s.as("painter").get(`/api/jobs/${s.jobA.id}/plan`);
    expect(painter.body.estimate.layers[0].volumeMl).toBeCloseTo(363.04, 2);
    expect(keysOf(painter.body).filter((k) => MONEY_KEY.test(k))).toEqual([]);
  });

  it("metric areas, a 2:1:1 VOC and layers that cannot be estimated", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    const base = addMaterial(s, { code: "S9-B03", name: "Test base", category: "ground_coat", purchaseUnit: "L", costCents: 8000, volumeSolidsPct: 50, vocGPerL: 500 });
    const job = addJob(s, s.customerA.id, { title: "Metric job" });
    addItem(s, job.id, "Panel");
    s.db.update(jobItems).set({ surfaceArea: 2.3, areaUnit: "m2" }).where(eq(jobItems.jobId, job.id)).run();
    const plan = await s.as("owner").post(`/api/jobs/${job.id}/plan`).send({});
    const doc = {
      name: "Metric",
      layers: [
        // One part, 50 % VS, 50 µm, 65 % TE on 2.3 m² → 0.353846 L = 353.85 mL (references.md §2 "job volume (metric)").
        { kind: "ground_coat", name: "Base", coats: 1, flashMinutes: 5, dryMinutes: 20, dryFilmPerCoat: 50, dryFilmUnit: "um", transferEfficiencyPct: 65, components: [{ materialId: base.id, label: "base", parts: 1 }] },
        // 2:1:1 base 500 : hardener 300 : reducer 880 g/L → 545 g/L (references.md §3 "2K mix (volume-weighted)").
        {
          kind: "clear",
          name: "Two-one-one",
          coats: 1,
          flashMinutes: 5,
          dryMinutes: 20,
          components: [
            { materialId: base.id, label: "base", parts: 2 },
            { materialId: f.hardener.id, label: "hardener", parts: 1 },
            { materialId: f.reducer.id, label: "reducer", parts: 1 },
          ],
        },
        { kind: "prep", name: "Scuff and clean", coats: 1, flashMinutes: 0, dryMinutes: 0, components: [] },
      ],
    };
    expect((await s.as("owner").put(`/api/plans/${plan.body.id}`).send({ ...doc, version: plan.body.version })).status).toBe(200);
    const e = estimateJobPlan(s.app.deps, job.id)!;
    expect(e.totalAreaM2).toBeCloseTo(2.3, 12);
    expect(e.layers[0]!.volumeMl).toBeCloseTo(353.846, 3);
    // 0.353846 L of base at $80.00/L → 2830.77 cents → 2831 (rounded once).
    expect(e.layers[0]!.costCents).toBe(2831);
    expect(e.layers[1]!.vocGPerL).toBeCloseTo(545, 9);
    expect(e.layers[1]!).toMatchObject({ volumeMl: 0, costCents: 0, problem: "No dry film per coat is set" });
    expect(e.layers[2]!).toMatchObject({ volumeMl: 0, problem: null, vocGPerL: null });
    expect(e.totalVolumeMl).toBeCloseTo(353.846, 3);
    expect(e.problems).toEqual(["Two-one-one: No dry film per coat is set"]);
    expect(estimateJobPlan(s.app.deps, s.jobB.id)).toBeNull();
  });
});
