import { and, asc, count, desc, eq, inArray, isNotNull, like, max,  type SQL, placeholder } from "drizzle-orm";
import { preparedQuery } from "../../db/prepared";
import type { AppDeps } from "../../deps";
import type { Tx } from "../../db/client";
import type { Actor } from "../../auth/session";
import { jobs, layerComponents, materials, mixSheets, planLayers, planVersions, plans, users } from "../../db/schema";
import { badRequest, conflict, notFound } from "../../http/http-error";
import { iso, isoOrNull } from "../../http/dates";
import type { RequestContext } from "../../http/context";
import { recordAudit } from "../audit/audit.service";
import { planAuditSummary } from "./plan-audit";
import { atVersion, nextVersion, staleEdit } from "../../db/edit-version";
import { recordPlanChange, versionHeld } from "../change-orders/change-order-rows";
import { findJobFor, jobScope } from "../jobs/jobs.access";
import { seesCost } from "../materials/materials.service";
import { cautionsFor } from "../../../shared/domain/safety";
import { layerMixProblem } from "../../../shared/domain/layer-mix";
import { layerTimingDefaults, type MaterialTiming } from "../../../shared/domain/booth-timing";
import type {
  LayerComponentDto,
  ListPlansQuery,
  PlanDocument,
  SavePlanInput,
  PlanDto,
  PlanLayerDto,
  PlanSummaryDto,
  PlanVersionDto,
  PlanVersionSummaryDto,
  StartJobPlanValues,
} from "../../../shared/schemas/plan.schema";

/*
 * Finish plans. Exported for other areas (keep these signatures stable):
 *
 *   loadPlanVersion(deps, versionId): LoadedPlanVersion
 *     One version with its layers in order (position), each with its components in order and the
 *     catalogue figures of each component's material (code, name, category, density, VOC, water/exempt %,
 *     volume solids, pot life, isocyanate and flammable flags, cost cents per purchase unit), the layer's
 *     safety `cautions` (cautionsFor) and shortest pot life. Throws a 404 HttpError when the version does not
 *     exist. Includes costs: strip them (toVersionDto) before sending to anyone outside the office.
 *
 *   getJobPlan(deps, actor, jobId): PlanDto | null
 *     The job's current plan with its latest version, as the actor may see it (painters: assigned jobs only,
 *     no cost fields; anything outside the actor's reach is a 404), or null when the job has no plan.
 *
 *   freezePlanVersion(tx, versionId, jobId, now, ctx?): boolean
 *     Marks a version used at the booth (frozenAt, once) and points jobs.sprayedPlanVersionId at it. Call it
 *     inside the transaction that records the use (a mix sheet recorded as mixed, a coat logged). Returns true
 *     when the version was frozen by this call; then an audit entry (kind "plan") is written too.
 *
 * Editing model: the editor sends the whole plan (PUT /api/plans/:id). It is saved into the latest version
 * unless that version is locked (frozen, or referenced by a mix sheet), in which case version N+1 is made.
 * Locked versions never change.
 */


export type LoadedComponent = LayerComponentDto & { costCents: number };
export type LoadedLayer = Omit<PlanLayerDto, "components"> & { components: LoadedComponent[] };
export type LoadedPlanVersion = {
  id: number;
  planId: number;
  version: number;
  frozenAt: number | null;
  note: string | null;
  createdAt: number;
  createdBy: string | null;
  createdByName: string | null;
  layers: LoadedLayer[];
};

type PlanRow = typeof plans.$inferSelect;

const versionQuery = preparedQuery((db: Tx) =>
  db.select({ v: planVersions, by: users.name }).from(planVersions).leftJoin(users, eq(planVersions.createdBy, users.id)).where(eq(planVersions.id, placeholder("versionId"))).prepare(),
);
const layersQuery = preparedQuery((db: Tx) =>
  db.select().from(planLayers).where(eq(planLayers.versionId, placeholder("versionId"))).orderBy(asc(planLayers.position), asc(planLayers.id)).prepare(),
);
const componentsQuery = preparedQuery((db: Tx) =>
  db
    .select({ c: layerComponents, m: materials })
    .from(layerComponents)
    .innerJoin(planLayers, eq(layerComponents.layerId, planLayers.id))
    .innerJoin(materials, eq(layerComponents.materialId, materials.id))
    .where(eq(planLayers.versionId, placeholder("versionId")))
    .orderBy(asc(layerComponents.position), asc(layerComponents.id))
    .prepare(),
);

