import { describe, expect, it } from "vitest";
import { editAt, makeShop } from "../support/test-app";
import { addMaterial } from "../support/finish-fixtures";
import type { BoothDto } from "../../shared/schemas/booth.schema";
import type { JobPlanDto } from "../../shared/schemas/plan.schema";

/*
 * Issue 14, item 5: a layer whose mixed VOC is over the shop's own limit for its category is flagged before mixing,
 * in the plan's estimate (the plan editor and plan page), on the mix sheet and on the booth card.
 * Mixed VOC with no water or exempt compounds is the volume-weighted mean (40 CFR 59.104(a)(1), as mixVoc):
 * 1 part at 700 g/L + 1 part at 760 g/L → 730 g/L.
 */
async function candyJob() {
  const s = await makeShop();
  await editAt(s, "owner", "/api/settings", { vocLimits: [{ layerKind: "candy", limitGPerL: 630 }] });
  const clear = addMaterial(s, { code: "S9-B08", name: "Test intercoat", category: "intercoat_clear", purchaseUnit: "gallon", costCents: 1000, vocGPerL: 700, volumeSolidsPct: 20 });
  const toner = addMaterial(s, { code: "S9-B15", name: "Test toner", category: "toner", purchaseUnit: "pint", costCents: 1000, vocGPerL: 760, volumeSolidsPct: 30 });
  const sealer = addMaterial(s, { code: "S9-B13", name: "Test sealer", category: "sealer", purchaseUnit: "quart", costCents: 1000, vocGPerL: 900, volumeSolidsPct: 50 });
  const plan = (await s.as("estimator").post(`/api/jobs/${s.jobA.id}/plan`).send({})).body;
  const saved = await s
    .as("estimator")
    .put(`/api/plans/${plan.id}`)
    .send({
      name: "Candy",
      version: plan.version,
      layers: [
        { kind: "sealer", name: "Sealer", coats: 1, flashMinutes: 5, dryMinutes: 5, components: [{ materialId: sealer.id, label: "sealer", parts: 1 }] },
        {
          kind: "candy",
          name: "Candy red",
          coats: 4,
          flashMinutes: 10,
          dryMinutes: 30,
          components: [
            { materialId: clear.id, label: "clear", parts: 1 },
            { materialId: toner.id, label: "toner", parts: 1 },
          ],
        },
      ],
    });
  expect(saved.status).toBe(200);
  return { s, layers: saved.body.latest.layers as { id: number }[] };
}

describe("VOC over the shop's limit, before mixing", () => {
  it("flags the layer in the plan's estimate with the limit; a category with no limit is never flagged", async () => {
    const { s } = await candyJob();
    const res = (await s.as("painter").get(`/api/jobs/${s.jobA.id}/plan`)).body as JobPlanDto;
    const [sealer, candy] = res.estimate!.layers;
    expect(candy).toMatchObject({ vocLimitGPerL: 630, vocOverLimit: true });
    expect(candy!.vocGPerL).toBeCloseTo(730, 9);
    expect(sealer).toMatchObject({ vocGPerL: 900, vocLimitGPerL: null, vocOverLimit: false });
    // The plan editor reads the limits from the money-free settings every staff member may read.
    expect((await s.as("painter").get("/api/settings/shop")).body.vocLimits).toEqual([{ layerKind: "candy", limitGPerL: 630 }]);
  });

  it("warns on the draft mix sheet and on the booth card", async () => {
    const { s, layers } = await candyJob();
    const sheet = await s.as("painter").post("/api/mix-sheets").send({ jobId: s.jobA.id, layerId: layers[1]!.id, mode: "total", amount: 500, unit: "mL" });
    expect(sheet.status).toBe(201);
    expect(sheet.body).toMatchObject({ status: "draft", vocLimitGPerL: 630, vocOverLimit: true });
    expect(sheet.body.vocGPerL).toBeCloseTo(730, 9);
    const card = (await s.as("painter").get(`/api/jobs/${s.jobA.id}/booth`)).body as BoothDto;
    expect(card.layers.map((l) => [l.name, l.vocOverLimit, l.vocLimitGPerL])).toEqual([
      ["Sealer", false, null],
      ["Candy red", true, 630],
    ]);
  });

  it("raising the limit above the mix clears the warning (compared unrounded)", async () => {
    const { s } = await candyJob();
    await editAt(s, "owner", "/api/settings", { vocLimits: [{ layerKind: "candy", limitGPerL: 730 }] });
    const res = (await s.as("painter").get(`/api/jobs/${s.jobA.id}/plan`)).body as JobPlanDto;
    expect(res.estimate!.layers[1]).toMatchObject({ vocLimitGPerL: 730, vocOverLimit: false });
  });
});
