import { and, asc, desc, eq } from "drizzle-orm";
import type { z } from "zod";
import type { AppDeps } from "../../deps";
import type { Actor } from "../../auth/session";
import type { RequestContext } from "../../http/context";
import { inspectionItems, inspections, jobItems, quotes, uploads, users } from "../../db/schema";
import { staleEdit } from "../../db/edit-version";
import { badRequest, conflict } from "../../http/http-error";
import { iso } from "../../http/dates";
import { findJobFor } from "../jobs/jobs.access";
import { photosOf } from "../uploads/uploads.service";
import { getSettings } from "../settings/settings.service";
import { createQuote, updateQuote } from "../quotes/quotes.service";
import { latestVersion } from "../quotes/quote-versions";
import { computeQuoteTotals, type QuoteLine } from "../../../shared/quote/index";
import {
  EXISTING_FINISH_LABELS,
  FIBREGLASS_FINDINGS,
  FINDING_LABELS,
  FINDINGS,
  type Finding,
  type FindingLevel,
  findingWords,
  isFibreglass,
  PREP_LINE_PREFIX,
  prepLineDescription,
  quarterHoursUp,
  SOLVENT_TEST_LABELS,
  suggestItemPrep,
} from "../../../shared/domain/intake";
import type { InspectionDto, InspectionItemDto, PortalInspectionDto, saveInspectionInputSchema } from "../../../shared/schemas/inspection.schema";
import type { QuoteDetailDto } from "../../../shared/schemas/quote.schema";

type ItemRow = typeof inspectionItems.$inferSelect;
type JobItemRow = typeof jobItems.$inferSelect;

export const inspectionRow = (deps: Pick<AppDeps, "db">, jobId: number) => deps.db.select().from(inspections).where(eq(inspections.jobId, jobId)).get();

/** The job's items, each with its inspection row (if any). */
export function inspectedItems(deps: Pick<AppDeps, "db">, jobId: number): { item: JobItemRow; row: ItemRow | null }[] {
  return deps.db
    .select({ item: jobItems, row: inspectionItems })
    .from(jobItems)
    .leftJoin(inspectionItems, eq(inspectionItems.itemId, jobItems.id))
    .where(eq(jobItems.jobId, jobId))
    .orderBy(asc(jobItems.id))
    .all();
}

/** The prep one inspected item suggests, on its measured area (or the item's own). */
export function itemSuggestion(item: JobItemRow, row: ItemRow) {
  const measured = row.measuredArea != null && row.areaUnit != null;
  return suggestItemPrep({
    name: item.name,
    area: measured ? row.measuredArea! : item.surfaceArea,
    areaUnit: measured ? row.areaUnit! : item.areaUnit,
    existingFinish: row.existingFinish,
    solventTest: row.solventTest,
    hardwareToRemove: row.hardwareToRemove,
    ...findingsOf(row),
  });
}

/** The condition checklist of a row or an input: each finding's level. */
const findingsOf = (v: Record<Finding, FindingLevel>) => Object.fromEntries(FINDINGS.map((f) => [f, v[f]])) as Record<Finding, FindingLevel>;

/** The suggested prep line, priced by the quote totals function at the shop's labour rate. */
export function suggestedPrepLine(deps: Pick<AppDeps, "db">, jobId: number): { hours: number; line: QuoteLine; amountCents: number } | null {
  const rows = inspectedItems(deps, jobId).filter((r): r is { item: JobItemRow; row: ItemRow } => r.row !== null);
  if (!rows.length) return null;
  const hours = quarterHoursUp(rows.reduce((s, r) => s + itemSuggestion(r.item, r.row).hours, 0));
  const description = prepLineDescription(rows.map((r) => ({ name: r.item.name, findings: findingWords(r.row) })));
  const line: QuoteLine = { kind: "labour", description, hours, rateCents: getSettings(deps).labourRateCents };
  const amountCents = computeQuoteTotals([line], { taxPercent: 0, taxedKinds: [], depositPercent: 0 }).lines[0]!.amountCents;
  return { hours, line, amountCents };
}

function latestQuote(deps: AppDeps, jobId: number): InspectionDto["quote"] {
  const q = deps.db.select().from(quotes).where(eq(quotes.jobId, jobId)).orderBy(desc(quotes.id)).limit(1).get();
  if (!q) return null;
  const v = latestVersion(deps.db, q.id)!;
  return { id: q.id, editVersion: q.version, version: v.version, status: v.status, hasPrepLine: v.lines.some((l) => l.description.startsWith(PREP_LINE_PREFIX)) };
}

