import { aliasedTable, and, asc, desc, eq, inArray, type SQL } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import type { Actor } from "../../auth/session";
import { jobs, layerComponents, materialLots, materials, mixSheetLines, mixSheets, planLayers, planVersions, plans, users } from "../../db/schema";
import { getSettings } from "../settings/settings.service";
import { badRequest, conflict, notFound } from "../../http/http-error";
import { iso, isoOrNull } from "../../http/dates";
import type { RequestContext } from "../../http/context";
import { findJobFor, jobScope } from "../jobs/jobs.access";
import { jobPlanRow, loadPlanVersion, freezePlanVersion } from "../plans/plans.service";
import type { Tx } from "../../db/client";
import { workingVersionId } from "../change-orders/change-order-rows";
import { seesCost, todayOf } from "../materials/materials.service";
import {
  computeMix,
  convertMass,
  convertVolume,
  isMassUnit,
  MixError,
  mixVoc,
  potLifeEnds,
  roundForMeasuring,
  weighingPlan,
  type WeighingPlan,
  type MeasuringUnit,
  type MixLine,
  type VolumeUnit,
} from "../../../shared/mix/index";
import { toMixComponents } from "../../../shared/domain/layer-mix";
import { mixComponentWords } from "../../../shared/domain/mix-words";
import { vocAgainstLimit } from "../../../shared/domain/voc-limits";
import type { LayerKind } from "../../../shared/domain/layers";
import { batchNeed } from "./batch-need";
import { centsPerMl, mlToPurchaseUnit } from "../../../shared/domain/material-units";
import { cautionsFor } from "../../../shared/domain/safety";
import type {
  ListMixSheetsQuery,
  LotChoiceDto,
  MixSheetDto,
  MixSheetLineDto,
  MixSheetSummaryDto,
  createMixSheetInputSchema,
  recordMixSheetInputSchema,
} from "../../../shared/schemas/mix-sheet.schema";
import type { z } from "zod";

/*
 * Mix sheets: a batch for one layer of a job's current plan.
 *  - A draft is computed with the shared mix engine (computeMix) from the layer's components.
 *  - Recording it as mixed is one transaction: who/when, the lots and actual amounts, the material figures
 *    (VOC, water/exempt, density, cost) copied onto the lines, the batch VOC (mixVoc) and total, stock taken
 *    from each lot in the material's purchase unit, and the plan version frozen (freezePlanVersion).
 *  - A recorded sheet is never edited; it can only be voided with a reason. Voiding does NOT put stock back:
 *    the material was poured (a void marks the record as not to be counted, e.g. a spoiled batch or the wrong
 *    job). If a count was really wrong, the office corrects the lot quantity on the material page.
 */

const mixer = aliasedTable(users, "mixer");
const voider = aliasedTable(users, "voider");
const creator = aliasedTable(users, "creator");

type SheetRow = typeof mixSheets.$inferSelect;
type LineRow = typeof mixSheetLines.$inferSelect;
type MaterialRow = typeof materials.$inferSelect;
type LotRow = typeof materialLots.$inferSelect;

const MIX_FIELD: Record<string, string> = {
  knownName: "knownLabel",
  amount: "amount",
  total: "amount",
  unit: "unit",
  step: "roundingStep",
  densityGPerMl: "weigh",
};

function mixErrorToBadRequest(e: MixError, fallback = "layerId") {
  return badRequest(e.message, { [MIX_FIELD[e.field ?? ""] ?? fallback]: e.message });
}

/** The sheet and its job, if the actor may reach the job (404 otherwise). */
function findSheetFor(deps: AppDeps, actor: Actor, id: number): SheetRow {
  const sheet = deps.db.select().from(mixSheets).where(eq(mixSheets.id, id)).get();
  if (!sheet) throw notFound("Mix sheet");
  try {
    findJobFor(deps, actor, sheet.jobId);
  } catch {
    throw notFound("Mix sheet");
  }
  return sheet;
}

