import { and, asc, eq, inArray } from "drizzle-orm";
import type { z } from "zod";
import type { AppDeps } from "../../deps";
import type { RequestContext } from "../../http/context";
import { coatLogs, customers, jobItems, jobs, jobStageEvents, materialLots, materials, mixSheetLines, mixSheets, planLayers, plans, testPanels } from "../../db/schema";
import { badRequest, conflict, notFound } from "../../http/http-error";
import { findJobFor } from "../jobs/jobs.access";
import { documentOf, insertPlan, jobPlanRow, latestVersionRow, loadPlanVersion, type LoadedPlanVersion } from "../plans/plans.service";
import { gunNames } from "../guns/guns.service";
import { setupOf } from "../guns/spray-setup";
import { effectiveCoats } from "../../../shared/domain/booth";
import { toPsi, type SpraySetup } from "../../../shared/domain/spray-setup";
import type { PlanDocument } from "../../../shared/schemas/plan.schema";
import type { RepeatFinishDto, repeatFinishInputSchema } from "../../../shared/schemas/finish-record.schema";

type RepeatInput = z.output<typeof repeatFinishInputSchema>;
type CoatRow = typeof coatLogs.$inferSelect;

/** A layer of the copy as it was really sprayed: the coats that counted and the set-up of the last of them. */
type Sprayed = { coats: number; setup: SpraySetup | null };

const fmt = (n: number) => String(Number(n.toFixed(2)));

/** The plan document of the copy: the recorded version, with each layer's coats and gun set-up as sprayed. */
function recordedDocument(name: string, version: LoadedPlanVersion, sprayed: Map<number, Sprayed>, note: string, guns: Map<number, string>): PlanDocument {
  const doc = documentOf(name.slice(0, 120), null, version);
  doc.versionNote = note.slice(0, 500);
  doc.layers = doc.layers.map((layer, i) => {
    const source = version.layers[i]!;
    const s = sprayed.get(source.id);
    if (!s) return layer;
    const setup = s.setup;
    const lines = setup ? setupOf(setup, guns).summary : "";
    return {
      ...layer,
      coats: s.coats > 0 ? s.coats : layer.coats,
      gunTip: setup?.tipMm != null ? `${fmt(setup.tipMm)} mm` : layer.gunTip,
      pressurePsi: setup?.inletPressure != null && setup.pressureUnit ? Math.round(toPsi(setup.inletPressure, setup.pressureUnit) * 10) / 10 : layer.pressurePsi,
      overlapPct: setup?.overlapPct ?? layer.overlapPct,
      notes: [layer.notes, lines ? `As sprayed: ${lines}` : null].filter(Boolean).join("\n").slice(0, 2000) || null,
    };
  });
  return doc;
}

/** Lots a set of batches poured that are gone from stock (deleted, or nothing left). */
function usedUpLots(deps: AppDeps, sheetIds: number[]): RepeatFinishDto["usedUpLots"] {
  if (!sheetIds.length) return [];
  const lines = deps.db
    .select({ lotId: mixSheetLines.lotId, lotNumber: mixSheetLines.lotNumber, code: materials.code, name: materials.name, left: materialLots.quantityOnHand })
    .from(mixSheetLines)
    .innerJoin(materials, eq(mixSheetLines.materialId, materials.id))
    .leftJoin(materialLots, eq(mixSheetLines.lotId, materialLots.id))
    .where(inArray(mixSheetLines.mixSheetId, sheetIds))
    .orderBy(asc(mixSheetLines.id))
    .all();
  const seen = new Set<string>();
  const out: RepeatFinishDto["usedUpLots"] = [];
  for (const l of lines) {
    if (!l.lotNumber || seen.has(`${l.code}/${l.lotNumber}`)) continue;
    seen.add(`${l.code}/${l.lotNumber}`);
    if (l.left == null || l.left <= 0) out.push({ materialCode: l.code, materialName: l.name, lotNumber: l.lotNumber });
  }
  return out;
}

/** Creates the job (inquiry), its items and its plan in one transaction. */
function createRepeat(
  deps: AppDeps,
  ctx: RequestContext,
  input: RepeatInput,
  from: { customerId: number; title: string; items: (typeof jobItems.$inferSelect)[]; planId: number | null; approvedPanelId: number | null },
  doc: PlanDocument,
  note: string,
): { id: number; planId: number } {
  const customerId = input.customerId ?? from.customerId;
  if (!deps.db.select({ id: customers.id }).from(customers).where(eq(customers.id, customerId)).get()) throw badRequest("That customer does not exist", { customerId: "No such customer" });
  const now = deps.now();
  return deps.db.transaction((tx) => {
    const job = tx
      .insert(jobs)
      .values({
        customerId,
        title: (input.title ?? `${from.title} (repeat)`).slice(0, 160),
        dueDate: input.dueDate ?? null,
        notes: note,
        stage: "inquiry",
        approvedPanelId: from.approvedPanelId,
        stageChangedAt: now,
        createdAt: now,
        updatedAt: now,
      })
      .returning({ id: jobs.id })
      .get()!;
    tx.insert(jobStageEvents).values({ jobId: job.id, fromStage: null, toStage: "inquiry", userId: ctx.actor.id, at: now, note }).run();
    for (const i of from.items)
      tx.insert(jobItems).values({ jobId: job.id, name: i.name, substrate: i.substrate, surfaceArea: i.surfaceArea, areaUnit: i.areaUnit, notes: i.notes }).run();
    const plan = insertPlan(tx, ctx, doc, { jobId: job.id, isTemplate: false, copiedFromPlanId: from.planId, now });
    return { id: job.id, planId: plan.id };
  });
}

