import { and, asc, eq, inArray } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import type { Actor } from "../../auth/session";
import { coatLogs, customers, jobItems, materials, mixSheetLines, mixSheets, plans, testPanels, users } from "../../db/schema";
import { iso } from "../../http/dates";
import { findJobFor } from "../jobs/jobs.access";
import { jobPlanRow, latestVersionRow, loadPlanVersion, type LoadedPlanVersion } from "../plans/plans.service";
import { jobPrep } from "../prep/prep.service";
import { photosOf } from "../uploads/uploads.service";
import { gunNames } from "../guns/guns.service";
import { setupOf } from "../guns/spray-setup";
import { labOf, panelLabel } from "../panels/panels.service";
import { effectiveCoats } from "../../../shared/domain/booth";
import { describeSetup } from "../../../shared/domain/spray-setup";
import { SCUFF_MEDIUM_LABELS } from "../../../shared/domain/prep";
import type { FinishCoatDto, FinishLayerDto, FinishRecordDto } from "../../../shared/schemas/finish-record.schema";

type CoatRow = typeof coatLogs.$inferSelect;

/** The plan version the job was sprayed with, else the latest version of its plan. */
function recordedVersion(deps: AppDeps, job: { id: number; sprayedPlanVersionId: number | null }): { name: string; version: LoadedPlanVersion } | null {
  const plan = jobPlanRow(deps.db, job.id);
  const versionId = job.sprayedPlanVersionId ?? (plan ? latestVersionRow(deps.db, plan.id).id : null);
  if (versionId == null) return null;
  const version = loadPlanVersion(deps, versionId);
  const name = plan?.name ?? deps.db.select({ name: plans.name }).from(plans).where(eq(plans.id, version.planId)).get()?.name ?? "Finish plan";
  return { name, version };
}

/** The coats that count, each with the values of its latest correction, grouped by layer. */
function countedCoats(rows: { c: CoatRow; painterName: string | null }[]) {
  const byId = new Map(rows.map((r) => [r.c.id, r]));
  const latestFix = new Map<number, CoatRow>();
  for (const { c } of rows) if (c.correctsId != null && !c.voids) latestFix.set(c.correctsId, c);
  const out = new Map<number, { original: CoatRow; current: CoatRow; painterName: string | null }[]>();
  const entries = rows.map(({ c }) => ({ id: c.id, layerId: c.layerId, coatNumber: c.coatNumber, at: c.at, correctsId: c.correctsId, voids: c.voids }));
  for (const e of effectiveCoats(entries)) {
    const original = byId.get(e.id)!;
    const current = e.correctedBy != null ? (byId.get(e.correctedBy)?.c ?? original.c) : original.c;
    out.set(e.layerId, [...(out.get(e.layerId) ?? []), { original: original.c, current, painterName: original.painterName }]);
  }
  return { byLayer: out, latestFix };
}

function prepSteps(r: { scuffMedium: string | null; scuffGrit: number | null; cleaner: string | null; tackCloth: boolean; adhesionPromoter: boolean; adhesionPromoterProduct: string | null }) {
  const steps: string[] = [];
  if (r.scuffMedium) steps.push(`Scuffed with ${SCUFF_MEDIUM_LABELS[r.scuffMedium as keyof typeof SCUFF_MEDIUM_LABELS] ?? r.scuffMedium}${r.scuffGrit ? `, P${r.scuffGrit}` : ""}`);
  if (r.cleaner) steps.push(`Cleaned with ${r.cleaner}`);
  if (r.tackCloth) steps.push("Tack cloth");
  if (r.adhesionPromoter) steps.push(`Adhesion promoter${r.adhesionPromoterProduct ? `: ${r.adhesionPromoterProduct}` : ""}`);
  return steps;
}

/**
 * The finish record of a job: for staff who reach the job, and for the job's customer (without internal notes,
 * override reasons or anything not shared with them). Never any money.
 */