/** Lots to pour from first: the oldest received, unexpired, with stock (one that covers the amount is preferred). */
export function lotOrder(lots: LotRow[]): LotRow[] {
  const key = (v: string | null) => v ?? "9999-99-99";
  return [...lots].sort((a, b) => key(a.receivedOn).localeCompare(key(b.receivedOn)) || key(a.expiresOn).localeCompare(key(b.expiresOn)) || a.id - b.id);
}

export function suggestLot(lots: LotRow[], needed: number | null, today: string): LotRow | undefined {
  const usable = lotOrder(lots).filter((l) => l.quantityOnHand > 0 && (l.expiresOn == null || l.expiresOn >= today));
  return (needed != null ? usable.find((l) => l.quantityOnHand + 1e-9 >= needed) : undefined) ?? usable[0];
}

function neededInPurchaseUnit(ml: number, m: MaterialRow, density: number | null): number | null {
  try {
    return mlToPurchaseUnit(ml, m.purchaseUnit, density, m.code);
  } catch {
    return null;
  }
}

/** The layer's mix as written (parts, percent of), to measure rounding against. */
function layerComponentsOf(db: Tx, layerId: number) {
  return db
    .select({ label: layerComponents.label, parts: layerComponents.parts, percent: layerComponents.percent, percentOf: layerComponents.percentOf })
    .from(layerComponents)
    .where(eq(layerComponents.layerId, layerId))
    .orderBy(asc(layerComponents.position))
    .all();
}

function lotsByMaterial(db: Tx, materialIds: number[]): Map<number, LotRow[]> {
  const out = new Map<number, LotRow[]>();
  if (!materialIds.length) return out;
  for (const l of db.select().from(materialLots).where(inArray(materialLots.materialId, [...new Set(materialIds)])).all()) {
    out.set(l.materialId, [...(out.get(l.materialId) ?? []), l]);
  }
  return out;
}

export function getMixSheet(deps: AppDeps, actor: Actor, id: number): MixSheetDto {
  const sheet = findSheetFor(deps, actor, id);
  return sheetDto(deps, actor, sheet);
}

