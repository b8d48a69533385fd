import { and, eq, lt, ne, sum } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import { mixSheets } from "../../db/schema";
import { loadPlanVersion } from "../plans/plans.service";
import { estimateLayer, jobAreaM2 } from "../plans/plan-estimate.service";
import { getSettings } from "../settings/settings.service";
import { batchShortfall } from "../../../shared/domain/batch-size";
import type { LayerKind } from "../../../shared/domain/layers";

type Sheet = typeof mixSheets.$inferSelect;

/**
 * What the sheet's layer needs for the whole job (the estimate with the shop's waste allowance and minimum batch),
 * and a warning when this batch falls short: a candy must be one batch for all parts; other layers count the batches
 * mixed before this one.
 */
export function batchNeed(deps: Pick<AppDeps, "db">, sheet: Sheet, kind: LayerKind): { needMl: number | null; batchWarning: string | null } {
  if (sheet.status === "void") return { needMl: null, batchWarning: null };
  const layer = loadPlanVersion(deps, sheet.planVersionId).layers.find((l) => l.id === sheet.layerId);
  if (!layer) return { needMl: null, batchWarning: null };
  const need = estimateLayer(layer, jobAreaM2(deps.db, sheet.jobId), getSettings(deps)).volumeMl;
  const needMl = need > 0 ? need : null;
  const earlier =
    deps.db
      .select({ ml: sum(mixSheets.totalMl).mapWith(Number) })
      .from(mixSheets)
      .where(
        and(
          eq(mixSheets.jobId, sheet.jobId),
          eq(mixSheets.layerId, sheet.layerId),
          eq(mixSheets.status, "mixed"),
          ne(mixSheets.id, sheet.id),
          sheet.mixedAt != null ? lt(mixSheets.mixedAt, sheet.mixedAt) : undefined,
        ),
      )
      .get()?.ml ?? 0;
  return { needMl, batchWarning: batchShortfall(kind, needMl, sheet.totalMl, earlier)?.message ?? null };
}