export function loadPlanVersion(deps: { db: Tx }, versionId: number): LoadedPlanVersion {
  const v = versionQuery(deps.db).get({ versionId });
  if (!v) throw notFound("Plan version");
  const layers = layersQuery(deps.db).all({ versionId });
  const comps = layers.length ? componentsQuery(deps.db).all({ versionId }) : [];
  return {
    id: v.v.id,
    planId: v.v.planId,
    version: v.v.version,
    frozenAt: v.v.frozenAt,
    note: v.v.note,
    createdAt: v.v.createdAt,
    createdBy: v.v.createdBy,
    createdByName: v.by,
    layers: layers.map((l) => {
      const components: LoadedComponent[] = comps
        .filter((x) => x.c.layerId === l.id)
        .map(({ c, m }) => ({
          id: c.id,
          position: c.position,
          label: c.label,
          parts: c.parts,
          percent: c.percent,
          percentOf: c.percentOf ?? null,
          materialId: m.id,
          materialCode: m.code,
          materialName: m.name,
          category: m.category,
          purchaseUnit: m.purchaseUnit,
          densityGPerMl: m.densityGPerMl,
          vocGPerL: m.vocGPerL,
          waterExemptPct: m.waterExemptPct,
          volumeSolidsPct: m.volumeSolidsPct,
          potLifeMinutes: m.potLifeMinutes,
          containsIsocyanates: m.containsIsocyanates,
          flammable: m.flammable,
          costCents: m.costCents,
        }));
      const potLives = components.map((c) => c.potLifeMinutes).filter((p): p is number => p != null);
      return {
        id: l.id,
        position: l.position,
        kind: l.kind,
        name: l.name,
        coats: l.coats,
        flashMinutes: l.flashMinutes,
        minutesPerCoat: l.minutesPerCoat,
        dryMinutes: l.dryMinutes,
        inductionMinutes: l.inductionMinutes,
        recoatMinMinutes: l.recoatMinMinutes,
        recoatMaxMinutes: l.recoatMaxMinutes,
        catalysed: components.some((c) => c.category === "hardener" || c.containsIsocyanates),
        gunTip: l.gunTip,
        pressurePsi: l.pressurePsi,
        overlapPct: l.overlapPct,
        dryFilmPerCoat: l.dryFilmPerCoat,
        dryFilmUnit: l.dryFilmUnit,
        transferEfficiencyPct: l.transferEfficiencyPct,
        notes: l.notes,
        components,
        cautions: cautionsFor(components),
        potLifeMinutes: potLives.length ? Math.min(...potLives) : null,
      };
    }),
  };
}

/** A version for the API: costs only for the office. */
export function toVersionDto(v: LoadedPlanVersion, actor: Actor, locked: boolean): PlanVersionDto {
  const office = seesCost(actor);
  return {
    id: v.id,
    planId: v.planId,
    version: v.version,
    frozenAt: isoOrNull(v.frozenAt),
    locked,
    note: v.note,
    createdAt: iso(v.createdAt),
    createdByName: v.createdByName,
    layers: v.layers.map((l) => ({
      ...l,
      components: l.components.map(({ costCents, ...c }) => (office ? { ...c, costCents } : c)),
    })),
  };
}

function versionLocked(db: Tx, versionId: number, frozenAt: number | null): boolean {
  if (frozenAt != null) return true;
  return (db.select({ n: count() }).from(mixSheets).where(eq(mixSheets.planVersionId, versionId)).get()?.n ?? 0) > 0;
}

export function latestVersionRow(db: Tx, planId: number) {
  const row = db.select().from(planVersions).where(eq(planVersions.planId, planId)).orderBy(desc(planVersions.version)).limit(1).get();
  if (!row) throw notFound("Plan version");
  return row;
}

function findPlanRow(db: Tx, id: number): PlanRow {
  const plan = db.select().from(plans).where(eq(plans.id, id)).get();
  if (!plan) throw notFound("Plan");
  return plan;
}

