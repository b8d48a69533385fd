import { updateAtVersion } from "../../db/edit-version";
import { and, asc, count, desc, eq, inArray, like, or, sql, type SQL } from "drizzle-orm";
import type { z } from "zod";
import type { AppDeps } from "../../deps";
import type { Actor } from "../../auth/session";
import type { RequestContext } from "../../http/context";
import { jobs, materials, mixSheetLines, mixSheets, panelReadings, planLayers, plans, planVersions, testPanels, uploads, users } from "../../db/schema";
import { badRequest, conflict, forbidden, notFound } from "../../http/http-error";
import { iso } from "../../http/dates";
import { recordAudit } from "../audit/audit.service";
import { findJobFor } from "../jobs/jobs.access";
import { getSettings } from "../settings/settings.service";
import { deleteUploadsOf, photosOf } from "../uploads/uploads.service";
import { checkGun, gunNames } from "../guns/guns.service";
import { setupOf } from "../guns/spray-setup";
import { deltaE2000, equivalentCoats, tonerFraction } from "../../../shared/mix/index";
import { colourVerdict, colourVerdictText } from "../../../shared/domain/colour-verdict";
import type {
  ColourComparisonDto,
  createPanelInputSchema,
  JobColourDto,
  Lab,
  ladderQuerySchema,
  ListPanelsQuery,
  PanelCompareDto,
  PanelDto,
  PanelLadderDto,
  PanelListDto,
  updatePanelInputSchema,
} from "../../../shared/schemas/panel.schema";

type PanelRow = typeof testPanels.$inferSelect;
type Thresholds = { deltaEMatch: number; deltaEClose: number };

const num = (n: number) => String(Number(n.toFixed(3)));
export const panelLabel = (p: Pick<PanelRow, "candyName" | "groundName" | "letDownClear" | "letDownToner" | "coats">) =>
  `${p.candyName} over ${p.groundName}, ${num(p.letDownClear)}:${num(p.letDownToner)}, ${p.coats} ${p.coats === 1 ? "coat" : "coats"}`;

export const labOf = (p: Pick<PanelRow, "labL" | "labA" | "labB">): Lab | null =>
  p.labL != null && p.labA != null && p.labB != null ? { L: p.labL, a: p.labA, b: p.labB } : null;

function thresholdsOf(deps: AppDeps): Thresholds {
  const s = getSettings(deps);
  return { deltaEMatch: s.deltaEMatch, deltaEClose: s.deltaEClose };
}

/** ΔE00 of `panel` against the `reference` (the approved panel), with the shop's verdict. */
export function compareColour(reference: { id: number; lab: Lab | null }, lab: Lab | null, t: Thresholds): ColourComparisonDto | null {
  if (!reference.lab || !lab) return null;
  const deltaE = deltaE2000(reference.lab, lab);
  return { againstPanelId: reference.id, deltaE, verdict: colourVerdict(deltaE, t), text: colourVerdictText(deltaE, t) };
}

function selectPanels(deps: AppDeps) {
  return deps.db
    .select({ p: testPanels, jobTitle: jobs.title, jobPainter: jobs.assignedPainterId, jobCustomer: jobs.customerId, approvedPanelId: jobs.approvedPanelId, createdByName: users.name })
    .from(testPanels)
    .leftJoin(jobs, eq(testPanels.jobId, jobs.id))
    .leftJoin(users, eq(testPanels.createdBy, users.id));
}
type Selected = Awaited<ReturnType<ReturnType<typeof selectPanels>["all"]>>[number];

/** Readings under other lights, by panel. */
function readingsOf(deps: AppDeps, panelIds: number[]): Map<number, PanelDto["readings"]> {
  const out = new Map<number, PanelDto["readings"]>();
  if (!panelIds.length) return out;
  for (const r of deps.db.select().from(panelReadings).where(inArray(panelReadings.panelId, panelIds)).orderBy(asc(panelReadings.id)).all())
    out.set(r.panelId, [...(out.get(r.panelId) ?? []), { light: r.light, illuminant: r.illuminant, lab: { L: r.labL, a: r.labA, b: r.labB } }]);
  return out;
}

