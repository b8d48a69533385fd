import { and, asc, desc, eq, inArray, isNotNull, or, sql } from "drizzle-orm";
import { computeQuoteTotals } from "../../../shared/quote/index";
import type { AppDeps } from "../../deps";
import type { RequestContext } from "../../http/context";
import { changeOrders, jobStageEvents, payments, jobs, layerComponents, materials, planLayers, planVersions, quoteVersions, quotes } from "../../db/schema";
import { recordAudit } from "../audit/audit.service";
import { colourChangedIn, isOpenChange, sideBySide, type LayerFace, type LayerPair } from "../../../shared/domain/change-orders";

/*
 * The change-order facts other modules need (the plan editor, the booth card, mix sheets), from the tables alone so
 * that those modules can call them without a circle of imports.
 */

export type Db = Pick<AppDeps["db"], "select" | "insert" | "update" | "delete">;
export type ChangeOrderRow = typeof changeOrders.$inferSelect;
type JobRef = { id: number; sprayedPlanVersionId: number | null };

/** The job's approved quote version (the newest approved one), if the customer has approved one. */
export function approvedQuoteOf(db: Db, jobId: number) {
  return db
    .select({ v: quoteVersions })
    .from(quoteVersions)
    .innerJoin(quotes, eq(quoteVersions.quoteId, quotes.id))
    .where(and(eq(quotes.jobId, jobId), eq(quoteVersions.status, "approved")))
    .orderBy(desc(quoteVersions.decidedAt), desc(quoteVersions.id))
    .limit(1)
    .get()?.v;
}

export function changeOrdersOf(db: Db, jobId: number): ChangeOrderRow[] {
  return db.select().from(changeOrders).where(eq(changeOrders.jobId, jobId)).orderBy(asc(changeOrders.id)).all();
}

/**
 * The plan version the job works from when change orders decide it: the new version of the change the customer
 * approved last, else the version the first plan change started from. Null when no plan change was ever made (the
 * booth then keeps its own rule: the sprayed version, else the latest).
 */
export function workingVersionId(db: Db, job: JobRef): number | null {
  const planChanges = changeOrdersOf(db, job.id).filter((c) => c.fromVersionId != null && c.toVersionId != null);
  if (!planChanges.length) return null;
  const approved = planChanges.filter((c) => c.status === "approved").sort((a, b) => (a.decidedAt ?? 0) - (b.decidedAt ?? 0) || a.id - b.id);
  return approved.length ? approved[approved.length - 1]!.toVersionId : planChanges[0]!.fromVersionId;
}

/** A version's layers as the side-by-side compares them (the mix in words: "clear 4 · hardener 1 · reducer 10 %"). */
export function layerFaces(db: Db, versionId: number | null): LayerFace[] {
  if (versionId == null) return [];
  const layers = db.select().from(planLayers).where(eq(planLayers.versionId, versionId)).orderBy(asc(planLayers.position), asc(planLayers.id)).all();
  if (!layers.length) return [];
  const comps = db
    .select({ c: layerComponents, code: materials.code })
    .from(layerComponents)
    .innerJoin(materials, eq(layerComponents.materialId, materials.id))
    .where(inArray(layerComponents.layerId, layers.map((l) => l.id)))
    .orderBy(asc(layerComponents.position), asc(layerComponents.id))
    .all();
  return layers.map((l) => ({
    id: l.id,
    position: l.position,
    kind: l.kind,
    name: l.name,
    coats: l.coats,
    mix: comps
      .filter((x) => x.c.layerId === l.id)
      .map(({ c, code }) => `${c.label} (${code}) ${c.parts != null ? c.parts : `${c.percent} %`}`)
      .join(" · "),
  }));
}

export function pairsOf(db: Db, co: Pick<ChangeOrderRow, "fromVersionId" | "toVersionId">): LayerPair[] {
  return co.fromVersionId != null && co.toVersionId != null ? sideBySide(layerFaces(db, co.fromVersionId), layerFaces(db, co.toVersionId)) : [];
}

/**
 * The layers of the version the booth works from that open changes (draft or sent) would alter: for a plan change
 * the layers that differ; a change of items or prep holds every layer until the customer answers.
 */
export function heldLayers(db: Db, job: JobRef, boothLayerIds: readonly number[]): { layerIds: Set<number>; changeOrderIds: number[] } {
  const open = changeOrdersOf(db, job.id).filter((c) => isOpenChange(c.status));
  const held = new Set<number>();
  for (const c of open) {
    if (c.fromVersionId == null || c.toVersionId == null) boothLayerIds.forEach((id) => held.add(id));
    else for (const p of pairsOf(db, c)) if (p.changed && p.before && boothLayerIds.includes(p.before.id)) held.add(p.before.id);
  }
  return { layerIds: held, changeOrderIds: open.map((c) => c.id) };
}

/**
 * Whether the plan editor must keep a version as it is and save into a new one: on an approved job, the version the
 * job works from, and the new version of a change already sent to the customer.
 */