/** The job's inspection as the office reads it; an empty one (version 0) when none is saved yet. */
export function getInspection(deps: AppDeps, actor: Actor, jobId: number): InspectionDto {
  findJobFor(deps, actor, jobId);
  const head = deps.db
    .select({ i: inspections, byName: users.name })
    .from(inspections)
    .leftJoin(users, eq(inspections.inspectedBy, users.id))
    .where(eq(inspections.jobId, jobId))
    .get();
  const rows = inspectedItems(deps, jobId);
  const photos = photosOf(deps, actor, "inspection_item", rows.flatMap((r) => (r.row ? [r.row.id] : [])));
  const items: InspectionItemDto[] = rows.map(({ item, row }) => ({
    itemId: item.id,
    itemName: item.name,
    substrate: item.substrate,
    surfaceArea: item.surfaceArea,
    areaUnit: item.areaUnit,
    inspection: row
      ? {
          id: row.id,
          existingFinish: row.existingFinish,
          ...findingsOf(row),
          solventTest: row.solventTest,
          hardwareToRemove: row.hardwareToRemove,
          measuredArea: row.measuredArea,
          measuredAreaUnit: row.areaUnit,
          note: row.note,
          photos: photos.get(row.id) ?? [],
        }
      : null,
    suggestion: row ? itemSuggestion(item, row) : null,
  }));
  return {
    jobId,
    version: head?.i.version ?? 0,
    exists: !!head,
    customerSummary: head?.i.customerSummary ?? null,
    notes: head?.i.notes ?? null,
    inspectedByName: head ? (head.byName ?? "Former user") : null,
    inspectedAt: head ? iso(head.i.inspectedAt) : null,
    items,
    suggestion: suggestedPrepLine(deps, jobId),
    quote: latestQuote(deps, jobId),
  };
}

type SaveInput = z.output<typeof saveInspectionInputSchema>;

/** Field errors for items that are not on the job, and fibreglass findings on items that are not fibreglass. */
function checkItems(input: SaveInput, jobItemsById: Map<number, JobItemRow>) {
  const fields: Record<string, string> = {};
  input.items.forEach((it, i) => {
    const item = jobItemsById.get(it.itemId);
    if (!item) {
      fields[`items.${i}.itemId`] = "Not an item of this job";
      return;
    }
    for (const f of FIBREGLASS_FINDINGS)
      if (it[f] !== "none" && !isFibreglass(item.substrate)) fields[`items.${i}.${f}`] = `${FINDING_LABELS[f]} are looked for on fibreglass items; ${item.name} is not fibreglass`;
    // A unit alone (a form always has one picked) means nothing; an area needs its unit.
    if (it.measuredArea != null && it.areaUnit == null) fields[`items.${i}.areaUnit`] = "Give the measured area's unit (m2 or ft2)";
  });
  if (Object.keys(fields).length) throw badRequest("Some items could not be saved", fields);
}

/**
 * Saves the inspection (creating it at version 0). Items listed are written; items not listed keep what they had.
 * A stale version is refused with 409 and the inspection as it is now.
 */
export function saveInspection(deps: AppDeps, ctx: RequestContext, jobId: number, input: SaveInput): InspectionDto {
  const job = findJobFor(deps, ctx.actor, jobId);
  if (job.stage === "cancelled") throw conflict("The job is cancelled; reopen it before inspecting", { jobId: "Cancelled job" });
  const byId = new Map(deps.db.select().from(jobItems).where(eq(jobItems.jobId, jobId)).all().map((i) => [i.id, i]));
  checkItems(input, byId);
  const now = deps.now();
  deps.db.transaction((tx) => {
    const existing = tx.select().from(inspections).where(eq(inspections.jobId, jobId)).get();
    const current = () => getInspection(deps, ctx.actor, jobId);
    if ((existing?.version ?? 0) !== input.version) throw staleEdit(tx, "inspection", current(), { updatedBy: existing?.updatedBy ?? null, updatedAt: existing?.updatedAt ?? null });
    const head = { customerSummary: input.customerSummary ?? null, notes: input.notes ?? null, inspectedBy: ctx.actor.id, inspectedAt: now, updatedAt: now, updatedBy: ctx.actor.id };
    let inspectionId: number;
    if (!existing) {
      inspectionId = tx.insert(inspections).values({ jobId, ...head, createdAt: now }).returning({ id: inspections.id }).get().id;
    } else {
      const done = tx
        .update(inspections)
        .set({ ...head, version: existing.version + 1 })
        .where(and(eq(inspections.id, existing.id), eq(inspections.version, input.version)))
        .run();
      if (done.changes !== 1) throw staleEdit(tx, "inspection", current(), existing);
      inspectionId = existing.id;
    }
    for (const it of input.items) {
      const values = {
        existingFinish: it.existingFinish,
        ...findingsOf(it),
        hardwareToRemove: it.hardwareToRemove ?? null,
        measuredArea: it.measuredArea ?? null,
        areaUnit: it.measuredArea != null ? (it.areaUnit ?? null) : null,
        solventTest: it.solventTest,
        note: it.note ?? null,
        updatedAt: now,
        updatedBy: ctx.actor.id,
      };
      const row = tx.select({ id: inspectionItems.id, version: inspectionItems.version }).from(inspectionItems).where(eq(inspectionItems.itemId, it.itemId)).get();
      if (row) tx.update(inspectionItems).set({ ...values, version: row.version + 1 }).where(eq(inspectionItems.id, row.id)).run();
      else tx.insert(inspectionItems).values({ inspectionId, jobId, itemId: it.itemId, ...values, createdAt: now }).run();
    }
  });
  return getInspection(deps, ctx.actor, jobId);
}

