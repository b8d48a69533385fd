import { and, asc, desc, eq, isNotNull,  placeholder } from "drizzle-orm";
import type { z } from "zod";
import type { AppDeps } from "../../deps";
import type { Actor } from "../../auth/session";
import type { RequestContext } from "../../http/context";
import { coatLogs, customers, guns, jobItems, jobs, planVersions, plans, prepRecords, testPanels, uploads, users } from "../../db/schema";
import { conflict, forbidden, notFound } from "../../http/http-error";
import { iso } from "../../http/dates";
import { madeAt } from "../../http/made-at";
import { checkGun, gunNames } from "../guns/guns.service";
import { setupColumns, setupOf } from "../guns/spray-setup";
import { findJobFor } from "../jobs/jobs.access";
import { recordStageMove } from "../jobs/stage-move";
import type { Tx } from "../../db/client";
import { preparedQuery } from "../../db/prepared";
import { freezePlanVersion, jobPlanRow, loadPlanVersion, type LoadedPlanVersion } from "../plans/plans.service";
import { panelLabel } from "../panels/panels.service";
import { prepStatusOf } from "../prep/prep.service";
import { asEntry, coatDtos, coatRows, mixSheetDtos } from "./booth-records";
import { nextCoatTiming, timingOverride } from "./coat-timing";
import { layerVoc } from "../plans/plan-estimate.service";
import { getSettings } from "../settings/settings.service";
import { vocAgainstLimit } from "../../../shared/domain/voc-limits";
import { coatCount, effectiveCoats, nextBoothStep, type TempUnit } from "../../../shared/domain/booth";
import { customerApprovedColour } from "../intake/sign-off-rows";
import { heldLayers, workingVersionId } from "../change-orders/change-order-rows";
import { changeHoldOverride, recordChangeOverride } from "../change-orders/booth-hold";
import { COLOUR_LAYER_KINDS, COLOUR_SIGN_OFF_RULE } from "../../../shared/domain/colour-sign-off";
import { needsAdhesionPromoter } from "../../../shared/domain/substrates";
import { STAGE_LABELS, type Stage } from "../../../shared/domain/stages";
import type {
  BoothDto,
  BoothLayerDto,
  BoothNextDto,
  CoatLogDto,
  correctCoatLogInputSchema,
  createCoatLogInputSchema,
} from "../../../shared/schemas/booth.schema";

type JobRow = typeof jobs.$inferSelect;

/** Stages in which coats may be logged: prep (the first coat moves the job to the booth), booth, and curing (re-logging a voided last coat). */
const LOGGING_STAGES: readonly Stage[] = ["in_prep", "in_booth", "curing"];

/**
 * Booth card access: painters their assigned jobs, the owner every job; estimators read the card but do not log
 * coats (they are not at the booth); customers never reach it (route guard).
 */
export function canLogCoats(actor: Actor, job: Pick<JobRow, "assignedPainterId">) {
  return actor.role === "owner" || (actor.role === "painter" && job.assignedPainterId === actor.id);
}


/*
 * The booth card's queries are prepared once (see preparedQuery): the card is read on every tap and every 30 s by
 * each tablet, and building the SQL anew each time cost more than running it.
 */
const latestVersionQuery = preparedQuery((db) =>
  db.select({ id: planVersions.id }).from(planVersions).where(eq(planVersions.planId, placeholder("planId"))).orderBy(desc(planVersions.version)).limit(1).prepare(),
);
const planNameQuery = preparedQuery((db) => db.select({ id: plans.id, name: plans.name }).from(plans).where(eq(plans.id, placeholder("planId"))).prepare());

/** The plan version the booth works from: the one change orders settled on, else the one already sprayed, else the latest. */
function boothVersion(deps: AppDeps, job: JobRow): { planId: number; planName: string; version: LoadedPlanVersion } | null {
  // Change orders decide it once there is one: the version of the change approved last, else the one before the change.
  let versionId = workingVersionId(deps.db, job) ?? job.sprayedPlanVersionId;
  if (versionId == null) {
    const plan = jobPlanRow(deps.db, job.id);
    if (!plan) return null;
    const latest = latestVersionQuery(deps.db).get({ planId: plan.id });
    if (!latest) return null;
    versionId = latest.id;
  }
  const version = loadPlanVersion(deps, versionId);
  const plan = planNameQuery(deps.db).get({ planId: version.planId });
  return plan ? { planId: plan.id, planName: plan.name, version } : null;
}

