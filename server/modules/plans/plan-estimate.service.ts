import { eq } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import type { Actor } from "../../auth/session";
import { jobItems } from "../../db/schema";
import { M2_PER_FT2, MixError, mixVoc, mixVolumeSolids, resolveShares, spreadingRate, volumeNeeded, wetFilmFromDry } from "../../../shared/mix/index";
import { toMixComponents } from "../../../shared/domain/layer-mix";
import { centsPerMl } from "../../../shared/domain/material-units";
import type { Caution } from "../../../shared/domain/safety";
import type { LayerKind } from "../../../shared/domain/layers";
import type { PlanEstimateDto } from "../../../shared/schemas/plan.schema";
import { jobPlanRow, loadPlanVersion, type LoadedLayer } from "./plans.service";
import type { Tx } from "../../db/client";
import { seesCost } from "../materials/materials.service";
import { getSettings } from "../settings/settings.service";
import { vocAgainstLimit } from "../../../shared/domain/voc-limits";
import { wasteAllowanceFor, withWasteAllowance } from "../../../shared/domain/batch-size";
import type { ShopSettings } from "../../../shared/schemas/settings.schema";
import { desc } from "drizzle-orm";
import { planVersions } from "../../db/schema";

/*
 * Exported for other areas (keep stable):
 *
 *   estimateJobPlan(deps, jobId): JobPlanEstimate | null
 *     The material estimate of the job's current plan (latest version), or null when the job has no plan.
 *     For each layer with a mix and a dry film per coat:
 *       volumeMl  = volumeNeeded(total item area in m² (ft² × 0.09290304), coats, dry film per coat,
 *                   volume solids of the MIXED layer (mixVolumeSolids over the component shares),
 *                   transfer efficiency)                        — ready-to-spray mL
 *       cost      = Σ share_i × volumeMl × cost per mL of material i (purchase unit converted; mass units via
 *                   density), in fractional cents; rounded to whole cents once: per layer for display, and the
 *                   total from the unrounded sum (so the total is not a sum of rounded layers)
 *       vocGPerL  = mixVoc over the component shares (g/L less water and exempt)
 *     A layer that cannot be estimated (no film set, a material without volume solids …) has volumeMl 0,
 *     costCents 0 and a `problem` saying why; the quote should show it.
 *     No actor: the caller decides who may see the money (quotes are office-only).
 */

export type JobPlanEstimate = {
  planId: number;
  versionId: number;
  totalAreaM2: number;
  layers: {
    layerId: number;
    name: string;
    kind: LayerKind;
    volumeMl: number;
    /** Before the waste allowance and the minimum batch, mL. */
    theoreticalMl: number;
    wasteAllowancePct: number;
    costCents: number;
    vocGPerL: number | null;
    vocLimitGPerL: number | null;
    vocOverLimit: boolean;
    volumeSolidsPct: number | null;
    film: LayerFilm | null;
    cautions: Caution[];
    problem: string | null;
  }[];
  totalVolumeMl: number;
  totalCostCents: number;
  problems: string[];
};

/**
 * Film build of one coat and what a volume of the mixed layer covers at the layer's transfer efficiency:
 *   wet film = dry film / volume solids; coverage = 1000 m²/(L·µm) (or 1604.17 ft²/(gal·mil)) × VS × TE / dry film.
 */
export type LayerFilm = { dryFilmPerCoat: number; wetFilmPerCoat: number; unit: "um" | "mil"; transferEfficiencyPct: number; m2PerL: number; ft2PerGal: number };