/**
 * Puts the inspection's suggested prep line on the job's quote (through the quote's own edit, so a sent quote gets a
 * new draft version and an approved one is refused). An earlier inspection line is replaced, not doubled.
 */
export function addPrepLine(deps: AppDeps, ctx: RequestContext, jobId: number, input: { quoteId?: number; editVersion?: number }): QuoteDetailDto {
  findJobFor(deps, ctx.actor, jobId);
  const suggestion = suggestedPrepLine(deps, jobId);
  if (!suggestion) throw conflict("Save the inspection of at least one item first; the prep line comes from it", { items: "Nothing inspected yet" });
  if (input.quoteId === undefined) {
    const existing = deps.db.select({ id: quotes.id }).from(quotes).where(eq(quotes.jobId, jobId)).get();
    if (existing) throw badRequest(`This job already has quote #${existing.id}; name the quote the line goes on`, { quoteId: "Name the job's quote" });
    const created = createQuote(deps, ctx, jobId);
    return addPrepLine(deps, ctx, jobId, { quoteId: created.id, editVersion: created.editVersion });
  }
  const q = deps.db.select({ id: quotes.id, jobId: quotes.jobId }).from(quotes).where(eq(quotes.id, input.quoteId)).get();
  if (!q || q.jobId !== jobId) throw badRequest("That quote is not one of this job's", { quoteId: "Not a quote of this job" });
  const lines = [...latestVersion(deps.db, q.id)!.lines];
  const at = lines.findIndex((l) => l.description.startsWith(PREP_LINE_PREFIX));
  if (at >= 0) lines[at] = suggestion.line;
  else lines.splice(lines.filter((l) => l.kind === "labour").length, 0, suggestion.line);
  return updateQuote(deps, ctx, q.id, { lines, editVersion: input.editVersion! });
}

/** The inspection as the customer reads it beside the quote: findings in words, shared photos only, no notes or hours. */
export function portalInspection(deps: AppDeps, jobId: number, photoUrl: (id: number, thumb: boolean) => string): PortalInspectionDto | null {
  const head = inspectionRow(deps, jobId);
  if (!head) return null;
  const rows = inspectedItems(deps, jobId).filter((r): r is { item: JobItemRow; row: ItemRow } => r.row !== null);
  const shared = deps.db
    .select({ id: uploads.id, ownerId: uploads.ownerId, caption: uploads.caption, createdAt: uploads.createdAt })
    .from(uploads)
    .where(and(eq(uploads.ownerType, "inspection_item"), eq(uploads.jobId, jobId), eq(uploads.kind, "photo"), eq(uploads.shareable, true)))
    .orderBy(asc(uploads.createdAt), asc(uploads.id))
    .all();
  return {
    inspectedAt: iso(head.inspectedAt),
    summary: head.customerSummary,
    items: rows.map(({ item, row }) => ({
      name: item.name,
      existingFinish: EXISTING_FINISH_LABELS[row.existingFinish],
      solventTest: row.solventTest === "not_done" ? null : SOLVENT_TEST_LABELS[row.solventTest],
      findings: findingWords(row),
      measuredArea: row.measuredArea,
      areaUnit: row.areaUnit,
      photos: shared
        .filter((p) => p.ownerId === row.id)
        .map((p) => ({ id: p.id, caption: p.caption, url: photoUrl(p.id, false), thumbUrl: photoUrl(p.id, true), takenAt: iso(p.createdAt) })),
    })),
  };
}