/** Plan layers by id, with their plan's name and version. */
function layersOf(deps: AppDeps, layerIds: number[]): Map<number, NonNullable<PanelDto["planLayer"]>> {
  if (!layerIds.length) return new Map();
  const rows = deps.db
    .select({ id: planLayers.id, name: planLayers.name, planName: plans.name, version: planVersions.version })
    .from(planLayers)
    .innerJoin(planVersions, eq(planLayers.versionId, planVersions.id))
    .innerJoin(plans, eq(planVersions.planId, plans.id))
    .where(inArray(planLayers.id, layerIds))
    .all();
  return new Map(rows.map((r) => [r.id, r]));
}

/** Mix sheets by id, with the lots poured into them. */
function sheetsOf(deps: AppDeps, sheetIds: number[]): Map<number, NonNullable<PanelDto["mixSheet"]>> {
  if (!sheetIds.length) return new Map();
  const sheets = deps.db.select({ id: mixSheets.id, status: mixSheets.status, mixedAt: mixSheets.mixedAt }).from(mixSheets).where(inArray(mixSheets.id, sheetIds)).all();
  const lines = deps.db
    .select({
      sheetId: mixSheetLines.mixSheetId,
      materialCode: materials.code,
      materialName: materials.name,
      category: materials.category,
      lotNumber: mixSheetLines.lotNumber,
      ml: mixSheetLines.plannedMl,
    })
    .from(mixSheetLines)
    .innerJoin(materials, eq(mixSheetLines.materialId, materials.id))
    .where(inArray(mixSheetLines.mixSheetId, sheetIds))
    .orderBy(asc(mixSheetLines.position))
    .all();
  return new Map(
    sheets.map((sh) => [
      sh.id,
      {
        id: sh.id,
        status: sh.status,
        mixedAt: sh.mixedAt != null ? iso(sh.mixedAt) : null,
        lots: lines.filter((l) => l.sheetId === sh.id).map(({ materialCode, materialName, lotNumber }) => ({ materialCode, materialName, lotNumber })),
        tonerReadyPct: tonerShare(lines.filter((l) => l.sheetId === sh.id)),
      },
    ]),
  );
}

/** The toner's share of the whole ready-to-spray batch (clear, toner, reducer and the rest), in %; null without toner. */
function tonerShare(lines: { category: string; ml: number }[]): number | null {
  const total = lines.reduce((a, l) => a + l.ml, 0);
  const toner = lines.filter((l) => l.category === "toner").reduce((a, l) => a + l.ml, 0);
  return total > 0 && toner > 0 ? (toner / total) * 100 : null;
}