const headQuery = preparedQuery((db) =>
  db
    .select({ customerName: customers.name, painterName: users.name })
    .from(jobs)
    .innerJoin(customers, eq(jobs.customerId, customers.id))
    .leftJoin(users, eq(jobs.assignedPainterId, users.id))
    .where(eq(jobs.id, placeholder("jobId")))
    .prepare(),
);
const itemsQuery = preparedQuery((db) =>
  db
    .select({ i: jobItems, prepId: prepRecords.id, signedOffAt: prepRecords.signedOffAt })
    .from(jobItems)
    .leftJoin(prepRecords, eq(prepRecords.itemId, jobItems.id))
    .where(eq(jobItems.jobId, placeholder("jobId")))
    .orderBy(asc(jobItems.id))
    .prepare(),
);
const activeGunsQuery = preparedQuery((db) => db.select({ id: guns.id, name: guns.name }).from(guns).where(eq(guns.active, true)).orderBy(asc(guns.name)).prepare());
const panelQuery = preparedQuery((db) => db.select().from(testPanels).where(eq(testPanels.id, placeholder("panelId"))).prepare());
const panelPhotoQuery = preparedQuery((db) =>
  db
    .select({ id: uploads.id, thumb: uploads.thumbName })
    .from(uploads)
    .where(and(eq(uploads.ownerType, "panel"), eq(uploads.ownerId, placeholder("panelId")), eq(uploads.kind, "photo")))
    .orderBy(asc(uploads.id))
    .limit(1)
    .prepare(),
);

/**
 * Whether the shop's colour rule holds the booth: the setting is on, no colour coat is on yet, and the job's agreed
 * colour is not a panel the customer approved in the portal.
 */
function colourWaits(deps: AppDeps, job: JobRow, layers: BoothLayerDto[]): boolean {
  if (!getSettings(deps).requireColourSignOff) return false;
  const colour = layers.filter((l) => COLOUR_LAYER_KINDS.includes(l.kind));
  if (!colour.length || colour.some((l) => l.coatsDone > 0)) return false;
  return !customerApprovedColour(deps, job);
}

