import type { TestApp } from "./test-app";
import { materials, mixSheetLines, mixSheets, planLayers, planVersions, plans } from "../../server/db/schema";
import type { LayerKind } from "../../shared/domain/layers";
import type { MaterialCategory } from "../../shared/domain/materials";

let seq = 0;

/** Inserts a recorded (mixed) batch straight into the tables, with its lines' VOC figures as copied at mixing. */
export function addMixedBatch(
  t: TestApp,
  jobId: number,
  batch: {
    layerKind: LayerKind;
    mixedAt: Date;
    lines: { ml: number; vocGPerL: number | null; waterExemptPct?: number; category: MaterialCategory; costCents?: number }[];
  },
) {
  const plan = t.db.insert(plans).values({ name: `Plan ${++seq}`, jobId }).returning().get();
  const version = t.db.insert(planVersions).values({ planId: plan.id, version: 1, frozenAt: batch.mixedAt.getTime() }).returning().get();
  const layer = t.db.insert(planLayers).values({ versionId: version.id, position: 0, kind: batch.layerKind, name: `Layer ${seq}`, coats: 2 }).returning().get();
  const totalMl = batch.lines.reduce((s, l) => s + l.ml, 0);
  const sheet = t.db
    .insert(mixSheets)
    .values({ jobId, planVersionId: version.id, layerId: layer.id, status: "mixed", mode: "total", amount: totalMl, unit: "mL", totalMl, mixedAt: batch.mixedAt.getTime() })
    .returning()
    .get();
  batch.lines.forEach((l, i) => {
    const m = t.db
      .insert(materials)
      .values({ code: `T-${seq}-${i}`, name: `Material ${seq}.${i}`, category: l.category, purchaseUnit: "L", costCents: 1000, vocGPerL: l.vocGPerL, waterExemptPct: l.waterExemptPct ?? 0 })
      .returning()
      .get();
    t.db
      .insert(mixSheetLines)
      .values({ mixSheetId: sheet.id, position: i, materialId: m.id, label: `c${i}`, plannedMl: l.ml, actualMl: l.ml, vocGPerL: l.vocGPerL, waterExemptPct: l.waterExemptPct ?? 0, costCents: l.costCents ?? null })
      .run();
  });
  return sheet;
}