/** Panels as the actor may see them: painters see job titles only for their own jobs; customers no shop notes. */
function toDtos(deps: AppDeps, actor: Actor, rows: Selected[], t: Thresholds): PanelDto[] {
  const ids = rows.map((r) => r.p.id);
  const photos = photosOf(deps, actor, "panel", ids);
  const readings = readingsOf(deps, ids);
  const guns = gunNames(deps);
  const customer = actor.role === "customer";
  const layers = customer ? new Map() : layersOf(deps, [...new Set(rows.map((r) => r.p.planLayerId).filter((x): x is number => x != null))]);
  const sheets = customer ? new Map() : sheetsOf(deps, [...new Set(rows.map((r) => r.p.mixSheetId).filter((x): x is number => x != null))]);
  const approvedIds = [...new Set(rows.map((r) => r.approvedPanelId).filter((id): id is number => id != null))];
  const approved = new Map(
    approvedIds.length ? deps.db.select().from(testPanels).where(inArray(testPanels.id, approvedIds)).all().map((p) => [p.id, labOf(p)]) : [],
  );
  return rows.map(({ p, jobTitle, jobPainter, approvedPanelId, createdByName }) => {
    const lab = labOf(p);
    const seesJob = p.jobId != null && (actor.role !== "painter" || jobPainter === actor.id);
    const vsApproved =
      approvedPanelId != null && approvedPanelId !== p.id ? compareColour({ id: approvedPanelId, lab: approved.get(approvedPanelId) ?? null }, lab, t) : null;
    return {
      id: p.id,
      version: p.version,
      label: panelLabel(p),
      groundName: p.groundName,
      groundMaterialId: customer ? null : p.groundMaterialId,
      candyName: p.candyName,
      candyMaterialId: customer ? null : p.candyMaterialId,
      letDownClear: p.letDownClear,
      letDownToner: p.letDownToner,
      tonerFraction: tonerFraction({ clear: p.letDownClear, toner: p.letDownToner }),
      coats: p.coats,
      jobId: seesJob ? p.jobId : null,
      jobTitle: seesJob ? jobTitle : null,
      planLayerId: customer ? null : p.planLayerId,
      mixSheetId: customer ? null : p.mixSheetId,
      lab,
      readings: readings.get(p.id) ?? [],
      setup: setupOf(p, guns),
      conditions: { boothTemp: p.boothTemp, tempUnit: p.tempUnit, humidityPct: p.humidityPct },
      planLayer: (p.planLayerId != null ? layers.get(p.planLayerId) : null) ?? null,
      mixSheet: (p.mixSheetId != null ? sheets.get(p.mixSheetId) : null) ?? null,
      sprayedOn: p.sprayedOn,
      notes: customer ? null : p.notes,
      createdById: customer ? null : p.createdBy,
      createdByName: customer ? null : createdByName,
      createdAt: iso(p.createdAt),
      photo: photos.get(p.id)?.[0] ?? null,
      photos: photos.get(p.id) ?? [],
      vsApproved,
      isApprovedForJob: approvedPanelId != null && approvedPanelId === p.id,
    };
  });
}

function findPanelRow(deps: AppDeps, id: number): Selected {
  const row = selectPanels(deps).where(eq(testPanels.id, id)).get();
  if (!row) throw notFound("Test panel");
  return row;
}

export function getPanel(deps: AppDeps, actor: Actor, id: number): PanelDto {
  return toDtos(deps, actor, [findPanelRow(deps, id)], thresholdsOf(deps))[0]!;
}

const ci = (col: typeof testPanels.groundName | typeof testPanels.candyName, v: string) => sql`lower(${col}) = lower(${v})`;

export function listPanels(deps: AppDeps, actor: Actor, q: ListPanelsQuery): PanelListDto {
  const filters: (SQL | undefined)[] = [];
  if (q.ground) filters.push(ci(testPanels.groundName, q.ground));
  if (q.candy) filters.push(ci(testPanels.candyName, q.candy));
  if (q.coats) filters.push(eq(testPanels.coats, q.coats));
  if (q.jobId) {
    findJobFor(deps, actor, q.jobId);
    filters.push(eq(testPanels.jobId, q.jobId));
  }
  if (q.q) filters.push(or(like(testPanels.candyName, `%${q.q}%`), like(testPanels.groundName, `%${q.q}%`), like(testPanels.notes, `%${q.q}%`)));
  const where = and(...filters);
  const rows = selectPanels(deps)
    .where(where)
    .orderBy(asc(sql`lower(${testPanels.candyName})`), asc(sql`lower(${testPanels.groundName})`), asc(testPanels.coats), desc(testPanels.id))
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize)
    .all();
  const total = deps.db.select({ n: count() }).from(testPanels).where(where).get()?.n ?? 0;
  const distinct = (col: typeof testPanels.groundName | typeof testPanels.candyName) =>
    deps.db.selectDistinct({ v: col }).from(testPanels).orderBy(asc(sql`lower(${col})`)).all().map((r) => r.v);
  const coats = deps.db.selectDistinct({ v: testPanels.coats }).from(testPanels).orderBy(asc(testPanels.coats)).all().map((r) => r.v);
  return {
    items: toDtos(deps, actor, rows, thresholdsOf(deps)),
    total,
    page: q.page,
    pageSize: q.pageSize,
    facets: { grounds: distinct(testPanels.groundName), candies: distinct(testPanels.candyName), coats },
  };
}

