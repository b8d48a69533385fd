import { describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { makeApp } from "../support/test-app";
import { seedDemo } from "../../server/db/seed/index";
import { jobs, layerComponents, materialLots, materials, mixSheets, plans, planVersions } from "../../server/db/schema";

describe("demo catalogue, plans and batches", () => {
  it("seeds an invented catalogue, three or more templates, plans on the jobs in production and recorded batches on those that reached the booth", async () => {
    const t = makeApp();
    const ctx = await seedDemo(t.db);
    const catalogue = t.db.select().from(materials).all();
    expect(catalogue.length).toBeGreaterThanOrEqual(25);
    // The shop's own stock numbers (shelf and bin, "S4-B02"), never a maker-style letters-type-number code; one shelf per
    // group of categories, and the hazard flags where the cautions need them.
    expect(catalogue.every((m) => /^S[1-7]-B\d{2}$/.test(m.code))).toBe(true);
    expect(catalogue.some((m) => /^[A-Z]{2}-[A-Z]{2}-\d+$/.test(m.code))).toBe(false);
    expect(new Set(catalogue.filter((m) => m.category === "toner").map((m) => m.code.slice(0, 2)))).toEqual(new Set(["S4"]));
    expect(catalogue.filter((m) => m.category === "hardener").every((m) => m.containsIsocyanates)).toBe(true);
    expect(catalogue.filter((m) => m.category === "reducer").every((m) => m.flammable)).toBe(true);
    expect(t.db.select().from(materialLots).all().every((l) => l.quantityOnHand >= 0)).toBe(true);

    const templates = t.db.select().from(plans).where(eq(plans.isTemplate, true)).all();
    expect(templates.length).toBeGreaterThanOrEqual(3);
    const planned = new Set(t.db.select().from(plans).where(eq(plans.isTemplate, false)).all().map((p) => p.jobId));
    for (const job of ctx.jobs.filter((j) => ["booked", "in_prep", "in_booth", "curing", "finishing", "ready", "delivered"].includes(j.stage))) {
      expect(planned.has(job.id)).toBe(true);
    }
    const sheets = t.db.select().from(mixSheets).all();
    const sprayed = ctx.jobs.filter((j) => ["in_booth", "curing", "finishing", "ready", "delivered"].includes(j.stage));
    for (const job of sprayed) {
      const mine = sheets.filter((s) => s.jobId === job.id && s.status === "mixed");
      expect(mine.length).toBeGreaterThan(0);
      // The job points at the frozen version it was sprayed with.
      const row = t.db.select().from(jobs).where(eq(jobs.id, job.id)).get()!;
      const version = t.db.select().from(planVersions).where(eq(planVersions.id, row.sprayedPlanVersionId!)).get()!;
      expect(version.frozenAt).not.toBeNull();
    }
    // Recorded batches carry their VOC and volume for the compliance log.
    expect(sheets.filter((s) => s.status === "mixed").every((s) => s.vocGPerL != null && s.totalMl > 0 && s.mixedAt != null)).toBe(true);
    // At least one material is low, so the low-stock list has something to show.
    const lots = t.db.select().from(materialLots).all();
    const stockOf = (id: number) => lots.filter((l) => l.materialId === id).reduce((a, l) => a + l.quantityOnHand, 0);
    const low = catalogue.filter((m) => m.lowStockThreshold != null && stockOf(m.id) <= m.lowStockThreshold);
    expect(low.length).toBeGreaterThan(0);
  });

  it("names a ground coat \"basecoat\" in the mix (painters' word), never \"ground\"", async () => {
    const t = makeApp();
    await seedDemo(t.db);
    const rows = t.db.select({ label: layerComponents.label, percentOf: layerComponents.percentOf, category: materials.category }).from(layerComponents).innerJoin(materials, eq(materials.id, layerComponents.materialId)).all();
    const grounds = rows.filter((r) => r.category === "ground_coat");
    expect(grounds.length).toBeGreaterThan(0);
    expect(grounds.every((r) => r.label === "basecoat")).toBe(true);
    expect(rows.some((r) => r.label === "ground" || (r.percentOf ?? []).includes("ground"))).toBe(false);
  });
});