export function versionHeld(db: Db, jobId: number | null, versionId: number): boolean {
  if (jobId == null || !approvedQuoteOf(db, jobId)) return false;
  const job = db.select({ id: jobs.id, sprayedPlanVersionId: jobs.sprayedPlanVersionId }).from(jobs).where(eq(jobs.id, jobId)).get();
  if (!job) return false;
  const working = workingVersionId(db, job);
  if (working == null) return true; // no change yet: the latest version is the one the customer approved
  if (working === versionId) return true;
  return changeOrdersOf(db, jobId).some((c) => c.toVersionId === versionId && c.status !== "draft");
}

/** A line on the job's timeline (the stage history), the stage unchanged. */
export function onTimeline(db: Db, jobId: number, note: string, userId: string | null, now: number, via: "user" | "system" | "payment" = "user") {
  const job = db.select({ stage: jobs.stage }).from(jobs).where(eq(jobs.id, jobId)).get();
  if (!job) return;
  db.insert(jobStageEvents).values({ jobId, fromStage: job.stage, toStage: job.stage, note: note.slice(0, 500), userId, via, at: now }).run();
}

/**
 * Called by the plan editor after saving a version of a job's plan: on an approved job the new version becomes (or
 * updates) a draft change order, so the change goes back to the customer before the booth sprays it.
 */
export function recordPlanChange(tx: Db, ctx: RequestContext, jobId: number | null, versionId: number, versionNumber: number, now: number) {
  if (jobId == null) return;
  const approved = approvedQuoteOf(tx, jobId);
  if (!approved) return;
  const job = tx.select({ id: jobs.id, sprayedPlanVersionId: jobs.sprayedPlanVersionId }).from(jobs).where(eq(jobs.id, jobId)).get();
  if (!job) return;
  const all = changeOrdersOf(tx, jobId);
  const draft = all.find((c) => c.status === "draft" && c.kind === "plan");
  if (draft) {
    if (draft.toVersionId === versionId) return;
    const colourChanged = colourChangedIn(pairsOf(tx, { fromVersionId: draft.fromVersionId, toVersionId: versionId }));
    tx.update(changeOrders).set({ toVersionId: versionId, colourChanged, updatedAt: now, version: draft.version + 1, updatedBy: ctx.actor.id }).where(eq(changeOrders.id, draft.id)).run();
    recordAudit(tx, ctx, { kind: "plan", entity: "change_order", entityId: draft.id, action: "plan_version_changed", before: { toVersionId: draft.toVersionId }, after: { toVersionId: versionId } }, now);
    return;
  }
  const from = workingVersionId(tx, job) ?? previousVersionId(tx, versionId);
  if (from == null || from === versionId) return;
  const colourChanged = colourChangedIn(pairsOf(tx, { fromVersionId: from, toVersionId: versionId }));
  const id = tx
    .insert(changeOrders)
    .values({
      jobId,
      quoteId: approved.quoteId,
      kind: "plan",
      summary: `Finish plan version ${versionNumber}`,
      colourChanged,
      fromVersionId: from,
      toVersionId: versionId,
      lines: [],
      taxPercent: approved.taxPercent,
      taxedKinds: approved.taxedKinds,
      taxRounding: approved.taxRounding,
      depositPercent: approved.depositPercent,
      createdBy: ctx.actor.id,
      createdAt: now,
      updatedAt: now,
      updatedBy: ctx.actor.id,
    })
    .returning({ id: changeOrders.id })
    .get().id;
  recordAudit(tx, ctx, { kind: "plan", entity: "change_order", entityId: id, action: "created", after: { jobId, kind: "plan", fromVersionId: from, toVersionId: versionId, colourChanged } }, now);
  onTimeline(tx, jobId, `Change order #${id} opened: finish plan version ${versionNumber} waits for the customer`, ctx.actor.id, now);
}

/** The version saved just before this one in the same plan. */
function previousVersionId(db: Db, versionId: number): number | null {
  const v = db.select().from(planVersions).where(eq(planVersions.id, versionId)).get();
  if (!v) return null;
  return db.select({ id: planVersions.id }).from(planVersions).where(and(eq(planVersions.planId, v.planId), eq(planVersions.version, v.version - 1))).get()?.id ?? null;
}

/** A change order's extra deposit, what of it counts as paid (flagged payments once accepted; less refunds), and its status. */
export function changeDue(db: Db, changeOrderId: number) {
  const c = db.select().from(changeOrders).where(eq(changeOrders.id, changeOrderId)).get();
  if (!c) return null;
  const t = totalsOfChange(c);
  const row = db
    .select({ n: sql<number>`coalesce(sum(${payments.amountCents} - ${payments.refundedCents}), 0)` })
    .from(payments)
    .where(and(eq(payments.changeOrderId, changeOrderId), or(eq(payments.flagged, false), isNotNull(payments.reviewedAt))))
    .get();
  return { status: c.status, totalCents: t.totalCents, depositCents: Math.max(0, t.depositCents), paidCents: Number(row?.n ?? 0) };
}

export const totalsOfChange = (c: Pick<ChangeOrderRow, "lines" | "taxPercent" | "taxedKinds" | "depositPercent" | "taxRounding">) =>
  computeQuoteTotals(c.lines, { taxPercent: c.taxPercent, taxedKinds: c.taxedKinds, depositPercent: c.depositPercent, taxRounding: c.taxRounding });