/** A plan the actor may reach: templates for all staff; a job's plan only for those who reach the job. */
export function findPlanFor(deps: AppDeps, actor: Actor, id: number): PlanRow {
  const plan = findPlanRow(deps.db, id);
  if (plan.jobId != null) {
    try {
      findJobFor(deps, actor, plan.jobId);
    } catch {
      throw notFound("Plan");
    }
  }
  return plan;
}

function planDto(deps: AppDeps, actor: Actor, plan: PlanRow): PlanDto {
  const latest = latestVersionRow(deps.db, plan.id);
  const loaded = loadPlanVersion(deps, latest.id);
  const versionCount = deps.db.select({ n: count() }).from(planVersions).where(eq(planVersions.planId, plan.id)).get()?.n ?? 0;
  const job = plan.jobId != null ? deps.db.select({ title: jobs.title, sprayed: jobs.sprayedPlanVersionId }).from(jobs).where(eq(jobs.id, plan.jobId)).get() : undefined;
  const source = plan.copiedFromPlanId != null ? deps.db.select({ name: plans.name }).from(plans).where(eq(plans.id, plan.copiedFromPlanId)).get() : undefined;
  return {
    id: plan.id,
    name: plan.name,
    description: plan.description,
    isTemplate: plan.isTemplate,
    jobId: plan.jobId,
    jobTitle: job?.title ?? null,
    copiedFromPlanId: plan.copiedFromPlanId,
    copiedFromName: source?.name ?? null,
    sprayedVersionId: job?.sprayed ?? null,
    createdAt: iso(plan.createdAt),
    updatedAt: iso(plan.updatedAt),
    versionCount,
    latest: toVersionDto(loaded, actor, versionLocked(deps.db, latest.id, latest.frozenAt)),
    version: plan.version,
  };
}

export function getPlan(deps: AppDeps, actor: Actor, id: number): PlanDto {
  return planDto(deps, actor, findPlanFor(deps, actor, id));
}

/** The plan row of a job (one plan per job), or undefined. */
const jobPlanQuery = preparedQuery((db: Tx) => db.select().from(plans).where(eq(plans.jobId, placeholder("jobId"))).orderBy(desc(plans.id)).limit(1).prepare());

export function jobPlanRow(db: Tx, jobId: number): PlanRow | undefined {
  return jobPlanQuery(db).get({ jobId });
}

export function getJobPlan(deps: AppDeps, actor: Actor, jobId: number): PlanDto | null {
  findJobFor(deps, actor, jobId);
  const plan = jobPlanRow(deps.db, jobId);
  return plan ? planDto(deps, actor, plan) : null;
}

export function listPlans(deps: AppDeps, actor: Actor, q: ListPlansQuery): PlanSummaryDto[] {
  const filters: (SQL | undefined)[] = [q.kind === "template" ? eq(plans.isTemplate, true) : and(eq(plans.isTemplate, false), isNotNull(plans.jobId))];
  if (q.kind === "job") filters.push(jobScope(actor));
  if (q.q) filters.push(like(plans.name, `%${q.q}%`));
  const rows = deps.db
    .select({ p: plans, jobTitle: jobs.title })
    .from(plans)
    .leftJoin(jobs, eq(plans.jobId, jobs.id))
    .where(and(...filters))
    .orderBy(q.kind === "template" ? asc(plans.name) : desc(plans.updatedAt), desc(plans.id))
    .limit(200)
    .all();
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.p.id);
  const latest = new Map(
    deps.db
      .select({ planId: planVersions.planId, v: max(planVersions.version) })
      .from(planVersions)
      .where(inArray(planVersions.planId, ids))
      .groupBy(planVersions.planId)
      .all()
      .map((r) => [r.planId, r.v ?? 1]),
  );
  const versionRows = deps.db
    .select({ id: planVersions.id, planId: planVersions.planId, version: planVersions.version })
    .from(planVersions)
    .where(inArray(planVersions.planId, ids))
    .all()
    .filter((v) => latest.get(v.planId) === v.version);
  const kindsByVersion = new Map<number, PlanLayerDto["kind"][]>();
  if (versionRows.length) {
    for (const l of deps.db
      .select({ versionId: planLayers.versionId, kind: planLayers.kind })
      .from(planLayers)
      .where(inArray(planLayers.versionId, versionRows.map((v) => v.id)))
      .orderBy(asc(planLayers.position))
      .all()) {
      kindsByVersion.set(l.versionId, [...(kindsByVersion.get(l.versionId) ?? []), l.kind]);
    }
  }
  return rows.map(({ p, jobTitle }) => {
    const v = versionRows.find((x) => x.planId === p.id);
    const kinds = v ? (kindsByVersion.get(v.id) ?? []) : [];
    return {
      id: p.id,
      name: p.name,
      description: p.description,
      isTemplate: p.isTemplate,
      jobId: p.jobId,
      jobTitle,
      latestVersion: latest.get(p.id) ?? 1,
      layerCount: kinds.length,
      layerKinds: kinds,
      updatedAt: iso(p.updatedAt),
    };
  });
}