export function finishRecord(deps: AppDeps, actor: Actor, jobId: number): FinishRecordDto {
  const job = findJobFor(deps, actor, jobId);
  const customerView = actor.role === "customer";
  const customerName = deps.db.select({ name: customers.name }).from(customers).where(eq(customers.id, job.customerId)).get()?.name ?? "";
  const items = deps.db.select().from(jobItems).where(eq(jobItems.jobId, jobId)).orderBy(asc(jobItems.id)).all();
  const recorded = recordedVersion(deps, job);

  const rows = deps.db
    .select({ c: coatLogs, painterName: users.name })
    .from(coatLogs)
    .leftJoin(users, eq(coatLogs.painterId, users.id))
    .where(eq(coatLogs.jobId, jobId))
    .orderBy(asc(coatLogs.id))
    .all();
  const { byLayer } = countedCoats(rows);
  const guns = gunNames(deps);
  const coatPhotos = photosOf(deps, actor, "coat_log", rows.map((r) => r.c.id));

  const sheets = deps.db
    .select({ s: mixSheets, mixedByName: users.name })
    .from(mixSheets)
    .leftJoin(users, eq(mixSheets.mixedBy, users.id))
    .where(and(eq(mixSheets.jobId, jobId), eq(mixSheets.status, "mixed")))
    .orderBy(asc(mixSheets.mixedAt), asc(mixSheets.id))
    .all();
  const lines = sheets.length
    ? deps.db
        .select({ l: mixSheetLines, code: materials.code, name: materials.name })
        .from(mixSheetLines)
        .innerJoin(materials, eq(mixSheetLines.materialId, materials.id))
        .where(inArray(mixSheetLines.mixSheetId, sheets.map((s) => s.s.id)))
        .orderBy(asc(mixSheetLines.position))
        .all()
    : [];

  const layers: FinishLayerDto[] = (recorded?.version.layers ?? []).map((layer) => {
    const batches = sheets
      .filter((s) => s.s.layerId === layer.id)
      .map(({ s, mixedByName }) => ({
        id: s.id,
        mixedAt: s.mixedAt != null ? iso(s.mixedAt) : null,
        mixedByName,
        totalMl: s.totalMl,
        unit: s.unit,
        vocGPerL: s.vocGPerL,
        lines: lines
          .filter((l) => l.l.mixSheetId === s.id)
          .map((l) => ({ label: l.l.label, materialCode: l.code, materialName: l.name, plannedMl: l.l.plannedMl, pouredMl: l.l.actualMl, lotNumber: l.l.lotNumber })),
      }));
    const used = new Map<string, { code: string; name: string; lots: Set<string> }>();
    for (const c of layer.components) used.set(c.materialCode, { code: c.materialCode, name: c.materialName, lots: new Set() });
    for (const b of batches)
      for (const l of b.lines) {
        const m = used.get(l.materialCode) ?? { code: l.materialCode, name: l.materialName, lots: new Set<string>() };
        if (l.lotNumber) m.lots.add(l.lotNumber);
        used.set(l.materialCode, m);
      }
    const coats: FinishCoatDto[] = (byLayer.get(layer.id) ?? []).map(({ original, current, painterName }) => {
      const overrides: FinishCoatDto["overrides"] = [];
      if (original.prepOverrideReason) overrides.push({ rule: "prep", reason: original.prepOverrideReason });
      if (original.timingOverrideReason) {
        const rules = (original.timingBreaches ?? []).map((b) => b.message).join("; ");
        overrides.push({ rule: "timing", reason: rules ? `${original.timingOverrideReason} (${rules})` : original.timingOverrideReason });
      }
      return {
        coatNumber: original.coatNumber,
        at: iso(current.at),
        loggedAt: iso(original.createdAt),
        painterName,
        boothTemp: current.boothTemp,
        tempUnit: current.tempUnit,
        humidityPct: current.humidityPct,
        setup: setupOf(current, guns),
        note: customerView ? null : current.note,
        overrides: customerView ? [] : overrides,
        correctionReason: customerView || current.id === original.id ? null : current.correctionReason,
        photos: [...(coatPhotos.get(original.id) ?? []), ...(current.id !== original.id ? (coatPhotos.get(current.id) ?? []) : [])],
      };
    });
    return {
      id: layer.id,
      position: layer.position,
      kind: layer.kind,
      name: layer.name,
      plannedCoats: layer.coats,
      flashMinutes: layer.flashMinutes,
      dryMinutes: layer.dryMinutes,
      components: layer.components.map((c) => ({ label: c.label, materialCode: c.materialCode, materialName: c.materialName, parts: c.parts, percent: c.percent, percentOf: c.percentOf })),
      materials: [...used.values()].map((m) => ({ code: m.code, name: m.name, lots: [...m.lots] })),
      batches,
      coats,
      cautions: layer.cautions,
    };
  });

  const prep = jobPrep(deps, actor, jobId).items.map((i) => ({
    itemName: i.itemName,
    substrate: i.substrate,
    steps: i.record ? prepSteps(i.record) : [],
    signedOffByName: i.record?.signedOffByName ?? null,
    signedOffAt: i.record?.signedOffAt ?? null,
    photos: customerView ? (i.record?.photos ?? []).filter((p) => p.shareable) : (i.record?.photos ?? []),
  }));

  const panelRow = job.approvedPanelId != null ? deps.db.select().from(testPanels).where(eq(testPanels.id, job.approvedPanelId)).get() : undefined;
  const painters = [...new Set(rows.map((r) => r.painterName).filter((n): n is string => !!n))];
  return {
    job: { id: job.id, title: job.title, customerName, stage: job.stage, items: items.map((i) => ({ name: i.name, substrate: i.substrate, surfaceArea: i.surfaceArea, areaUnit: i.areaUnit })) },
    plan: recorded ? { name: recorded.name, version: recorded.version.version, frozenAt: recorded.version.frozenAt != null ? iso(recorded.version.frozenAt) : null } : null,
    approvedPanel: panelRow ? { id: panelRow.id, label: panelLabel(panelRow), lab: labOf(panelRow), setupSummary: describeSetup(setupOf(panelRow, guns), setupOf(panelRow, guns).gunName) } : null,
    painters,
    prep,
    layers,
    customerView,
    generatedAt: iso(deps.now()),
  };
}
