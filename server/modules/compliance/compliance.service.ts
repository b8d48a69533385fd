import { sql } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import { getSettings } from "../settings/settings.service";
import { dayStart, solventUsesBetween } from "../solvent-uses/solvent-uses.service";
import type { SolventUseDto } from "../../../shared/schemas/solvent-use.schema";
import { convertMass, convertVolume, gPerLToLbPerGal } from "../../../shared/mix/index";
import type { LayerKind } from "../../../shared/domain/layers";
import type { MaterialCategory } from "../../../shared/domain/materials";
import type {
  ComplianceBatchDto,
  ComplianceCategoryDto,
  ComplianceDto,
  ComplianceMonthDto,
  ComplianceQuery,
  VocMass,
} from "../../../shared/schemas/compliance.schema";

const monthOf = (ms: number) => {
  const d = new Date(ms);
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, "0")}`;
};
const mass = (grams: number): VocMass => ({ kg: grams / 1000, lb: convertMass(grams, "g", "lb") });
const gal = (litres: number) => convertVolume(litres, "L", "gallon");

type BatchRow = {
  id: number;
  mixedAt: number;
  jobId: number;
  jobTitle: string;
  layerName: string;
  layerKind: LayerKind;
  volumeMl: number;
  lessWaterExemptMl: number;
  vocGrams: number;
  hasVoc: number;
};

/**
 * Each batch's VOC is recomputed from the figures copied onto its lines when it was mixed:
 * mass = Σ VOC_i × V_i × (1 − water/exempt_i), and g/L less water and exempt = mass / Σ V_i × (1 − water/exempt_i)
 * (40 CFR 59.104(a)(1), the same rule as the mix engine's mixVoc). Actual poured amounts are used when recorded.
 */
function batches(deps: AppDeps, fromMs: number, toMs: number): BatchRow[] {
  return deps.db.all<BatchRow>(sql`
    select ms.id as id, ms.mixed_at as mixedAt, j.id as jobId, j.title as jobTitle, pl.name as layerName, pl.kind as layerKind,
      sum(coalesce(l.actual_ml, l.planned_ml)) as volumeMl,
      sum(coalesce(l.actual_ml, l.planned_ml) * (1 - coalesce(l.water_exempt_pct, 0) / 100.0)) as lessWaterExemptMl,
      sum(coalesce(l.voc_g_per_l, 0) * coalesce(l.actual_ml, l.planned_ml) * (1 - coalesce(l.water_exempt_pct, 0) / 100.0)) / 1000.0 as vocGrams,
      max(l.voc_g_per_l is not null) as hasVoc
    from mix_sheets ms
    join mix_sheet_lines l on l.mix_sheet_id = ms.id
    join plan_layers pl on pl.id = ms.layer_id
    join jobs j on j.id = ms.job_id
    where ms.status = 'mixed' and ms.mixed_at >= ${fromMs} and ms.mixed_at < ${toMs}
    group by ms.id
    order by ms.mixed_at, ms.id`);
}

function categories(deps: AppDeps, fromMs: number, toMs: number): ComplianceCategoryDto[] {
  const rows = deps.db.all<{ category: MaterialCategory; volumeMl: number; vocGrams: number }>(sql`
    select m.category as category,
      sum(coalesce(l.actual_ml, l.planned_ml)) as volumeMl,
      sum(coalesce(l.voc_g_per_l, 0) * coalesce(l.actual_ml, l.planned_ml) * (1 - coalesce(l.water_exempt_pct, 0) / 100.0)) / 1000.0 as vocGrams
    from mix_sheets ms
    join mix_sheet_lines l on l.mix_sheet_id = ms.id
    join materials m on m.id = l.material_id
    where ms.status = 'mixed' and ms.mixed_at >= ${fromMs} and ms.mixed_at < ${toMs}
    group by m.category
    order by vocGrams desc`);
  return rows.map((r) => ({ category: r.category, volumeL: r.volumeMl / 1000, volumeGal: gal(r.volumeMl / 1000), vocMass: mass(r.vocGrams) }));
}

/** The batch categories with the solvent logged outside batches added to its material's category. */
function withSolvents(rows: ComplianceCategoryDto[], solvents: SolventUseDto[]): ComplianceCategoryDto[] {
  const byCat = new Map(rows.map((r) => [r.category, { category: r.category, litres: r.volumeL, grams: r.vocMass.kg * 1000 }]));
  for (const u of solvents) {
    const c = byCat.get(u.category) ?? { category: u.category, litres: 0, grams: 0 };
    c.litres += u.volumeMl / 1000;
    c.grams += u.vocKg * 1000;
    byCat.set(u.category, c);
  }
  return [...byCat.values()].sort((a, b) => b.grams - a.grams).map((c) => ({ category: c.category, volumeL: c.litres, volumeGal: gal(c.litres), vocMass: mass(c.grams) }));
}

export function complianceLog(deps: AppDeps, q: ComplianceQuery): ComplianceDto {
  const settings = getSettings(deps);
  const limits = new Map(settings.vocLimits.map((l) => [l.layerKind, l.limitGPerL]));
  const fromMs = dayStart(q.from);
  const toMs = dayStart(q.to) + 86_400_000;

  const batchDtos: ComplianceBatchDto[] = batches(deps, fromMs, toMs).map((b) => {
    const gPerL = b.hasVoc && b.lessWaterExemptMl > 0 ? b.vocGrams / (b.lessWaterExemptMl / 1000) : null;
    const limit = limits.get(b.layerKind) ?? null;
    return {
      id: b.id,
      mixedAt: new Date(b.mixedAt).toISOString(),
      jobId: b.jobId,
      jobTitle: b.jobTitle,
      layerName: b.layerName,
      layerKind: b.layerKind,
      volumeL: b.volumeMl / 1000,
      volumeGal: gal(b.volumeMl / 1000),
      voc: gPerL === null ? null : { gPerL, lbPerGal: gPerLToLbPerGal(gPerL) },
      vocMass: mass(b.vocGrams),
      limitGPerL: limit,
      // Compared unrounded against the shop's own limit; the screen shows both values.
      overLimit: gPerL !== null && limit !== null && gPerL > limit,
    };
  });

  // Prep and cleaning solvent logged outside a batch counts too: in its month, its category and the totals.
  const solvents = solventUsesBetween(deps, fromMs, toMs);
  const byMonth = new Map<string, ComplianceMonthDto & { grams: number }>();
  const monthRow = (key: string) =>
    byMonth.get(key) ?? { month: key, batches: 0, solventUses: 0, volumeL: 0, volumeGal: 0, vocMass: mass(0), capKg: settings.vocMonthlyCapKg, overCap: false, batchesOverLimit: 0, grams: 0 };
  for (const u of solvents) {
    const key = monthOf(Date.parse(u.usedAt));
    const m = monthRow(key);
    m.solventUses += 1;
    m.volumeL += u.volumeMl / 1000;
    m.grams += u.vocKg * 1000;
    byMonth.set(key, m);
  }
  for (const b of batchDtos) {
    const key = monthOf(Date.parse(b.mixedAt));
    const m = monthRow(key);
    m.batches += 1;
    m.volumeL += b.volumeL;
    m.grams += b.vocMass.kg * 1000;
    if (b.overLimit) m.batchesOverLimit += 1;
    byMonth.set(key, m);
  }
  const months = [...byMonth.values()].sort((a, b) => a.month.localeCompare(b.month)).map(({ grams, ...m }) => ({
    ...m,
    volumeGal: gal(m.volumeL),
    vocMass: mass(grams),
    overCap: m.capKg !== null && grams / 1000 > m.capKg,
  }));

  const totalGrams = batchDtos.reduce((s, b) => s + b.vocMass.kg * 1000, 0) + solvents.reduce((s, u) => s + u.vocKg * 1000, 0);
  const totalL = batchDtos.reduce((s, b) => s + b.volumeL, 0) + solvents.reduce((s, u) => s + u.volumeMl / 1000, 0);

  let yearToDate: ComplianceDto["yearToDate"] = null;
  if (settings.vocYearlyCapKg !== null) {
    const year = q.to.slice(0, 4);
    const ytdFrom = dayStart(`${year}-01-01`);
    const ytd = batches(deps, ytdFrom, toMs).reduce((s, b) => s + b.vocGrams, 0) + solventUsesBetween(deps, ytdFrom, toMs).reduce((s, u) => s + u.vocKg * 1000, 0);
    yearToDate = { year, vocMass: mass(ytd), overCap: ytd / 1000 > settings.vocYearlyCapKg };
  }

  return {
    from: q.from,
    to: q.to,
    batches: batchDtos,
    months,
    categories: withSolvents(categories(deps, fromMs, toMs), solvents),
    solventUses: solvents,
    totals: { batches: batchDtos.length, solventUses: solvents.length, volumeL: totalL, volumeGal: gal(totalL), vocMass: mass(totalGrams), batchesOverLimit: batchDtos.filter((b) => b.overLimit).length },
    limits: settings.vocLimits.map((l) => ({ layerKind: l.layerKind, limitGPerL: l.limitGPerL, limitLbPerGal: gPerLToLbPerGal(l.limitGPerL) })),
    monthlyCapKg: settings.vocMonthlyCapKg,
    yearlyCapKg: settings.vocYearlyCapKg,
    yearToDate,
  };
}
