import { describe, expect, it } from "vitest";
import { makeShop } from "../support/test-app";
import { addMaterial } from "../support/finish-fixtures";
import { addMixedBatch } from "../support/batches";
import type { ComplianceDto } from "../../shared/schemas/compliance.schema";

/*
 * Issue 14, item 5: prep and cleaning solvents are materials that can be logged as solvent use and are counted in the
 * VOC log. VOC mass = VOC (g/L less water and exempt) × litres × (1 − water and exempt share) — the same rule as a
 * batch (40 CFR 59.104(a)(1)). 1 US gallon = 3.785411784 L (NIST Handbook 44).
 */
const T0 = Date.parse("2026-10-15T10:00:00Z");

async function shop() {
  const s = await makeShop({ now: () => T0 });
  const remover = addMaterial(s, { code: "S9-B16", name: "Test wax and grease remover", category: "cleaner", purchaseUnit: "gallon", costCents: 3600, vocGPerL: 690, flammable: true });
  const gunWash = addMaterial(s, { code: "S9-B06", name: "Test gun wash", category: "cleaner", purchaseUnit: "gallon", costCents: 2000, vocGPerL: 880, waterExemptPct: 25 });
  const clear = addMaterial(s, { code: "S9-B05", name: "Test clear", category: "clear", purchaseUnit: "quart", costCents: 9000, vocGPerL: 400 });
  return { s, remover, gunWash, clear };
}

describe("solvent use", () => {
  it("the painter logs wax and grease remover on a job and gun wash with no job; the VOC figures are copied on", async () => {
    const { s, remover, gunWash } = await shop();
    const prep = await s.as("painter").post("/api/solvent-uses").send({ materialId: remover.id, jobId: s.jobA.id, purpose: "surface_prep", amount: 500, unit: "mL", note: "Tank and fenders" });
    expect(prep.status).toBe(201);
    // 690 g/L × 0.5 L = 345 g.
    expect(prep.body).toMatchObject({ materialCode: "S9-B16", category: "cleaner", jobId: s.jobA.id, purpose: "surface_prep", volumeMl: 500, vocGPerL: 690, usedAt: new Date(T0).toISOString(), loggedByName: "Test painter" });
    expect(prep.body.vocKg).toBeCloseTo(0.345, 12);
    const wash = await s.as("painter").post("/api/solvent-uses").send({ materialId: gunWash.id, purpose: "gun_cleaning", amount: 1, unit: "quart" });
    expect(wash.status).toBe(201);
    // 1 qt = 946.352946 mL; 880 g/L × 0.946352946 L × 0.75 = 624.59 g.
    expect(wash.body.volumeMl).toBeCloseTo(946.352946, 6);
    expect(wash.body.vocKg).toBeCloseTo((880 * 0.946352946 * 0.75) / 1000, 9);
    const list = await s.as("painter").get("/api/solvent-uses?from=2026-10-01&to=2026-10-31");
    expect(list.body.map((u: { materialCode: string }) => u.materialCode)).toEqual(["S9-B16", "S9-B06"]);
  });

  it("refuses paint that is not a solvent, a job the painter does not reach, and bad figures, naming the field", async () => {
    const { s, remover, clear } = await shop();
    const paint = await s.as("painter").post("/api/solvent-uses").send({ materialId: clear.id, purpose: "other", amount: 100, unit: "mL" });
    expect(paint.status).toBe(400);
    expect(paint.body.error.fields).toHaveProperty("materialId");
    expect((await s.as("painter").post("/api/solvent-uses").send({ materialId: remover.id, jobId: s.jobB.id, purpose: "surface_prep", amount: 100, unit: "mL" })).status).toBe(404);
    const bad = await s.as("painter").post("/api/solvent-uses").send({ materialId: remover.id, purpose: "washing the van", amount: -1, unit: "bucket" });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(["amount", "purpose", "unit"]);
  });

  it("counts in the VOC log: the month, the category and the totals, and the CSV", async () => {
    const { s, remover } = await shop();
    addMixedBatch(s, s.jobA.id, { layerKind: "clear", mixedAt: new Date(T0), lines: [{ ml: 1000, vocGPerL: 400, category: "clear" }] });
    await s.as("painter").post("/api/solvent-uses").send({ materialId: remover.id, purpose: "surface_prep", amount: 2, unit: "L" });
    const log = (await s.as("owner").get("/api/compliance?from=2026-10-01&to=2026-10-31")).body as ComplianceDto;
    // Batch 400 g (1 L at 400 g/L) + remover 1380 g (2 L at 690 g/L).
    expect(log.totals).toMatchObject({ batches: 1, solventUses: 1 });
    expect(log.totals.vocMass.kg).toBeCloseTo(1.78, 12);
    expect(log.totals.volumeL).toBeCloseTo(3, 12);
    expect(log.months).toEqual([expect.objectContaining({ month: "2026-10", batches: 1, solventUses: 1 })]);
    expect(log.months[0]!.vocMass.kg).toBeCloseTo(1.78, 12);
    const cleaner = log.categories.find((c) => c.category === "cleaner")!;
    expect(cleaner.vocMass.kg).toBeCloseTo(1.38, 12);
    expect(log.solventUses).toHaveLength(1);
    const csv = (await s.as("owner").get("/api/compliance/export.csv?from=2026-10-01&to=2026-10-31")).text;
    // 2 L is 0.528344 US gal (1 gal = 3.785411784 L, NIST HB44), written to the mL: 2.000 L, 0.5283 gal.
    expect(csv).toMatch(/^S\d+,2026-10-15T10:00:00.000Z,,,S9-B16 Test wax and grease remover,solvent: surface_prep,2.000,0.5283,/m);
  });
});