/** Checks the optional references of a panel; the job must be one the actor reaches. */
function checkRefs(deps: AppDeps, actor: Actor, input: { jobId?: number | null; planLayerId?: number | null; mixSheetId?: number | null }) {
  if (input.jobId != null) {
    try {
      findJobFor(deps, actor, input.jobId);
    } catch {
      throw badRequest("That job does not exist", { jobId: "No such job" });
    }
  }
  if (input.planLayerId != null && !deps.db.select({ id: planLayers.id }).from(planLayers).where(eq(planLayers.id, input.planLayerId)).get())
    throw badRequest("That plan layer does not exist", { planLayerId: "No such layer" });
  if (input.mixSheetId != null) {
    const sheet = deps.db.select({ jobId: mixSheets.jobId }).from(mixSheets).where(eq(mixSheets.id, input.mixSheetId)).get();
    if (!sheet) throw badRequest("That mix sheet does not exist", { mixSheetId: "No such mix sheet" });
    try {
      findJobFor(deps, actor, sheet.jobId);
    } catch {
      throw badRequest("That mix sheet does not exist", { mixSheetId: "No such mix sheet" });
    }
  }
}

/** The ground's name: the catalogue material's when one is picked (it must exist), else the name given. */
function groundNameOf(deps: AppDeps, input: { groundName?: string; groundMaterialId?: number | null }): string | undefined {
  if (input.groundMaterialId == null) return input.groundName;
  const m = deps.db.select({ name: materials.name }).from(materials).where(eq(materials.id, input.groundMaterialId)).get();
  if (!m) throw badRequest("That ground coat is not in the catalogue", { groundMaterialId: "No such material" });
  return m.name;
}

type PanelInput = Omit<z.output<typeof updatePanelInputSchema>, "version">;

/** The columns an input sets (only the fields it carries), with the ground named from the catalogue. */
function columnsOf(deps: AppDeps, input: PanelInput & { version?: number }): Partial<PanelRow> {
  const { readings: _readings, version: _version, ...fields } = input;
  const set: Partial<PanelRow> = {};
  for (const [k, v] of Object.entries(fields)) if (v !== undefined) (set as Record<string, unknown>)[k] = v;
  if (input.groundMaterialId != null) set.groundName = groundNameOf(deps, input);
  return set;
}

function replaceReadings(tx: Pick<AppDeps["db"], "delete" | "insert">, panelId: number, readings: PanelInput["readings"]) {
  if (readings === undefined) return;
  tx.delete(panelReadings).where(eq(panelReadings.panelId, panelId)).run();
  if (readings.length) tx.insert(panelReadings).values(readings.map((r) => ({ panelId, ...r }))).run();
}

export function createPanel(deps: AppDeps, actor: Actor, input: z.output<typeof createPanelInputSchema>): PanelDto {
  checkRefs(deps, actor, input);
  checkGun(deps, input.gunId);
  const now = deps.now();
  const columns = columnsOf(deps, input);
  const id = deps.db.transaction((tx) => {
    const row = tx
      .insert(testPanels)
      .values({
        ...columns,
        groundName: columns.groundName!,
        candyName: input.candyName,
        letDownClear: input.letDownClear,
        letDownToner: input.letDownToner,
        coats: input.coats,
        createdBy: actor.id,
        createdAt: now,
        updatedAt: now,
      })
      .returning({ id: testPanels.id })
      .get()!;
    replaceReadings(tx, row.id, input.readings);
    return row.id;
  });
  return getPanel(deps, actor, id);
}