function filmOf(layer: LoadedLayer, volumeSolidsPct: number): LayerFilm | null {
  if (layer.dryFilmPerCoat == null || layer.dryFilmPerCoat <= 0 || volumeSolidsPct <= 0) return null;
  const input = { volumeSolidsPct, dryFilm: layer.dryFilmPerCoat, dryFilmUnit: layer.dryFilmUnit, transferEfficiencyPct: layer.transferEfficiencyPct };
  return {
    dryFilmPerCoat: layer.dryFilmPerCoat,
    wetFilmPerCoat: wetFilmFromDry(layer.dryFilmPerCoat, volumeSolidsPct),
    unit: layer.dryFilmUnit,
    transferEfficiencyPct: layer.transferEfficiencyPct,
    m2PerL: spreadingRate(input, "m2/L"),
    ft2PerGal: spreadingRate(input, "ft2/gal"),
  };
}

/** Categories that carry no solids when the catalogue leaves volume solids empty. */
const SOLIDS_FREE = new Set(["reducer", "cleaner"]);

type LayerResult = JobPlanEstimate["layers"][number] & { exactCostCents: number };
type BaseResult = Omit<LayerResult, "vocLimitGPerL" | "vocOverLimit" | "theoreticalMl" | "wasteAllowancePct">;

function vocOfShares(layer: LoadedLayer, shares: number[]): number | null {
  if (!layer.components.every((c) => c.vocGPerL != null)) return null;
  return mixVoc(layer.components.map((c, i) => ({ volume: shares[i]!, vocGPerL: c.vocGPerL!, waterExemptPct: c.waterExemptPct })));
}

/** The mixed layer's VOC, g/L less water and exempt (null when a material has no figure or the mix does not resolve). */
export function layerVoc(layer: LoadedLayer): number | null {
  if (layer.components.length === 0) return null;
  try {
    return vocOfShares(layer, resolveShares(toMixComponents(layer.components)).map((s) => s.share));
  } catch (e) {
    if (e instanceof MixError) return null;
    throw e;
  }
}

/** The shop settings an estimate applies: VOC limits, waste allowance per layer kind, minimum batch. */
export type EstimateSettings = Pick<ShopSettings, "vocLimits" | "wasteAllowances" | "minimumBatchMl">;
const NO_SETTINGS: EstimateSettings = { vocLimits: [], wasteAllowances: [], minimumBatchMl: 0 };

/**
 * One layer's estimate: the theoretical volume for the film build plus the shop's waste allowance for the layer's
 * kind, at least the minimum batch (cost follows the volume); its mixed VOC checked against the shop's limit.
 */
export function estimateLayer(layer: LoadedLayer, areaM2: number, settings: EstimateSettings = NO_SETTINGS): LayerResult {
  const e = estimateBase(layer, areaM2);
  const voc = vocAgainstLimit(layer.kind, e.vocGPerL, settings.vocLimits);
  const wasteAllowancePct = wasteAllowanceFor(layer.kind, settings.wasteAllowances);
  const volumeMl = withWasteAllowance(e.volumeMl, wasteAllowancePct, settings.minimumBatchMl);
  const scale = e.volumeMl > 0 ? volumeMl / e.volumeMl : 0;
  const exactCostCents = e.exactCostCents * scale;
  return { ...e, theoreticalMl: e.volumeMl, wasteAllowancePct, volumeMl, exactCostCents, costCents: Math.round(exactCostCents), vocLimitGPerL: voc.limitGPerL, vocOverLimit: voc.over };
}