export function listVersions(deps: AppDeps, actor: Actor, planId: number): PlanVersionSummaryDto[] {
  const plan = findPlanFor(deps, actor, planId);
  const sprayed = plan.jobId != null ? (deps.db.select({ s: jobs.sprayedPlanVersionId }).from(jobs).where(eq(jobs.id, plan.jobId)).get()?.s ?? null) : null;
  const rows = deps.db
    .select({ v: planVersions, by: users.name })
    .from(planVersions)
    .leftJoin(users, eq(planVersions.createdBy, users.id))
    .where(eq(planVersions.planId, planId))
    .orderBy(desc(planVersions.version))
    .all();
  const layerCounts = new Map(
    deps.db
      .select({ versionId: planLayers.versionId, n: count() })
      .from(planLayers)
      .where(inArray(planLayers.versionId, rows.map((r) => r.v.id)))
      .groupBy(planLayers.versionId)
      .all()
      .map((r) => [r.versionId, r.n]),
  );
  return rows.map(({ v, by }) => ({
    id: v.id,
    version: v.version,
    frozenAt: isoOrNull(v.frozenAt),
    locked: versionLocked(deps.db, v.id, v.frozenAt),
    note: v.note,
    createdAt: iso(v.createdAt),
    createdByName: by,
    layerCount: layerCounts.get(v.id) ?? 0,
    sprayed: sprayed === v.id,
  }));
}

export function getVersion(deps: AppDeps, actor: Actor, planId: number, versionId: number): PlanVersionDto {
  findPlanFor(deps, actor, planId);
  const row = deps.db.select().from(planVersions).where(and(eq(planVersions.id, versionId), eq(planVersions.planId, planId))).get();
  if (!row) throw notFound("Plan version");
  return toVersionDto(loadPlanVersion(deps, versionId), actor, versionLocked(deps.db, row.id, row.frozenAt));
}

/**
 * Checks a plan document against the catalogue and the mix engine. Problems are reported with the field path
 * of the layer's component (`layers.2.components.1.percentOf`), so the editor shows them beside the field.
 */
export function validateDocument(deps: { db: Tx }, doc: PlanDocument) {
  const ids = doc.layers.flatMap((l) => l.components.map((c) => c.materialId));
  const known = new Set(ids.length ? deps.db.select({ id: materials.id }).from(materials).where(inArray(materials.id, [...new Set(ids)])).all().map((m) => m.id) : []);
  const fields: Record<string, string> = {};
  doc.layers.forEach((layer, i) => {
    layer.components.forEach((c, j) => {
      if (!known.has(c.materialId)) fields[`layers.${i}.components.${j}.materialId`] = "No such material in the catalogue";
    });
    if (layer.recoatMinMinutes != null && layer.recoatMaxMinutes != null && layer.recoatMinMinutes > layer.recoatMaxMinutes)
      fields[`layers.${i}.recoatMaxMinutes`] = "The latest recoat must be after the earliest";
    const problem = layerMixProblem(layer.components);
    if (problem) fields[`layers.${i}.${problem.path}`] = problem.message;
  });
  const first = Object.entries(fields)[0];
  if (first) {
    const i = Number(first[0].split(".")[1]);
    throw badRequest(`Layer ${i + 1} (${doc.layers[i]!.name}): ${first[1]}`, fields);
  }
}

/** The materials' data-sheet timing figures, by material id (one query for the whole document). */
function materialTimings(tx: Tx, layers: PlanDocument["layers"]): Map<number, MaterialTiming> {
  const ids = [...new Set(layers.flatMap((l) => l.components.map((c) => c.materialId)))];
  if (!ids.length) return new Map();
  const rows = tx
    .select({ id: materials.id, inductionMinutes: materials.inductionMinutes, recoatMinMinutes: materials.recoatMinMinutes, recoatMaxMinutes: materials.recoatMaxMinutes })
    .from(materials)
    .where(inArray(materials.id, ids))
    .all();
  return new Map(rows.map((r) => [r.id, r]));
}