function sheetDto(deps: AppDeps, actor: Actor, sheet: SheetRow): MixSheetDto {
  const head = deps.db
    .select({
      jobTitle: jobs.title,
      planId: plans.id,
      planName: plans.name,
      version: planVersions.version,
      layerName: planLayers.name,
      layerKind: planLayers.kind,
      mixedByName: mixer.name,
      voidedByName: voider.name,
      createdByName: creator.name,
    })
    .from(mixSheets)
    .innerJoin(jobs, eq(mixSheets.jobId, jobs.id))
    .innerJoin(planVersions, eq(mixSheets.planVersionId, planVersions.id))
    .innerJoin(plans, eq(planVersions.planId, plans.id))
    .innerJoin(planLayers, eq(mixSheets.layerId, planLayers.id))
    .leftJoin(mixer, eq(mixSheets.mixedBy, mixer.id))
    .leftJoin(voider, eq(mixSheets.voidedBy, voider.id))
    .leftJoin(creator, eq(mixSheets.createdBy, creator.id))
    .where(eq(mixSheets.id, sheet.id))
    .get()!;
  const latest = deps.db.select({ id: planVersions.id }).from(planVersions).where(eq(planVersions.planId, head.planId)).orderBy(desc(planVersions.version)).limit(1).get();
  const rows = deps.db
    .select({ l: mixSheetLines, m: materials })
    .from(mixSheetLines)
    .innerJoin(materials, eq(mixSheetLines.materialId, materials.id))
    .where(eq(mixSheetLines.mixSheetId, sheet.id))
    .orderBy(asc(mixSheetLines.position))
    .all();
  const unit = sheet.unit as VolumeUnit;
  const office = seesCost(actor);
  const totalPlannedMl = rows.reduce((a, r) => a + r.l.plannedMl, 0);
  const density = (r: { l: LineRow; m: MaterialRow }) => r.l.densityGPerMl ?? r.m.densityGPerMl;
  const mixLines: MixLine[] = rows.map((r) => {
    const d = density(r);
    const line: MixLine = { name: r.l.label, volume: convertVolume(r.l.plannedMl, "mL", unit), unit, share: r.l.plannedMl / totalPlannedMl };
    if (d != null) line.grams = r.l.plannedMl * d;
    return line;
  });
  const tolerancePct = getSettings(deps).ratioTolerancePct;
  const written = layerComponentsOf(deps.db, sheet.layerId);
  const words = new Map(
    mixComponentWords(
      written.map((c) => {
        const r = rows.find((x) => x.l.label === c.label);
        return { ...c, materialCode: r?.m.code ?? "", materialName: r?.m.name ?? c.label };
      }),
    ).map((w) => [w.label, w.amount]),
  );
  const rounding = {
    components: toMixComponents(written),
    keep: rows.filter((r) => r.m.category === "hardener").map((r) => r.l.label),
    tolerancePct,
  };
  const roundingUnit = sheet.roundingUnit as MeasuringUnit | null;
  let rounded: ReturnType<typeof roundForMeasuring> | null = null;
  let scale: WeighingPlan | null = null;
  try {
    if (sheet.roundingStep != null && roundingUnit) rounded = roundForMeasuring(mixLines, sheet.roundingStep, roundingUnit, rounding);
    if (mixLines.every((l) => l.grams !== undefined)) {
      const onScale = sheet.roundingStep != null && roundingUnit && isMassUnit(roundingUnit) ? { unit: roundingUnit, step: sheet.roundingStep } : {};
      scale = weighingPlan(mixLines, { ...onScale, ...rounding });
    }
  } catch {
    rounded = null;
    scale = null;
  }
  const today = todayOf(deps.now());
  const lots = sheet.status === "draft" ? lotsByMaterial(deps.db, rows.map((r) => r.m.id)) : new Map<number, LotRow[]>();
  const lines: MixSheetLineDto[] = rows.map((r, i) => {
    const ml = mixLines[i]!;
    const materialLotsOf = lots.get(r.m.id) ?? [];
    const suggested = sheet.status === "draft" ? suggestLot(materialLotsOf, neededInPurchaseUnit(r.l.plannedMl, r.m, density(r)), today) : undefined;
    const choices: LotChoiceDto[] = lotOrder(materialLotsOf).map((l) => ({
      id: l.id,
      lotNumber: l.lotNumber,
      quantityOnHand: l.quantityOnHand,
      purchaseUnit: r.m.purchaseUnit,
      expiresOn: l.expiresOn,
      expired: l.expiresOn != null && l.expiresOn < today,
    }));
    const rl = rounded?.lines[i];
    const line: MixSheetLineDto = {
      id: r.l.id,
      position: r.l.position,
      label: r.l.label,
      materialId: r.m.id,
      materialCode: r.m.code,
      materialName: r.m.name,
      category: r.m.category,
      purchaseUnit: r.m.purchaseUnit,
      amount: ml.volume,
      plannedMl: r.l.plannedMl,
      share: ml.share,
      asPlanned: words.get(r.l.label) ?? null,
      grams: ml.grams ?? null,
      scaleTarget: scale?.steps[i]!.target ?? null,
      scaleReads: scale?.steps[i]!.scaleReads ?? null,
      rounded: rl?.rounded ?? null,
      ratioErrorPct: rl?.ratioErrorPct ?? null,
      ratioReference: rl?.reference ?? null,
      actualMl: r.l.actualMl,
      lotId: r.l.lotId,
      lotNumber: r.l.lotNumber,
      suggestedLotId: suggested?.id ?? null,
      lots: choices,
      densityGPerMl: density(r),
      vocGPerL: r.l.vocGPerL ?? r.m.vocGPerL,
    };
    if (office) line.costCents = r.l.costCents;
    return line;
  });
  const mixedAt = sheet.mixedAt;
  const vocGPerL = sheet.vocGPerL ?? draftVoc(rows.map((r) => ({ ml: r.l.plannedMl, voc: r.m.vocGPerL, we: r.m.waterExemptPct })));
  const dto: MixSheetDto = {
    id: sheet.id,
    jobId: sheet.jobId,
    jobTitle: head.jobTitle,
    planId: head.planId,
    planName: head.planName,
    planVersionId: sheet.planVersionId,
    planVersion: head.version,
    planChanged: latest?.id !== sheet.planVersionId,
    superseded: sheet.supersededAt != null,
    layerId: sheet.layerId,
    layerName: head.layerName,
    layerKind: head.layerKind,
    status: sheet.status,
    mode: sheet.mode,
    amount: sheet.amount,
    unit,
    knownLabel: sheet.knownLabel,
    weigh: sheet.weigh,
    roundingStep: sheet.roundingStep,
    roundingUnit: (sheet.roundingUnit as MeasuringUnit | null) ?? null,
    worstRatioErrorPct: rounded?.worstRatioErrorPct ?? null,
    worstComponent: rounded?.worstComponent ?? null,
    movedComponents: rounded?.moved ?? [],
    scaleUnit: scale?.unit ?? null,
    scaleStep: scale?.step ?? null,
    scaleLastReading: scale?.total ?? null,
    ratioTolerancePct: tolerancePct,
    roundedTotal: rounded?.roundedTotal ?? null,
    total: mixLines.reduce((a, l) => a + l.volume, 0),
    totalMl: sheet.totalMl,
    vocGPerL,
    ...vocLimitOf(deps, head.layerKind, vocGPerL),
    ...batchNeed(deps, sheet, head.layerKind),
    potLifeMinutes: sheet.potLifeMinutes,
    potLifeEndsAt: mixedAt != null && sheet.potLifeMinutes ? potLifeEnds(new Date(mixedAt), sheet.potLifeMinutes).toISOString() : null,
    mixedAt: isoOrNull(mixedAt),
    mixedByName: head.mixedByName,
    voidedAt: isoOrNull(sheet.voidedAt),
    voidedByName: head.voidedByName,
    voidReason: sheet.voidReason,
    createdAt: iso(sheet.createdAt),
    createdByName: head.createdByName,
    cautions: cautionsFor(rows.map((r) => r.m)),
    lines,
  };
  if (office) dto.totalCostCents = sheet.status === "draft" ? null : lines.reduce((a, l) => a + (l.costCents ?? 0), 0);
  return dto;
}