/** The counted coats of a job by layer, each layer with the set-up of its last coat (corrections applied). */
function sprayedLayers(rows: CoatRow[]): Map<number, Sprayed> {
  const byId = new Map(rows.map((r) => [r.id, r]));
  const out = new Map<number, Sprayed>();
  const entries = rows.map((c) => ({ id: c.id, layerId: c.layerId, coatNumber: c.coatNumber, at: c.at, correctsId: c.correctsId, voids: c.voids }));
  for (const e of effectiveCoats(entries)) {
    const row = byId.get(e.correctedBy ?? e.id)!;
    const prev = out.get(e.layerId);
    out.set(e.layerId, { coats: (prev?.coats ?? 0) + 1, setup: row.gunId != null || row.tipMm != null || row.inletPressure != null ? row : (prev?.setup ?? null) });
  }
  return out;
}

/**
 * A new job that repeats a recorded finish: the same items, and a plan copied from the version that was sprayed
 * with each layer's coats and gun set-up as they were really logged. The job's approved colour carries over.
 */
export function repeatJob(deps: AppDeps, ctx: RequestContext, jobId: number, input: RepeatInput): RepeatFinishDto {
  const job = findJobFor(deps, ctx.actor, jobId);
  const rows = deps.db.select().from(coatLogs).where(eq(coatLogs.jobId, jobId)).orderBy(asc(coatLogs.id)).all();
  const sprayed = sprayedLayers(rows);
  if (sprayed.size === 0) throw conflict("Nothing has been sprayed on this job yet, so there is no finish to repeat; start a new job from its plan instead", { id: "No coats logged" });
  const plan = jobPlanRow(deps.db, jobId);
  const versionId = job.sprayedPlanVersionId ?? (plan ? latestVersionRow(deps.db, plan.id).id : null);
  if (versionId == null) throw conflict("This job has no finish plan to repeat", { id: "No plan" });
  const version = loadPlanVersion(deps, versionId);
  const planName = plan?.name ?? deps.db.select({ name: plans.name }).from(plans).where(eq(plans.id, version.planId)).get()?.name ?? job.title;
  const note = `Repeat of job #${job.id} (${job.title}), from plan version ${version.version} as sprayed`;
  const doc = recordedDocument(planName, version, sprayed, note, gunNames(deps));
  const items = deps.db.select().from(jobItems).where(eq(jobItems.jobId, jobId)).orderBy(asc(jobItems.id)).all();
  const created = createRepeat(deps, ctx, input, { customerId: job.customerId, title: job.title, items, planId: version.planId, approvedPanelId: job.approvedPanelId }, doc, note);
  const sheets = deps.db.select({ id: mixSheets.id }).from(mixSheets).where(and(eq(mixSheets.jobId, jobId), eq(mixSheets.status, "mixed"))).all();
  return { ...created, usedUpLots: usedUpLots(deps, sheets.map((s) => s.id)) };
}

/**
 * A new job from a test panel: the plan the panel was sprayed from, with the panel's layer set to the panel's
 * coats and set-up, and the panel as the approved colour. Needs the panel linked to a plan layer.
 */
export function repeatPanel(deps: AppDeps, ctx: RequestContext, panelId: number, input: RepeatInput & { customerId?: number }): RepeatFinishDto {
  const panel = deps.db.select().from(testPanels).where(eq(testPanels.id, panelId)).get();
  if (!panel) throw notFound("Test panel");
  if (panel.planLayerId == null) throw conflict("This panel is not linked to a plan layer, so its recipe is not known; link it to the layer it was sprayed from", { planLayerId: "Not linked" });
  if (input.customerId === undefined && panel.jobId == null) throw badRequest("Say which customer the new job is for", { customerId: "Required for a library panel" });
  const sourceJob = panel.jobId != null ? deps.db.select().from(jobs).where(eq(jobs.id, panel.jobId)).get() : undefined;
  const layerVersion = deps.db.select({ versionId: planLayers.versionId }).from(planLayers).where(eq(planLayers.id, panel.planLayerId)).get();
  if (!layerVersion) throw conflict("The plan layer this panel was sprayed from is gone", { planLayerId: "Gone" });
  const version = loadPlanVersion(deps, layerVersion.versionId);
  const planName = deps.db.select({ name: plans.name }).from(plans).where(eq(plans.id, version.planId)).get()?.name ?? panel.candyName;
  const note = `From test panel #${panel.id} (${panel.candyName} over ${panel.groundName}, ${panel.coats} coats)`;
  const doc = recordedDocument(planName, version, new Map([[panel.planLayerId, { coats: panel.coats, setup: panel }]]), note, gunNames(deps));
  const items = sourceJob ? deps.db.select().from(jobItems).where(eq(jobItems.jobId, sourceJob.id)).orderBy(asc(jobItems.id)).all() : [];
  const created = createRepeat(
    deps,
    ctx,
    input,
    { customerId: input.customerId ?? sourceJob!.customerId, title: sourceJob?.title ?? `${panel.candyName} over ${panel.groundName}`, items, planId: version.planId, approvedPanelId: panel.id },
    doc,
    note,
  );
  return { ...created, usedUpLots: usedUpLots(deps, panel.mixSheetId != null ? [panel.mixSheetId] : []) };
}