/** The office edits any panel; a painter the panels they made. */
function checkEditable(actor: Actor, row: PanelRow) {
  if (actor.role === "painter" && row.createdBy !== actor.id) throw forbidden("Painters change only the panels they made; ask the office");
}

export function updatePanel(deps: AppDeps, actor: Actor, id: number, input: z.output<typeof updatePanelInputSchema>): PanelDto {
  const { p } = findPanelRow(deps, id);
  checkEditable(actor, p);
  checkRefs(deps, actor, input);
  checkGun(deps, input.gunId);
  const set = columnsOf(deps, input);
  const merged = { ...p, ...set } as PanelRow;
  const labs = [merged.labL, merged.labA, merged.labB].filter((v) => v != null).length;
  if (labs !== 0 && labs !== 3) throw badRequest("Enter L*, a* and b* together, or none", { labL: "Enter all three readings or none" });
  if (merged.inletPressure != null && !merged.pressureUnit) throw badRequest("Say whether the pressure is psi or bar", { pressureUnit: "Missing unit" });
  if ((merged.distance != null || merged.fanWidth != null) && !merged.distanceUnit) throw badRequest("Say whether lengths are in cm or in", { distanceUnit: "Missing unit" });
  if (merged.boothTemp != null && !merged.tempUnit) throw badRequest("Say whether the temperature is °C or °F", { tempUnit: "Missing unit" });
  deps.db.transaction((tx) => {
    updateAtVersion(tx, testPanels, { id, version: input.version, actorId: actor.id, what: "test panel" }, { ...set, updatedAt: deps.now() }, () => getPanel(deps, actor, id));
    replaceReadings(tx, id, input.readings);
    if (input.jobId !== undefined) tx.update(uploads).set({ jobId: input.jobId }).where(and(eq(uploads.ownerType, "panel"), eq(uploads.ownerId, id))).run();
  });
  return getPanel(deps, actor, id);
}

export function deletePanel(deps: AppDeps, _actor: Actor, id: number) {
  findPanelRow(deps, id);
  const user = deps.db.select({ id: jobs.id, title: jobs.title }).from(jobs).where(eq(jobs.approvedPanelId, id)).get();
  if (user) throw conflict(`This panel is the approved colour of job #${user.id} (${user.title}); choose another panel there first`, { panel: "Approved colour of a job" });
  deps.db.delete(testPanels).where(eq(testPanels.id, id)).run();
  deleteUploadsOf(deps, "panel", id);
}