/** The batch's VOC against the shop's limit for the layer's category: warned on the sheet before mixing. */
function vocLimitOf(deps: AppDeps, kind: LayerKind, vocGPerL: number | null) {
  const check = vocAgainstLimit(kind, vocGPerL, getSettings(deps).vocLimits);
  return { vocLimitGPerL: check.limitGPerL, vocOverLimit: check.over };
}

/** The expected VOC of a draft from the catalogue's figures (null when a material has none). */
function draftVoc(items: { ml: number; voc: number | null; we: number }[]): number | null {
  if (!items.length || items.some((i) => i.voc == null)) return null;
  try {
    return mixVoc(items.map((i) => ({ volume: i.ml, vocGPerL: i.voc!, waterExemptPct: i.we })));
  } catch {
    return null;
  }
}

export function createMixSheet(deps: AppDeps, ctx: RequestContext, input: z.output<typeof createMixSheetInputSchema>): MixSheetDto {
  const job = findJobFor(deps, ctx.actor, input.jobId);
  if (job.stage === "cancelled") throw conflict("The job is cancelled", { jobId: "Cancelled job" });
  const plan = jobPlanRow(deps.db, job.id);
  if (!plan) throw badRequest("The job has no finish plan yet", { layerId: "No plan on this job" });
  const latest = deps.db.select().from(planVersions).where(eq(planVersions.planId, plan.id)).orderBy(desc(planVersions.version)).limit(1).get()!;
  // Once a change order decides the version (approved, or still waiting), new sheets follow it like the booth card.
  const version = loadPlanVersion(deps, workingVersionId(deps.db, job) ?? latest.id);
  const layer = version.layers.find((l) => l.id === input.layerId);
  if (!layer) throw badRequest("That layer is not in the job's current plan", { layerId: "Not a layer of this job's current plan" });
  if (layer.components.length === 0) throw badRequest(`${layer.name} has no mix to make`, { layerId: "This layer has no mix" });
  if (input.mode === "component" && !layer.components.some((c) => c.label === input.knownLabel)) {
    throw badRequest(`"${input.knownLabel}" is not a component of ${layer.name}`, { knownLabel: "Not in this mix" });
  }
  if (input.weigh) {
    const missing = layer.components.find((c) => c.densityGPerMl == null);
    if (missing) throw badRequest(`${missing.materialCode} has no density in the catalogue, so it cannot be weighed`, { weigh: `${missing.materialCode} has no density` });
  }
  const roundingUnit: MeasuringUnit | null = input.roundingStep != null ? (input.roundingUnit ?? (input.weigh ? "g" : input.unit)) : null;
  let result: ReturnType<typeof computeMix>;
  try {
    result = computeMix({
      components: toMixComponents(layer.components, true),
      mode: input.mode,
      amount: input.amount,
      unit: input.unit,
      knownName: input.mode === "component" ? (input.knownLabel ?? undefined) : undefined,
      rounding: input.roundingStep != null && roundingUnit ? { step: input.roundingStep, unit: roundingUnit } : undefined,
    });
  } catch (e) {
    if (e instanceof MixError) throw mixErrorToBadRequest(e);
    throw e;
  }
  const now = deps.now();
  const id = deps.db.transaction((tx) => {
    const sheet = tx
      .insert(mixSheets)
      .values({
        jobId: job.id,
        planVersionId: version.id,
        layerId: layer.id,
        status: "draft",
        mode: input.mode,
        amount: input.amount,
        unit: input.unit,
        knownLabel: input.mode === "component" ? (input.knownLabel ?? null) : null,
        weigh: input.weigh,
        roundingStep: input.roundingStep ?? null,
        roundingUnit,
        totalMl: convertVolume(result.total, input.unit, "mL"),
        potLifeMinutes: layer.potLifeMinutes,
        createdBy: ctx.actor.id,
        createdAt: now,
      })
      .returning({ id: mixSheets.id })
      .get();
    result.lines.forEach((line, i) => {
      tx.insert(mixSheetLines)
        .values({ mixSheetId: sheet.id, position: i + 1, materialId: layer.components[i]!.materialId, label: line.name, plannedMl: convertVolume(line.volume, input.unit, "mL") })
        .run();
    });
    return sheet.id;
  });
  return getMixSheet(deps, ctx.actor, id);
}

