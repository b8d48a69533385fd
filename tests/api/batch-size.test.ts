import { describe, expect, it } from "vitest";
import { editAt, makeShop } from "../support/test-app";
import { addMaterial } from "../support/finish-fixtures";
import type { JobPlanDto } from "../../shared/schemas/plan.schema";
import { batchShortfall, withWasteAllowance } from "../../shared/domain/batch-size";

/*
 * Issue 14, item 6: the estimate adds the shop's waste allowance per layer kind and is at least the minimum batch;
 * a batch smaller than its layer needs is warned; a candy must be one batch for all parts.
 * Volume for a film build (mix engine volumeNeeded): area × dry film / (volume solids × transfer efficiency).
 * Job A's item is 1.2 m² (tests/support/test-app.ts); 2 coats × 25 µm dry at 50 % solids and 50 % transfer:
 * 1.2 m² × 50 µm / (0.5 × 0.5) = 240 mL theoretical (1 µm over 1 m² = 1 mL).
 */
async function jobWithCandy() {
  const s = await makeShop();
  const clear = addMaterial(s, { code: "S9-B09", name: "Test intercoat", category: "intercoat_clear", purchaseUnit: "gallon", costCents: 10000, volumeSolidsPct: 50, vocGPerL: 600 });
  const plan = (await s.as("estimator").post(`/api/jobs/${s.jobA.id}/plan`).send({})).body;
  const layer = (kind: string, name: string) => ({ kind, name, coats: 2, flashMinutes: 10, dryMinutes: 30, dryFilmPerCoat: 25, dryFilmUnit: "um", transferEfficiencyPct: 50, components: [{ materialId: clear.id, label: "clear", parts: 1 }] });
  const saved = await s.as("estimator").put(`/api/plans/${plan.id}`).send({ name: "Candy", version: plan.version, layers: [layer("candy", "Candy red"), layer("intercoat_clear", "Intercoat")] });
  expect(saved.status).toBe(200);
  return { s, layers: saved.body.latest.layers as { id: number }[] };
}

describe("waste allowance and minimum batch in the estimate", () => {
  it("adds the allowance for the layer's kind, and cost follows the volume", async () => {
    const { s } = await jobWithCandy();
    const before = ((await s.as("owner").get(`/api/jobs/${s.jobA.id}/plan`)).body as JobPlanDto).estimate!;
    const area = before.totalAreaM2;
    const theoretical = (area * 50) / (0.5 * 0.5);
    expect(before.layers[0]).toMatchObject({ wasteAllowancePct: 0 });
    expect(before.layers[0]!.volumeMl).toBeCloseTo(theoretical, 9);
    await editAt(s, "owner", "/api/settings", { wasteAllowances: [{ layerKind: "candy", pct: 15 }], minimumBatchMl: 0 });
    const after = ((await s.as("owner").get(`/api/jobs/${s.jobA.id}/plan`)).body as JobPlanDto).estimate!;
    expect(after.layers[0]!.theoreticalMl).toBeCloseTo(theoretical, 9);
    expect(after.layers[0]!.wasteAllowancePct).toBe(15);
    expect(after.layers[0]!.volumeMl).toBeCloseTo(theoretical * 1.15, 9);
    expect(after.layers[0]!.costCents! / before.layers[0]!.costCents!).toBeCloseTo(1.15, 2);
    // The intercoat has no allowance set: unchanged.
    expect(after.layers[1]!.volumeMl).toBeCloseTo(theoretical, 9);
    expect(after.totalVolumeMl).toBeCloseTo(theoretical * 2.15, 9);
  });

  it("never estimates less than the minimum batch", async () => {
    const { s } = await jobWithCandy();
    await editAt(s, "owner", "/api/settings", { minimumBatchMl: 5000 });
    const e = ((await s.as("owner").get(`/api/jobs/${s.jobA.id}/plan`)).body as JobPlanDto).estimate!;
    expect(e.layers.map((l) => l.volumeMl)).toEqual([5000, 5000]);
    const bad = await editAt(s, "owner", "/api/settings", { minimumBatchMl: -5, wasteAllowances: [{ layerKind: "glitter", pct: 10 }] });
    expect(bad.status).toBe(400);
  });
});

describe("a batch smaller than its layer needs", () => {
  it("a candy batch short of the whole layer says to mix it all at once; a big enough one has no warning", async () => {
    const { s, layers } = await jobWithCandy();
    await editAt(s, "owner", "/api/settings", { wasteAllowances: [{ layerKind: "candy", pct: 15 }] });
    const need = ((await s.as("owner").get(`/api/jobs/${s.jobA.id}/plan`)).body as JobPlanDto).estimate!.layers[0]!.volumeMl;
    const small = await s.as("painter").post("/api/mix-sheets").send({ jobId: s.jobA.id, layerId: layers[0]!.id, mode: "total", amount: Math.floor(need) - 30, unit: "mL" });
    expect(small.status).toBe(201);
    expect(small.body.needMl).toBeCloseTo(need, 9);
    expect(small.body.batchWarning).toMatch(/Mix it all at once: one batch for all parts/);
    const enough = await s.as("painter").post("/api/mix-sheets").send({ jobId: s.jobA.id, layerId: layers[0]!.id, mode: "total", amount: Math.ceil(need), unit: "mL" });
    expect(enough.body.batchWarning).toBeNull();
  });

  it("other layers count the batches mixed before; the pure rule names the shortfall", async () => {
    const { s, layers } = await jobWithCandy();
    const need = ((await s.as("owner").get(`/api/jobs/${s.jobA.id}/plan`)).body as JobPlanDto).estimate!.layers[1]!.volumeMl;
    const first = await s.as("painter").post("/api/mix-sheets").send({ jobId: s.jobA.id, layerId: layers[1]!.id, mode: "total", amount: 100, unit: "mL" });
    expect(first.body.batchWarning).toMatch(/This batch is 100 mL; the layer needs about/);
    expect((await s.as("painter").post(`/api/mix-sheets/${first.body.id}/record`).send({ lines: [] })).status).toBe(200);
    const second = await s.as("painter").post("/api/mix-sheets").send({ jobId: s.jobA.id, layerId: layers[1]!.id, mode: "total", amount: Math.ceil(need) - 100, unit: "mL" });
    expect(second.body.batchWarning).toBeNull();

    expect(withWasteAllowance(508 / 1.15, 15, 0)).toBeCloseTo(508, 9);
    expect(withWasteAllowance(0, 15, 250)).toBe(0);
    // The trial's case: a 473 mL candy batch against a layer that needs 508 mL.
    expect(batchShortfall("candy", 508, 473, 0)).toMatchObject({ shortMl: 35 });
    expect(batchShortfall("candy", 508, 473, 100)).toMatchObject({ shortMl: 35 }); // an earlier candy batch does not count
    expect(batchShortfall("clear", 508, 473, 100)).toBeNull();
  });
});