function insertLayers(tx: Tx, versionId: number, layers: PlanDocument["layers"]) {
  const timings = materialTimings(tx, layers);
  layers.forEach((l, i) => {
    // A timing figure left empty comes from the data sheets now, so the saved version keeps it whatever the catalogue says later.
    const sheet = layerTimingDefaults(l.components.map((c) => timings.get(c.materialId)).filter((t): t is MaterialTiming => t != null));
    const layer = tx
      .insert(planLayers)
      .values({
        versionId,
        position: i + 1,
        kind: l.kind,
        name: l.name,
        coats: l.coats,
        flashMinutes: l.flashMinutes,
        minutesPerCoat: l.minutesPerCoat ?? 5,
        dryMinutes: l.dryMinutes,
        inductionMinutes: l.inductionMinutes ?? sheet.inductionMinutes,
        recoatMinMinutes: l.recoatMinMinutes ?? sheet.recoatMinMinutes,
        recoatMaxMinutes: l.recoatMaxMinutes ?? sheet.recoatMaxMinutes,
        gunTip: l.gunTip ?? null,
        pressurePsi: l.pressurePsi ?? null,
        overlapPct: l.overlapPct ?? null,
        dryFilmPerCoat: l.dryFilmPerCoat ?? null,
        dryFilmUnit: l.dryFilmUnit ?? "um",
        transferEfficiencyPct: l.transferEfficiencyPct ?? 65,
        notes: l.notes ?? null,
      })
      .returning({ id: planLayers.id })
      .get();
    l.components.forEach((c, j) => {
      tx.insert(layerComponents)
        .values({
          layerId: layer.id,
          position: j + 1,
          materialId: c.materialId,
          label: c.label,
          parts: c.parts ?? null,
          percent: c.percent ?? null,
          percentOf: c.percent != null || (c.percentOf && c.percentOf.length) ? (c.percentOf ?? []) : null,
        })
        .run();
    });
  });
}

/** A loaded version as a plan document (for copies). */
export function documentOf(name: string, description: string | null, v: LoadedPlanVersion): PlanDocument {
  return {
    name,
    description,
    versionNote: null,
    layers: v.layers.map((l) => ({
      kind: l.kind,
      name: l.name,
      coats: l.coats,
      flashMinutes: l.flashMinutes,
      minutesPerCoat: l.minutesPerCoat,
      dryMinutes: l.dryMinutes,
      inductionMinutes: l.inductionMinutes,
      recoatMinMinutes: l.recoatMinMinutes,
      recoatMaxMinutes: l.recoatMaxMinutes,
      gunTip: l.gunTip,
      pressurePsi: l.pressurePsi,
      overlapPct: l.overlapPct,
      dryFilmPerCoat: l.dryFilmPerCoat,
      dryFilmUnit: l.dryFilmUnit,
      transferEfficiencyPct: l.transferEfficiencyPct,
      notes: l.notes,
      components: l.components.map((c) => ({ materialId: c.materialId, label: c.label, parts: c.parts, percent: c.percent, percentOf: c.percentOf })),
    })),
  };
}

export function insertPlan(tx: Tx, ctx: RequestContext, doc: PlanDocument, opts: { jobId: number | null; isTemplate: boolean; copiedFromPlanId: number | null; now: number }) {
  const plan = tx
    .insert(plans)
    .values({
      name: doc.name,
      description: doc.description ?? null,
      jobId: opts.jobId,
      isTemplate: opts.isTemplate,
      copiedFromPlanId: opts.copiedFromPlanId,
      createdBy: ctx.actor.id,
      createdAt: opts.now,
      updatedAt: opts.now,
    })
    .returning()
    .get();
  const version = tx
    .insert(planVersions)
    .values({ planId: plan.id, version: 1, note: doc.versionNote ?? null, createdBy: ctx.actor.id, createdAt: opts.now })
    .returning({ id: planVersions.id })
    .get();
  insertLayers(tx, version.id, doc.layers);
  recordAudit(
    tx,
    ctx,
    {
      kind: "plan",
      entity: opts.isTemplate ? "plan_template" : "plan",
      entityId: plan.id,
      action: "created",
      after: { ...planAuditSummary(tx, doc.name, 1, doc.layers), jobId: opts.jobId, copiedFromPlanId: opts.copiedFromPlanId },
    },
    opts.now,
  );
  return plan;
}