export function comparePanels(deps: AppDeps, actor: Actor, ids: number[]): PanelCompareDto {
  const unique = [...new Set(ids)];
  const rows = selectPanels(deps).where(inArray(testPanels.id, unique)).all();
  const missing = unique.filter((id) => !rows.some((r) => r.p.id === id));
  if (missing.length) throw notFound(`Test panel ${missing.map((m) => `#${m}`).join(", ")}`);
  const t = thresholdsOf(deps);
  const panels = toDtos(deps, actor, unique.map((id) => rows.find((r) => r.p.id === id)!), t);
  const pairs: PanelCompareDto["pairs"] = [];
  for (let i = 0; i < panels.length; i++)
    for (let j = i + 1; j < panels.length; j++) {
      const a = panels[i]!;
      const b = panels[j]!;
      if (a.lab && b.lab) {
        const deltaE = deltaE2000(a.lab, b.lab);
        pairs.push({ a: a.id, b: b.id, deltaE, verdict: colourVerdict(deltaE, t) });
      }
    }
  return { panels, pairs, thresholds: t };
}

/**
 * One candy over one ground, ordered by depth: colour depth follows toner fraction × coats (Beer–Lambert with the
 * same wet film per coat), not the coat count (3 coats at 6:1 are deeper than 4 coats at 10:1). Each rung also shows
 * the coats at the reference let-down that give its depth, and ΔE00 from the rung before it in that order.
 */
export function panelLadder(deps: AppDeps, actor: Actor, q: z.output<typeof ladderQuerySchema>): PanelLadderDto {
  const rows = selectPanels(deps)
    .where(and(ci(testPanels.groundName, q.ground), ci(testPanels.candyName, q.candy)))
    .orderBy(asc(sql`${testPanels.coats} * ${testPanels.letDownToner} / (${testPanels.letDownClear} + ${testPanels.letDownToner})`), asc(testPanels.coats), asc(testPanels.id))
    .all();
  if (!rows.length) throw notFound(`Test panels of ${q.candy} over ${q.ground}`);
  const panels = toDtos(deps, actor, rows, thresholdsOf(deps));
  const ref = q.toClear !== undefined && q.toToner !== undefined ? { clear: q.toClear, toner: q.toToner } : { clear: panels[0]!.letDownClear, toner: panels[0]!.letDownToner };
  let previous: Lab | null = null;
  const rungs = panels.map((panel) => {
    const fromLetDown = { clear: panel.letDownClear, toner: panel.letDownToner };
    const rung = {
      panel,
      depth: panel.tonerFraction * panel.coats,
      equivalentCoats: equivalentCoats(panel.coats, fromLetDown, ref),
      deltaEFromPrevious: previous && panel.lab ? deltaE2000(previous, panel.lab) : null,
    };
    previous = panel.lab;
    return rung;
  });
  return { groundName: rows[0]!.p.groundName, candyName: rows[0]!.p.candyName, reference: { ...ref, tonerFraction: tonerFraction(ref) }, rungs };
}

export function jobColour(deps: AppDeps, actor: Actor, jobId: number): JobColourDto {
  const job = findJobFor(deps, actor, jobId);
  const t = thresholdsOf(deps);
  const approvedRow = job.approvedPanelId != null ? selectPanels(deps).where(eq(testPanels.id, job.approvedPanelId)).get() : undefined;
  const rows = selectPanels(deps).where(eq(testPanels.jobId, jobId)).orderBy(desc(testPanels.createdAt), desc(testPanels.id)).all();
  const approved = approvedRow ? toDtos(deps, actor, [approvedRow], t)[0]! : null;
  const panels = toDtos(deps, actor, rows, t).map((p) => ({
    ...p,
    isApprovedForJob: approved?.id === p.id,
    vsApproved: approved && approved.id !== p.id ? compareColour({ id: approved.id, lab: approved.lab }, p.lab, t) : null,
  }));
  return { jobId, approvedPanel: approved ? { ...approved, isApprovedForJob: true, vsApproved: null } : null, panels, thresholds: t };
}

/** The office points a job's agreed colour at a panel (or clears it). Recorded in the audit log with the plan changes. */
export function setApprovedPanel(deps: AppDeps, ctx: RequestContext, jobId: number, panelId: number | null): JobColourDto {
  const job = findJobFor(deps, ctx.actor, jobId);
  if (panelId != null && !deps.db.select({ id: testPanels.id }).from(testPanels).where(eq(testPanels.id, panelId)).get())
    throw badRequest("That test panel does not exist", { panelId: "No such panel" });
  if (job.approvedPanelId !== panelId) {
    const now = deps.now();
    deps.db.transaction((tx) => {
      tx.update(jobs).set({ approvedPanelId: panelId, updatedAt: now }).where(eq(jobs.id, jobId)).run();
      recordAudit(tx, ctx, { kind: "plan", entity: "job_colour", entityId: jobId, action: panelId == null ? "cleared" : "approved", before: { approvedPanelId: job.approvedPanelId }, after: { approvedPanelId: panelId } }, now);
    });
  }
  return jobColour(deps, ctx.actor, jobId);
}