/** Everything the booth card shows, in one response; computed from stored times only. No money anywhere. */
export function getBooth(deps: AppDeps, actor: Actor, jobId: number): BoothDto {
  const job = findJobFor(deps, actor, jobId);
  const now = deps.now();
  const head = headQuery(deps.db).get({ jobId })!;
  const items = itemsQuery(deps.db)
    .all({ jobId })
    .map(({ i, prepId, signedOffAt }) => ({
      id: i.id,
      name: i.name,
      substrate: i.substrate,
      needsAdhesionPromoter: needsAdhesionPromoter(i.substrate),
      prepStatus: prepStatusOf(prepId == null ? null : { signedOffAt }),
      prepRecordId: prepId,
    }));
  const prepReady = items.every((i) => i.prepStatus === "signed_off");

  let approvedPanel: BoothDto["job"]["approvedPanel"] = null;
  if (job.approvedPanelId != null) {
    const panel = panelQuery(deps.db).get({ panelId: job.approvedPanelId });
    if (panel) {
      const photo = panelPhotoQuery(deps.db).get({ panelId: panel.id });
      approvedPanel = {
        id: panel.id,
        label: panelLabel(panel),
        thumbUrl: photo?.thumb ? `/api/uploads/${photo.id}/thumb` : null,
        planLayerId: panel.planLayerId,
        setup: setupOf(panel, panel.gunId != null ? gunNames(deps) : new Map()),
      };
    }
  }

  const planned = boothVersion(deps, job);
  const rows = coatRows(deps, jobId);
  const layerNames = new Map((planned?.version.layers ?? []).map((l) => [l.id, l.name]));
  const coatLogsDto = coatDtos(deps, rows, layerNames);
  const sheets = mixSheetDtos(deps, jobId);

  let layers: BoothLayerDto[] = [];
  let next: BoothNextDto = { state: "no_plan" };
  let openBatch: BoothDto["openBatch"] = null;
  if (planned) {
    const versionLayers = planned.version.layers;
    // A "prep" layer is done through the prep records, not sprayed: it is not part of the coat sequence.
    const sprayLayers = versionLayers.filter((l) => l.kind !== "prep");
    const layerIds = new Set(sprayLayers.map((l) => l.id));
    const effective = effectiveCoats(rows.filter((r) => layerIds.has(r.c.layerId)).map((r) => asEntry(r.c)));
    const step = nextBoothStep(sprayLayers, effective, now);
    const progress = new Map(step.layers.map((p) => [p.layerId, p]));
    const { vocLimits } = getSettings(deps);
    layers = versionLayers.map((l) => {
      const p = progress.get(l.id);
      const vocGPerL = layerVoc(l);
      const voc = vocAgainstLimit(l.kind, vocGPerL, vocLimits);
      return {
        vocGPerL,
        vocLimitGPerL: voc.limitGPerL,
        vocOverLimit: voc.over,
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
        catalysed: l.catalysed,
        gunTip: l.gunTip,
        pressurePsi: l.pressurePsi,
        overlapPct: l.overlapPct,
        notes: l.notes,
        components: l.components.map((c) => ({ label: c.label, materialCode: c.materialCode, materialName: c.materialName, parts: c.parts, percent: c.percent, percentOf: c.percentOf })),
        cautions: l.cautions,
        isPrep: !p,
        coatsDone: p ? p.coatsDone : prepReady ? coatCount(l.coats) : 0,
        status: p ? p.status : prepReady ? "done" : "current",
        changeWaiting: false,
      };
    });
    const timer = (t: { kind: "flash" | "dry"; startedAt: number; endsAt: number } | null) => (t ? { kind: t.kind, startedAt: iso(t.startedAt), endsAt: iso(t.endsAt) } : null);
    if (step.state === "no_layers") next = { state: "no_layers" };
    else if (step.state === "done") next = { state: "done", lastCoatAt: iso(step.lastCoatAt), timer: timer(step.timer)! };
    else {
      const layer = sprayLayers[step.layerIndex]!;
      const batch = sheets.find((s) => s.layerId === layer.id && s.status === "mixed" && s.mixedAt);
      if (batch) openBatch = { mixSheetId: batch.id, layerId: batch.layerId, mixedAt: batch.mixedAt!, potLifeEndsAt: batch.potLifeEndsAt };
      const timing = nextCoatTiming(sprayLayers, effective, step.layerIndex, step.coat, batch?.mixedAt ?? null, now);
      // A minimum recoat time longer than the dry time holds the next layer back: the dry timer runs to the later.
      let stepTimer = step.timer;
      if (stepTimer?.kind === "dry" && timing.windows.dryEndsAt) stepTimer = { ...stepTimer, endsAt: Math.max(stepTimer.endsAt, Date.parse(timing.windows.dryEndsAt)) };
      next = {
        state: "spray",
        layerId: layer.id,
        layerName: layer.name,
        layerKind: layer.kind,
        coat: step.coat,
        of: step.of,
        isLastLayer: step.isLastLayer,
        isFirstCoatOfJob: effective.length === 0,
        timer: timer(stepTimer),
        layerDoneAt: iso(step.layerDoneAt),
        ...timing,
      };
    }
  }

  const held = heldLayers(deps.db, job, layers.map((l) => l.id));
  for (const l of layers) l.changeWaiting = held.layerIds.has(l.id);

  return {
    serverNow: iso(now),
    job: {
      id: job.id,
      title: job.title,
      stage: job.stage,
      customerName: head.customerName,
      dueDate: job.dueDate,
      assignedPainterName: head.painterName,
      approvedPanel,
      colourWaitsForCustomer: colourWaits(deps, job, layers),
    },
    canLog: canLogCoats(actor, job),
    canOverrideChange: actor.role === "owner",
    guns: activeGunsQuery(deps.db).all({}),
    items,
    prepReady,
    plan: planned
      ? { planId: planned.planId, name: planned.planName, versionId: planned.version.id, version: planned.version.version, frozen: planned.version.frozenAt != null }
      : null,
    layers,
    changesWaiting: held.changeOrderIds,
    mixSheets: sheets.filter((s) => s.status !== "void"),
    openBatch,
    coatLogs: coatLogsDto,
    next,
    lastConditions: lastConditions(deps, jobId),
    prepOverrides: rows
      .filter((r) => r.c.prepOverrideReason)
      .map((r) => ({ coatLogId: r.c.id, reason: r.c.prepOverrideReason!, byName: r.painterName, at: iso(r.c.createdAt) })),
    timingOverrides: coatLogsDto
      .filter((c) => c.timingOverrideReason && c.status !== "voided")
      .map((c) => ({ coatLogId: c.id, layerName: c.layerName, coatNumber: c.coatNumber, reason: c.timingOverrideReason!, breaches: c.timingBreaches ?? [], byName: c.painterName, at: c.at })),
  };
}