export function recordMixSheet(deps: AppDeps, ctx: RequestContext, id: number, input: z.output<typeof recordMixSheetInputSchema>): MixSheetDto {
  const found = findSheetFor(deps, ctx.actor, id);
  if (found.status !== "draft") throw conflict(found.status === "mixed" ? "This sheet is already recorded; void it if it was wrong" : "This sheet was voided", { status: found.status });
  const now = deps.now();
  const mixedAt = input.mixedAt ? Date.parse(input.mixedAt) : now;
  if (mixedAt > now + 5 * 60_000) throw badRequest("The mixing time is in the future", { mixedAt: "In the future" });
  if (mixedAt < found.createdAt - 24 * 3_600_000) throw badRequest("The mixing time is before the sheet was made", { mixedAt: "Before the sheet was made" });
  const actualUnit: MeasuringUnit = input.actualUnit ?? (found.unit as VolumeUnit);
  const today = todayOf(now);

  deps.db.transaction((tx) => {
    const sheet = tx.select().from(mixSheets).where(eq(mixSheets.id, id)).get()!;
    if (sheet.status !== "draft") throw conflict("This sheet is already recorded", { status: sheet.status });
    const rows = tx
      .select({ l: mixSheetLines, m: materials })
      .from(mixSheetLines)
      .innerJoin(materials, eq(mixSheetLines.materialId, materials.id))
      .where(eq(mixSheetLines.mixSheetId, id))
      .orderBy(asc(mixSheetLines.position))
      .all();
    input.lines.forEach((given, i) => {
      if (!rows.some((r) => r.l.id === given.lineId)) throw badRequest(`Line ${given.lineId} is not on this sheet`, { [`lines.${i}.lineId`]: "Not a line of this sheet" });
    });
    const lots = lotsByMaterial(tx, rows.map((r) => r.m.id));
    const vocItems: { volume: number; vocGPerL: number; waterExemptPct: number }[] = [];
    let vocKnown = true;
    let totalMl = 0;
    rows.forEach((r) => {
      const index = input.lines.findIndex((g) => g.lineId === r.l.id);
      const given = index >= 0 ? input.lines[index] : undefined;
      const field = (name: string) => (index >= 0 ? `lines.${index}.${name}` : `lines`);
      const density = r.m.densityGPerMl;
      let actualMl = r.l.plannedMl;
      if (given?.actual != null) {
        if (isMassUnit(actualUnit)) {
          if (!density) throw badRequest(`${r.m.code} has no density, so an amount by weight cannot be recorded`, { [field("actual")]: "No density for this material" });
          actualMl = convertMass(given.actual, actualUnit, "g") / density;
        } else {
          actualMl = convertVolume(given.actual, actualUnit, "mL");
        }
      }
      totalMl += actualMl;
      let lot: LotRow | undefined;
      const materialLotsOf = lots.get(r.m.id) ?? [];
      if (given?.lotId != null) {
        lot = materialLotsOf.find((l) => l.id === given.lotId);
        if (!lot) throw badRequest(`That lot is not a lot of ${r.m.code}`, { [field("lotId")]: `Not a lot of ${r.m.code}` });
      } else if (given?.lotId === undefined) {
        // No lot named: pour from the suggested one (oldest received, unexpired, with stock), if there is one.
        lot = suggestLot(materialLotsOf, neededInPurchaseUnit(actualMl, r.m, density), today);
      }
      let taken = 0;
      if (lot && actualMl > 0) {
        try {
          taken = mlToPurchaseUnit(actualMl, r.m.purchaseUnit, density, r.m.code);
        } catch (e) {
          if (e instanceof MixError) throw badRequest(e.message, { [field("lotId")]: e.message });
          throw e;
        }
      }
      if (lot && taken > 0) {
        if (lot.quantityOnHand + 1e-9 < taken) {
          throw conflict(`Lot ${lot.lotNumber} of ${r.m.code} holds ${fmt(lot.quantityOnHand)} ${r.m.purchaseUnit}; this batch needs ${fmt(taken)}. Choose another lot or correct the stock count.`, {
            [field("lotId")]: `Only ${fmt(lot.quantityOnHand)} ${r.m.purchaseUnit} in this lot`,
          });
        }
        const left = Math.max(0, lot.quantityOnHand - taken);
        tx.update(materialLots).set({ quantityOnHand: left, updatedAt: now }).where(eq(materialLots.id, lot.id)).run();
        lot.quantityOnHand = left;
      }
      const perMl = centsPerMl(r.m.costCents, r.m.purchaseUnit, density);
      tx.update(mixSheetLines)
        .set({
          actualMl,
          lotId: lot?.id ?? null,
          lotNumber: lot?.lotNumber ?? null,
          vocGPerL: r.m.vocGPerL,
          waterExemptPct: r.m.waterExemptPct,
          densityGPerMl: density,
          costCents: perMl == null ? null : Math.round(actualMl * perMl),
        })
        .where(eq(mixSheetLines.id, r.l.id))
        .run();
      if (r.m.vocGPerL == null) vocKnown = false;
      else if (actualMl > 0) vocItems.push({ volume: actualMl, vocGPerL: r.m.vocGPerL, waterExemptPct: r.m.waterExemptPct });
    });
    if (totalMl <= 0) throw badRequest("Nothing was poured: enter the amounts used", { lines: "All amounts are 0" });
    let voc: number | null = null;
    if (vocKnown && vocItems.length) {
      try {
        voc = mixVoc(vocItems);
      } catch {
        voc = null;
      }
    }
    tx.update(mixSheets)
      .set({ status: "mixed", mixedAt, mixedBy: ctx.actor.id, vocGPerL: voc, totalMl })
      .where(eq(mixSheets.id, id))
      .run();
    freezePlanVersion(tx, sheet.planVersionId, sheet.jobId, now, ctx);
  });
  return getMixSheet(deps, ctx.actor, id);
}