export function createTemplate(deps: AppDeps, ctx: RequestContext, doc: PlanDocument): PlanDto {
  validateDocument(deps, doc);
  const now = deps.now();
  const plan = deps.db.transaction((tx) => insertPlan(tx, ctx, doc, { jobId: null, isTemplate: true, copiedFromPlanId: null, now }));
  return getPlan(deps, ctx.actor, plan.id);
}

/** Starts a job's plan from a template or plan, from another job's current plan, or empty. One plan per job. */
export function startJobPlan(deps: AppDeps, ctx: RequestContext, jobId: number, input: StartJobPlanValues): PlanDto {
  const job = findJobFor(deps, ctx.actor, jobId);
  if (jobPlanRow(deps.db, jobId)) throw conflict("This job already has a finish plan; open it to change it", { fromPlanId: "The job has a plan" });
  let source: PlanRow | undefined;
  if (input.fromPlanId) {
    source = deps.db.select().from(plans).where(eq(plans.id, input.fromPlanId)).get();
    if (!source) throw badRequest("That plan or template does not exist", { fromPlanId: "No such plan" });
  } else if (input.fromJobId) {
    if (input.fromJobId === jobId) throw badRequest("Choose another job to copy from", { fromJobId: "Same job" });
    const other = deps.db.select({ id: jobs.id }).from(jobs).where(eq(jobs.id, input.fromJobId)).get();
    if (!other) throw badRequest("That job does not exist", { fromJobId: "No such job" });
    source = jobPlanRow(deps.db, input.fromJobId);
    if (!source) throw badRequest("That job has no finish plan to copy", { fromJobId: "No plan on that job" });
  }
  const name = input.name ?? (source ? (source.isTemplate ? source.name : `${source.name} (as job #${source.jobId})`) : `${job.title}: finish`);
  let doc: PlanDocument = { name: name.slice(0, 120), description: source?.description ?? null, versionNote: null, layers: [] };
  if (source) {
    // A job's copy is taken from the version it was sprayed with when there is one, else the latest.
    const sprayed = source.jobId != null ? deps.db.select({ s: jobs.sprayedPlanVersionId }).from(jobs).where(eq(jobs.id, source.jobId)).get()?.s : null;
    const sprayedOk = sprayed != null && deps.db.select({ id: planVersions.id }).from(planVersions).where(and(eq(planVersions.id, sprayed), eq(planVersions.planId, source.id))).get();
    const versionId = sprayedOk ? sprayed! : latestVersionRow(deps.db, source.id).id;
    doc = { ...documentOf(doc.name, doc.description ?? null, loadPlanVersion(deps, versionId)), versionNote: `Copied from "${source.name}"` };
  }
  const now = deps.now();
  const plan = deps.db.transaction((tx) => insertPlan(tx, ctx, doc, { jobId, isTemplate: false, copiedFromPlanId: source?.id ?? null, now }));
  return getPlan(deps, ctx.actor, plan.id);
}

/**
 * Saves the editor's whole document. The latest version is replaced in place unless it is locked (frozen at the
 * booth, or a mix sheet refers to it): then version N+1 is made and the old one stays exactly as it was.
 */