const conditionsQuery = preparedQuery((db, scope: "job" | "shop") =>
  db
    .select({ boothTemp: coatLogs.boothTemp, tempUnit: coatLogs.tempUnit, humidityPct: coatLogs.humidityPct })
    .from(coatLogs)
    .where(and(scope === "job" ? eq(coatLogs.jobId, placeholder("jobId")) : undefined, isNotNull(coatLogs.tempUnit)))
    .orderBy(desc(coatLogs.createdAt), desc(coatLogs.id))
    .limit(1)
    .prepare(),
);

/** The booth conditions of the latest entry on this job, else the shop's latest (same booth), to prefill the next tap. */
function lastConditions(deps: AppDeps, jobId: number): BoothDto["lastConditions"] {
  return conditionsQuery(deps.db, "job").get({ jobId }) ?? conditionsQuery(deps.db, "shop").get({}) ?? null;
}

export function listCoatLogs(deps: AppDeps, actor: Actor, jobId: number): CoatLogDto[] {
  const job = findJobFor(deps, actor, jobId);
  const planned = boothVersion(deps, job);
  return coatDtos(deps, coatRows(deps, jobId), new Map((planned?.version.layers ?? []).map((l) => [l.id, l.name])));
}

function assertCanLog(deps: AppDeps, actor: Actor, jobId: number): JobRow {
  if (actor.role === "estimator") throw forbidden("Estimators can read the booth card; coats are logged by the painter or the owner");
  const job = findJobFor(deps, actor, jobId);
  if (!canLogCoats(actor, job)) throw forbidden("Only the job's painter or the owner logs coats");
  return job;
}

function moveStage(tx: Tx, job: JobRow, to: Stage, note: string, actor: Actor, now: number) {
  recordStageMove(tx, { jobId: job.id, from: job.stage, to, note, userId: actor.id, at: now });
}

/**
 * One tap: the coat just sprayed. The server sets the painter, and the time unless the tap was made offline (`at`,
 * kept within bounds; `createdAt` is when it arrived); the coat must be the one the card shows
 * next (a second tap on a stale card is refused, not double-counted). The first coat of a job needs every item's
 * prep signed off, or the painter's reason for going ahead. Logging freezes the plan version; the first coat moves
 * the job into the booth and the last coat of the last layer moves it to curing.
 */
export function logCoat(deps: AppDeps, ctx: RequestContext, input: z.output<typeof createCoatLogInputSchema>): BoothDto {
  const { actor } = ctx;
  const job = assertCanLog(deps, actor, input.jobId);
  if (!LOGGING_STAGES.includes(job.stage))
    throw conflict(`Coats are logged once the job is in prep or in the booth; this job is ${STAGE_LABELS[job.stage].toLowerCase()}`, { jobId: "Not at the booth" });
  const booth = getBooth(deps, actor, job.id);
  if (!booth.plan) throw conflict("This job has no finish plan yet; the office adds one before spraying", { jobId: "No finish plan" });
  const next = booth.next;
  if (next.state !== "spray") throw conflict("Every coat of every layer is already logged", { coatNumber: "Nothing left to log" });
  if (next.layerId !== input.layerId || next.coat !== input.coatNumber) {
    throw conflict(`The next coat is coat ${next.coat} of ${next.of} of ${next.layerName}; the card was out of date, so nothing was logged`, {
      coatNumber: `Next is coat ${next.coat} of ${next.layerName}`,
    });
  }
  if (booth.job.colourWaitsForCustomer && COLOUR_LAYER_KINDS.includes(next.layerKind)) {
    throw conflict(
      `Shop rule "${COLOUR_SIGN_OFF_RULE}": the customer has not approved a test panel for this job yet, so ${next.layerName} waits. The office sends the panels to the customer from the job's colour section.`,
      { layerId: "Waiting for the customer's colour approval" },
    );
  }
  const changeOverride = changeHoldOverride(actor, booth.layers.find((l) => l.id === next.layerId), input.changeOverrideReason);
  let override: string | null = null;
  if (next.isFirstCoatOfJob && !booth.prepReady) {
    const pending = booth.items.filter((i) => i.prepStatus !== "signed_off").map((i) => i.name);
    if (!input.prepOverrideReason) {
      throw conflict(`Prep is not signed off for ${pending.join(", ")}. Sign it off first, or give a reason to go ahead.`, {
        prepOverrideReason: "Give a reason to spray before prep is signed off",
      });
    }
    override = `${input.prepOverrideReason} (prep not signed off: ${pending.join(", ")})`.slice(0, 800);
  }
  checkGun(deps, input.gunId);
  const now = deps.now();
  const at = madeAt(input.at, now, [
    { time: job.createdAt, what: "the job was created" },
    { time: booth.openBatch ? Date.parse(booth.openBatch.mixedAt) : null, what: "its batch was mixed" },
  ]);
  const timingOverridden = timingOverride(booth, at, input.timingOverrideReason);
  deps.db.transaction((tx) => {
    tx.insert(coatLogs)
      .values({
        jobId: job.id,
        planVersionId: booth.plan!.versionId,
        layerId: input.layerId,
        coatNumber: input.coatNumber,
        at,
        painterId: actor.id,
        boothTemp: input.boothTemp ?? null,
        tempUnit: input.boothTemp != null ? (input.tempUnit ?? null) : null,
        humidityPct: input.humidityPct ?? null,
        note: input.note ?? null,
        ...setupColumns(input),
        mixSheetId: booth.openBatch?.mixSheetId ?? null,
        prepOverrideReason: override,
        timingOverrideReason: timingOverridden?.reason ?? null,
        timingBreaches: timingOverridden?.breaches ?? null,
        changeOverrideReason: changeOverride,
        createdAt: now,
      })
      .run();
    if (changeOverride) recordChangeOverride(tx, ctx, { jobId: job.id, layerId: input.layerId, coatNumber: input.coatNumber, reason: changeOverride, changeOrderIds: booth.changesWaiting }, now);
    freezePlanVersion(tx, booth.plan!.versionId, job.id, now, ctx);
    let stage = job.stage;
    if (stage === "in_prep") {
      moveStage(tx, job, "in_booth", "First coat logged at the booth", actor, now);
      stage = "in_booth";
    }
    const finished = next.isLastLayer && next.coat === next.of;
    if (finished && stage !== "curing") moveStage(tx, { ...job, stage }, "curing", "Last coat of the last layer logged", actor, now);
  });
  return getBooth(deps, actor, job.id);
}