const fmt = (n: number) => String(Number(n.toPrecision(4)));

export function voidMixSheet(deps: AppDeps, ctx: RequestContext, id: number, reason: string): MixSheetDto {
  const sheet = findSheetFor(deps, ctx.actor, id);
  if (sheet.status === "void") throw conflict("This sheet is already voided", { status: "void" });
  deps.db
    .update(mixSheets)
    .set({ status: "void", voidedAt: deps.now(), voidedBy: ctx.actor.id, voidReason: reason })
    .where(and(eq(mixSheets.id, id), inArray(mixSheets.status, ["draft", "mixed"])))
    .run();
  return getMixSheet(deps, ctx.actor, id);
}

/** A draft that was never mixed can be thrown away; recorded sheets stay (void them instead). */
export function deleteDraft(deps: AppDeps, actor: Actor, id: number) {
  const sheet = findSheetFor(deps, actor, id);
  if (sheet.status !== "draft") throw conflict("Only a sheet that was not mixed can be deleted; void it instead", { status: sheet.status });
  deps.db.delete(mixSheets).where(eq(mixSheets.id, id)).run();
}

export function listMixSheets(deps: AppDeps, actor: Actor, q: ListMixSheetsQuery): MixSheetSummaryDto[] {
  const filters: (SQL | undefined)[] = [jobScope(actor)];
  if (q.jobId) filters.push(eq(mixSheets.jobId, q.jobId));
  if (q.status) filters.push(eq(mixSheets.status, q.status));
  const rows = deps.db
    .select({ s: mixSheets, jobTitle: jobs.title, layerName: planLayers.name, layerKind: planLayers.kind, mixedByName: mixer.name })
    .from(mixSheets)
    .innerJoin(jobs, eq(mixSheets.jobId, jobs.id))
    .innerJoin(planLayers, eq(mixSheets.layerId, planLayers.id))
    .leftJoin(mixer, eq(mixSheets.mixedBy, mixer.id))
    .where(and(...filters))
    .orderBy(desc(mixSheets.createdAt), desc(mixSheets.id))
    .limit(q.limit)
    .all();
  return rows.map(({ s, jobTitle, layerName, layerKind, mixedByName }) => ({
    id: s.id,
    jobId: s.jobId,
    jobTitle,
    layerId: s.layerId,
    layerName,
    layerKind,
    status: s.status,
    total: convertVolume(s.totalMl, "mL", s.unit as VolumeUnit),
    unit: s.unit as VolumeUnit,
    totalMl: s.totalMl,
    vocGPerL: s.vocGPerL,
    mixedAt: isoOrNull(s.mixedAt),
    mixedByName,
    potLifeEndsAt: s.mixedAt != null && s.potLifeMinutes ? potLifeEnds(new Date(s.mixedAt), s.potLifeMinutes).toISOString() : null,
    createdAt: iso(s.createdAt),
  }));
}