export function savePlan(deps: AppDeps, ctx: RequestContext, planId: number, doc: SavePlanInput): PlanDto {
  const plan = findPlanFor(deps, ctx.actor, planId);
  validateDocument(deps, doc);
  const now = deps.now();
  deps.db.transaction((tx) => {
    // Claim the edit first: if someone saved since this user opened the plan, nothing below runs.
    const claimed = tx
      .update(plans)
      .set({ name: doc.name, description: doc.description ?? null, updatedAt: now, ...nextVersion(plans, ctx.actor.id) })
      .where(and(eq(plans.id, planId), atVersion(plans, doc.version)))
      .run();
    if (claimed.changes === 0) {
      const row = tx.select().from(plans).where(eq(plans.id, planId)).get()!;
      throw staleEdit(tx, "plan", planDto(deps, ctx.actor, row), row);
    }
    const latest = latestVersionRow(tx, planId);
    const before = loadPlanVersion({ db: tx }, latest.id);
    // On an approved job the approved version is kept too: the change becomes a change order for the customer.
    const locked = versionLocked(tx, latest.id, latest.frozenAt) || versionHeld(tx, plan.jobId, latest.id);
    let version = latest.version;
    let savedId = latest.id;
    if (locked) {
      version = latest.version + 1;
      const v = tx
        .insert(planVersions)
        .values({ planId, version, note: doc.versionNote ?? null, createdBy: ctx.actor.id, createdAt: now })
        .returning({ id: planVersions.id })
        .get();
      insertLayers(tx, v.id, doc.layers);
      savedId = v.id;
    } else {
      tx.delete(planLayers).where(eq(planLayers.versionId, latest.id)).run();
      if (doc.versionNote !== undefined) tx.update(planVersions).set({ note: doc.versionNote }).where(eq(planVersions.id, latest.id)).run();
      insertLayers(tx, latest.id, doc.layers);
    }
    recordAudit(
      tx,
      ctx,
      {
        kind: "plan",
        entity: plan.isTemplate ? "plan_template" : "plan",
        entityId: planId,
        action: locked ? "version_created" : "updated",
        before: planAuditSummary(tx, plan.name, before.version, before.layers),
        after: planAuditSummary(tx, doc.name, version, doc.layers),
      },
      now,
    );
    if (!plan.isTemplate) recordPlanChange(tx, ctx, plan.jobId, savedId, version, now);
  });
  return getPlan(deps, ctx.actor, planId);
}

/** Only a plan that was never used (no frozen version, no mix sheet) can be deleted. */
export function deletePlan(deps: AppDeps, ctx: RequestContext, planId: number) {
  const plan = findPlanFor(deps, ctx.actor, planId);
  const versions = deps.db.select().from(planVersions).where(eq(planVersions.planId, planId)).all();
  if (versions.some((v) => versionLocked(deps.db, v.id, v.frozenAt))) {
    throw conflict("This plan has been used at the booth or has mix sheets, so it is kept as the record", { plan: "In use" });
  }
  const now = deps.now();
  deps.db.transaction((tx) => {
    tx.delete(plans).where(eq(plans.id, planId)).run();
    recordAudit(tx, ctx, { kind: "plan", entity: plan.isTemplate ? "plan_template" : "plan", entityId: planId, action: "deleted", before: { name: plan.name, jobId: plan.jobId } }, now);
  });
}

/**
 * Marks a plan version as used at the booth and points the job at it. Call inside the transaction that records
 * the use. Returns true when this call froze the version (an audit entry of kind "plan" is then written).
 */
export function freezePlanVersion(tx: Tx, versionId: number, jobId: number, now: number, ctx: RequestContext | null = null): boolean {
  const v = tx.select({ frozenAt: planVersions.frozenAt, planId: planVersions.planId, version: planVersions.version }).from(planVersions).where(eq(planVersions.id, versionId)).get();
  if (!v) throw notFound("Plan version");
  tx.update(jobs).set({ sprayedPlanVersionId: versionId }).where(eq(jobs.id, jobId)).run();
  if (v.frozenAt != null) return false;
  tx.update(planVersions).set({ frozenAt: now }).where(eq(planVersions.id, versionId)).run();
  recordAudit(tx, ctx, { kind: "plan", entity: "plan_version", entityId: versionId, action: "frozen", after: { planId: v.planId, version: v.version, jobId } }, now);
  return true;
}

/** Saves a copy of a plan's latest version as a new template (e.g. a job's plan that turned out well). */
export function copyAsTemplate(deps: AppDeps, ctx: RequestContext, planId: number, name: string | null | undefined): PlanDto {
  const source = findPlanFor(deps, ctx.actor, planId);
  const version = loadPlanVersion(deps, latestVersionRow(deps.db, planId).id);
  const doc = { ...documentOf((name ?? `${source.name} (template)`).slice(0, 120), source.description, version), versionNote: `Copied from "${source.name}"` };
  const now = deps.now();
  const plan = deps.db.transaction((tx) => insertPlan(tx, ctx, doc, { jobId: null, isTemplate: true, copiedFromPlanId: source.id, now }));
  return getPlan(deps, ctx.actor, plan.id);
}