/**
 * A correction is a new entry naming the entry it corrects. Values not given carry over from the entry as it
 * stands. Only the latest coat of the job can be voided, so the coat count never has a hole in it.
 */
export function correctCoatLog(deps: AppDeps, ctx: RequestContext, id: number, input: z.output<typeof correctCoatLogInputSchema>): BoothDto {
  const { actor } = ctx;
  const original = deps.db.select().from(coatLogs).where(eq(coatLogs.id, id)).get();
  if (!original) throw notFound("Coat log");
  try {
    findJobFor(deps, actor, original.jobId);
  } catch {
    throw notFound("Coat log");
  }
  const job = assertCanLog(deps, actor, original.jobId);
  if (original.correctsId != null) throw conflict(`This entry is itself a correction; correct the original entry #${original.correctsId}`, { id: "A correction" });
  const all = deps.db.select().from(coatLogs).where(eq(coatLogs.jobId, job.id)).orderBy(asc(coatLogs.id)).all();
  const fixes = all.filter((c) => c.correctsId === id);
  if (fixes.some((f) => f.voids)) throw conflict("This coat was already marked as not sprayed", { id: "Voided" });
  const current = fixes[fixes.length - 1] ?? original;
  const now = deps.now();
  if (input.void) {
    const effective = effectiveCoats(all.map(asEntry));
    const latest = effective[effective.length - 1];
    if (latest?.id !== id) throw conflict("Only the latest coat can be marked as not sprayed; correct the details of earlier coats instead", { void: "Not the latest coat" });
  }
  const at = input.at === undefined ? current.at : madeAt(input.at, now, [{ time: job.createdAt, what: "the job was created" }]);
  const tempUnit: TempUnit | null = input.boothTemp !== undefined ? (input.boothTemp == null ? null : (input.tempUnit ?? null)) : current.tempUnit;
  deps.db
    .insert(coatLogs)
    .values({
      jobId: original.jobId,
      planVersionId: original.planVersionId,
      layerId: original.layerId,
      coatNumber: original.coatNumber,
      at,
      painterId: actor.id,
      boothTemp: input.boothTemp !== undefined ? input.boothTemp : current.boothTemp,
      tempUnit,
      humidityPct: input.humidityPct !== undefined ? input.humidityPct : current.humidityPct,
      note: input.note !== undefined ? input.note : current.note,
      ...setupColumns(current),
      mixSheetId: original.mixSheetId,
      correctsId: id,
      correctionReason: input.reason,
      voids: input.void,
      createdAt: now,
    })
    .run();
  return getBooth(deps, actor, job.id);
}