function estimateBase(layer: LoadedLayer, areaM2: number): BaseResult {
  const base = { layerId: layer.id, name: layer.name, kind: layer.kind, cautions: layer.cautions };
  const none = (problem: string | null, extra: Partial<BaseResult> = {}): BaseResult => ({
    ...base,
    volumeMl: 0,
    costCents: 0,
    exactCostCents: 0,
    vocGPerL: null,
    volumeSolidsPct: null,
    film: null,
    problem,
    ...extra,
  });
  if (layer.components.length === 0) return none(null);
  let shares: number[];
  try {
    shares = resolveShares(toMixComponents(layer.components)).map((s) => s.share);
  } catch (e) {
    if (e instanceof MixError) return none(`The mix does not resolve: ${e.message}`);
    throw e;
  }
  const vocGPerL = vocOfShares(layer, shares);
  const noSolids = layer.components.find((c) => c.volumeSolidsPct == null && !SOLIDS_FREE.has(c.category));
  if (noSolids) return none(`${noSolids.materialCode} has no volume solids in the catalogue`, { vocGPerL });
  const vs = mixVolumeSolids(layer.components.map((c, i) => ({ volume: shares[i]!, volumeSolidsPct: c.volumeSolidsPct ?? 0 })));
  const film = filmOf(layer, vs);
  if (layer.dryFilmPerCoat == null) return none("No dry film per coat is set", { vocGPerL, volumeSolidsPct: vs });
  if (areaM2 <= 0) return none("The job has no items with an area", { vocGPerL, volumeSolidsPct: vs, film });
  if (vs <= 0) return none("The mixed layer has no solids", { vocGPerL, volumeSolidsPct: vs });
  const volumeMl = volumeNeeded(
    {
      area: areaM2,
      areaUnit: "m2",
      coats: layer.coats,
      dryFilmPerCoat: layer.dryFilmPerCoat,
      dryFilmUnit: layer.dryFilmUnit,
      volumeSolidsPct: vs,
      transferEfficiencyPct: layer.transferEfficiencyPct,
    },
    "mL",
  );
  let exact = 0;
  let problem: string | null = null;
  layer.components.forEach((c, i) => {
    const perMl = centsPerMl(c.costCents, c.purchaseUnit, c.densityGPerMl);
    if (perMl == null) problem ??= `${c.materialCode} is sold by weight but has no density, so its cost is left out`;
    else exact += shares[i]! * volumeMl * perMl;
  });
  return { ...base, volumeMl, costCents: Math.round(exact), exactCostCents: exact, vocGPerL, volumeSolidsPct: vs, film, problem };
}

/** Total area of the job's items in m². */
export function jobAreaM2(db: Tx, jobId: number): number {
  return db
    .select({ area: jobItems.surfaceArea, unit: jobItems.areaUnit })
    .from(jobItems)
    .where(eq(jobItems.jobId, jobId))
    .all()
    .reduce((sum, i) => sum + (i.unit === "ft2" ? i.area * M2_PER_FT2 : i.area), 0);
}

export function estimateJobPlan(deps: { db: Tx }, jobId: number): JobPlanEstimate | null {
  const plan = jobPlanRow(deps.db, jobId);
  if (!plan) return null;
  const latest = deps.db.select({ id: planVersions.id }).from(planVersions).where(eq(planVersions.planId, plan.id)).orderBy(desc(planVersions.version)).limit(1).get();
  if (!latest) return null;
  const version = loadPlanVersion(deps, latest.id);
  const areaM2 = jobAreaM2(deps.db, jobId);
  const settings = getSettings(deps);
  const layers = version.layers.map((l) => estimateLayer(l, areaM2, settings));
  const exactTotal = layers.reduce((a, l) => a + l.exactCostCents, 0);
  const problems = layers.filter((l) => l.problem).map((l) => `${l.name}: ${l.problem}`);
  return {
    planId: plan.id,
    versionId: version.id,
    totalAreaM2: areaM2,
    layers: layers.map(({ exactCostCents: _exact, ...l }) => l),
    totalVolumeMl: layers.reduce((a, l) => a + l.volumeMl, 0),
    totalCostCents: Math.round(exactTotal),
    problems,
  };
}

/** The estimate as the actor may see it: painters get volumes and VOC, never cost. */
export function estimateFor(deps: AppDeps, actor: Actor, jobId: number): PlanEstimateDto | null {
  const e = estimateJobPlan(deps, jobId);
  if (!e) return null;
  if (seesCost(actor)) return e;
  const { totalCostCents: _t, ...rest } = e;
  return { ...rest, layers: e.layers.map(({ costCents: _c, ...l }) => l) };
}
