import { updateAtVersion } from "../../db/edit-version";
import { and, asc, count, desc, eq, inArray, lt, or, sql, type SQL } from "drizzle-orm";
import type { z } from "zod";
import type { AppDeps } from "../../deps";
import type { Tx } from "../../db/client";
import { customers, jobs, quoteVersions, quotes, users } from "../../db/schema";
import { conflict, notFound } from "../../http/http-error";
import type { RequestContext } from "../../http/context";
import { iso, isoOrNull } from "../../http/dates";
import { recordAudit } from "../audit/audit.service";
import { getSettings } from "../settings/settings.service";
import { findJobFor } from "../jobs/jobs.access";
import { planForQuote } from "./quote-plan";
import { parseSort, type Page } from "../../../shared/api/pagination";
import { type QuoteLine } from "../../../shared/quote/index";
import type {
  ListQuotesQuery,
  QuoteDetailDto,
  QuoteDto,
  QuoteStatus,
  QuoteVersionDto,
  QuoteVersionSummary,
  updateQuoteInputSchema,
} from "../../../shared/schemas/quote.schema";
import { localDate } from "./quote-dates";
import { auditView, displayStatus, latestVersion, moneyColumns, paidCentsFor, toVersionDto, type VersionRow } from "./quote-versions";

/** The latest version of each quote, joined with its job and customer. */
const latestOnly = sql`${quoteVersions.version} = (select max(qv.version) from quote_versions qv where qv.quote_id = ${quotes.id})`;

function selectQuoteRows(deps: AppDeps) {
  return deps.db
    .select({
      id: quotes.id,
      jobId: quotes.jobId,
      jobTitle: jobs.title,
      customerId: customers.id,
      customerName: customers.name,
      customerEmail: customers.email,
      updatedAt: quotes.updatedAt,
      editVersion: quotes.version,
      v: quoteVersions,
    })
    .from(quotes)
    .innerJoin(quoteVersions, and(eq(quoteVersions.quoteId, quotes.id), latestOnly))
    .innerJoin(jobs, eq(quotes.jobId, jobs.id))
    .innerJoin(customers, eq(jobs.customerId, customers.id));
}

type QuoteRow = ReturnType<ReturnType<typeof selectQuoteRows>["get"]> & {};

function toQuoteDto(deps: AppDeps, r: NonNullable<QuoteRow>, today: string): QuoteDto {
  return {
    id: r.id,
    jobId: r.jobId,
    jobTitle: r.jobTitle,
    customerId: r.customerId,
    customerName: r.customerName,
    customerEmail: r.customerEmail,
    version: r.v.version,
    status: displayStatus(r.v, today),
    totalCents: r.v.totalCents,
    depositCents: r.v.depositCents,
    validUntil: r.v.validUntil,
    sentAt: isoOrNull(r.v.sentAt),
    updatedAt: iso(r.updatedAt),
    paidCents: paidCentsFor(deps.db, r.id),
  };
}

const SORT = { id: quotes.id, updatedAt: quotes.updatedAt, total: quoteVersions.totalCents, validUntil: quoteVersions.validUntil } as const;

function statusFilter(status: QuoteStatus | undefined, today: string): SQL | undefined {
  if (!status) return undefined;
  const live = sql`${quoteVersions.validUntil} >= ${today}`;
  if (status === "expired") return and(inArray(quoteVersions.status, ["sent", "viewed"]), lt(quoteVersions.validUntil, today));
  if (status === "sent" || status === "viewed") return and(eq(quoteVersions.status, status), live);
  return eq(quoteVersions.status, status);
}

export function listQuotes(deps: AppDeps, q: ListQuotesQuery): Page<QuoteDto> {
  const today = localDate(deps.now());
  const text = q.q ? `%${q.q}%` : null;
  const where = and(
    q.jobId ? eq(quotes.jobId, q.jobId) : undefined,
    statusFilter(q.status, today),
    text ? or(sql`${jobs.title} like ${text}`, sql`${customers.name} like ${text}`, /^#?\d+$/.test(q.q!) ? eq(quotes.id, Number(q.q!.replace("#", ""))) : undefined) : undefined,
  );
  const { field, desc: isDesc } = parseSort(q.sort);
  const col = SORT[field as keyof typeof SORT] ?? quotes.updatedAt;
  const rows = selectQuoteRows(deps)
    .where(where)
    .orderBy(isDesc ? desc(col) : asc(col), desc(quotes.id))
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize)
    .all();
  const total =
    deps.db
      .select({ n: count() })
      .from(quotes)
      .innerJoin(quoteVersions, and(eq(quoteVersions.quoteId, quotes.id), latestOnly))
      .innerJoin(jobs, eq(quotes.jobId, jobs.id))
      .innerJoin(customers, eq(jobs.customerId, customers.id))
      .where(where)
      .get()?.n ?? 0;
  return { items: rows.map((r) => toQuoteDto(deps, r, today)), total, page: q.page, pageSize: q.pageSize };
}

export function findQuote(deps: AppDeps, id: number) {
  const row = selectQuoteRows(deps).where(eq(quotes.id, id)).get();
  if (!row) throw notFound("Quote");
  return row;
}

export function getQuote(deps: AppDeps, id: number): QuoteDetailDto {
  const today = localDate(deps.now());
  const row = findQuote(deps, id);
  const all = deps.db
    .select({ v: quoteVersions, by: users.name })
    .from(quoteVersions)
    .leftJoin(users, eq(quoteVersions.createdBy, users.id))
    .where(eq(quoteVersions.quoteId, id))
    .orderBy(desc(quoteVersions.version))
    .all();
  const current = all[0]!;
  const versions: QuoteVersionSummary[] = all.map(({ v }) => ({
    version: v.version,
    status: displayStatus(v, today),
    totalCents: v.totalCents,
    createdAt: iso(v.createdAt),
    sentAt: isoOrNull(v.sentAt),
    supersededAt: isoOrNull(v.supersededAt),
  }));
  const offered = all.find(({ v }) => v.sentAt != null);
  const plan = planForQuote(deps, row.jobId, 0);
  return {
    ...toQuoteDto(deps, row, today),
    editVersion: row.editVersion,
    current: toVersionDto(current.v, current.by, today),
    versions,
    offeredVersion: offered ? offered.v.version : null,
    planAvailable: plan !== null,
    planProblems: plan?.problems ?? [],
  };
}

export function getQuoteVersion(deps: AppDeps, id: number, version: number): QuoteVersionDto {
  findQuote(deps, id);
  const row = deps.db
    .select({ v: quoteVersions, by: users.name })
    .from(quoteVersions)
    .leftJoin(users, eq(quoteVersions.createdBy, users.id))
    .where(and(eq(quoteVersions.quoteId, id), eq(quoteVersions.version, version)))
    .get();
  if (!row) throw notFound("Quote version");
  return toVersionDto(row.v, row.by, localDate(deps.now()));
}

export function createQuote(deps: AppDeps, ctx: RequestContext, jobId: number): QuoteDetailDto {
  const job = findJobFor(deps, ctx.actor, jobId);
  if (job.stage === "cancelled") throw conflict("The job is cancelled; reopen it before quoting", { jobId: "Cancelled job" });
  const s = getSettings(deps);
  const plan = planForQuote(deps, jobId, s.materialsMarkupPercent);
  const lines: QuoteLine[] = [
    { kind: "labour", description: "Prep: strip, sand, clean and mask", hours: 0, rateCents: s.labourRateCents },
    { kind: "labour", description: "Spraying the finish", hours: 0, rateCents: s.labourRateCents },
    { kind: "labour", description: "Cut, polish and reassemble", hours: 0, rateCents: s.labourRateCents },
    ...(plan?.lines ?? []),
    ...(s.shopSuppliesPercent > 0 ? [{ kind: "supplies", description: "Shop supplies (abrasives, masking, solvents)", basis: "percent", percent: s.shopSuppliesPercent } as QuoteLine] : []),
  ];
  const content = {
    lines,
    taxPercent: s.taxPercent,
    taxedKinds: [...s.taxAppliesTo],
    taxRounding: "invoice" as const,
    depositPercent: s.depositPercent,
  };
  const now = deps.now();
  const id = deps.db.transaction((tx) => {
    const q = tx.insert(quotes).values({ jobId, createdBy: ctx.actor.id, createdAt: now, updatedAt: now }).returning({ id: quotes.id }).get();
    const v = {
      quoteId: q.id,
      version: 1,
      status: "draft" as const,
      ...content,
      ...moneyColumns(content),
      validUntil: localDate(now, s.quoteValidDays),
      terms: s.quoteTerms || null,
      finishText: plan?.finishText || null,
      createdBy: ctx.actor.id,
      createdAt: now,
      updatedAt: now,
    };
    tx.insert(quoteVersions).values(v).run();
    recordAudit(tx, ctx, { kind: "money", entity: "quote", entityId: q.id, action: "created", after: { jobId, ...auditView(v) } }, now);
    return q.id;
  });
  return getQuote(deps, id);
}

/** A change to a quote; `version` (the quote's edit version) when it comes from the editor, which must not be stale. */
type UpdateInput = Omit<z.output<typeof updateQuoteInputSchema>, "editVersion"> & { editVersion?: number };

function applyUpdate(v: VersionRow, input: UpdateInput) {
  return {
    lines: input.lines ? (input.lines as QuoteLine[]) : v.lines,
    taxPercent: input.taxPercent ?? v.taxPercent,
    taxedKinds: input.taxedKinds ? [...new Set(input.taxedKinds)] : v.taxedKinds,
    taxRounding: input.taxRounding ?? v.taxRounding,
    depositPercent: input.depositPercent ?? v.depositPercent,
    validUntil: input.validUntil ?? v.validUntil,
    intro: input.intro === undefined ? v.intro : input.intro,
    terms: input.terms === undefined ? v.terms : input.terms,
    finishText: input.finishText === undefined ? v.finishText : input.finishText,
  };
}

/** An approved quote is settled: a change of scope is a new quote. */
export function refuseIfApproved(db: Tx, quoteId: number) {
  const approved = db
    .select({ version: quoteVersions.version })
    .from(quoteVersions)
    .where(and(eq(quoteVersions.quoteId, quoteId), eq(quoteVersions.status, "approved")))
    .get();
  if (approved)
    throw conflict(`Version ${approved.version} of this quote was approved by the customer, so it can no longer change. Start a new quote for extra work.`, {
      status: "Approved",
    });
}

/** Makes the next version as a draft copy of the latest (with `input` applied). */
function newVersion(tx: Tx, ctx: RequestContext, latest: VersionRow, input: UpdateInput, now: number) {
  const content = applyUpdate(latest, input);
  const v = { quoteId: latest.quoteId, version: latest.version + 1, status: "draft" as const, ...content, ...moneyColumns(content), createdBy: ctx.actor.id, createdAt: now, updatedAt: now };
  tx.insert(quoteVersions).values(v).run();
  tx.update(quotes).set({ updatedAt: now }).where(eq(quotes.id, latest.quoteId)).run();
  recordAudit(tx, ctx, { kind: "money", entity: "quote", entityId: latest.quoteId, action: "new_version", before: auditView(latest), after: auditView(v) }, now);
}

/**
 * Edits a quote. A draft is changed in place. A quote that was sent (viewed, declined or expired) is never
 * changed: the edit becomes a new draft version and the sent one stays as it was.
 */
export function updateQuote(deps: AppDeps, ctx: RequestContext, id: number, input: UpdateInput): QuoteDetailDto {
  findQuote(deps, id);
  const now = deps.now();
  deps.db.transaction((tx) => {
    refuseIfApproved(tx, id);
    if (input.editVersion !== undefined) updateAtVersion(tx, quotes, { id, version: input.editVersion, actorId: ctx.actor.id, what: "quote" }, { updatedAt: now }, () => getQuote(deps, id));
    const latest = latestVersion(tx, id)!;
    if (latest.status !== "draft") {
      newVersion(tx, ctx, latest, input, now);
      return;
    }
    const content = applyUpdate(latest, input);
    const money = moneyColumns(content);
    tx.update(quoteVersions).set({ ...content, ...money, updatedAt: now }).where(eq(quoteVersions.id, latest.id)).run();
    tx.update(quotes).set({ updatedAt: now }).where(eq(quotes.id, id)).run();
    recordAudit(tx, ctx, { kind: "money", entity: "quote", entityId: id, action: "updated", before: auditView(latest), after: auditView({ ...latest, ...content, ...money }) }, now);
  });
  return getQuote(deps, id);
}

/** "Revise": starts the next version as a draft copy of a sent quote. */
export function reviseQuote(deps: AppDeps, ctx: RequestContext, id: number): QuoteDetailDto {
  findQuote(deps, id);
  const now = deps.now();
  deps.db.transaction((tx) => {
    refuseIfApproved(tx, id);
    const latest = latestVersion(tx, id)!;
    if (latest.status === "draft") throw conflict(`Version ${latest.version} is still a draft; edit it instead`, { status: "Draft" });
    const s = getSettings(deps);
    // A revision gets a fresh validity period when the old one has run out.
    const today = localDate(now);
    newVersion(tx, ctx, latest, latest.validUntil < today ? { validUntil: localDate(now, s.quoteValidDays) } : {}, now);
  });
  return getQuote(deps, id);
}

/** Throws away the draft: the whole quote when it was never sent, otherwise just the draft version. */
export function discardDraft(deps: AppDeps, ctx: RequestContext, id: number): { deleted: "quote" | "version" } {
  findQuote(deps, id);
  const now = deps.now();
  return deps.db.transaction((tx) => {
    const latest = latestVersion(tx, id)!;
    if (latest.status !== "draft") throw conflict("Only a draft can be discarded; a sent quote stays on record", { status: latest.status });
    recordAudit(tx, ctx, { kind: "money", entity: "quote", entityId: id, action: latest.version === 1 ? "deleted" : "draft_discarded", before: auditView(latest) }, now);
    if (latest.version === 1) {
      tx.delete(quotes).where(eq(quotes.id, id)).run();
      return { deleted: "quote" as const };
    }
    tx.delete(quoteVersions).where(eq(quoteVersions.id, latest.id)).run();
    tx.update(quotes).set({ updatedAt: now }).where(eq(quotes.id, id)).run();
    return { deleted: "version" as const };
  });
}

/** Replaces the draft's materials lines with the ones from the job's finish plan estimate (and the finish words). */
export function fillMaterialsFromPlan(deps: AppDeps, ctx: RequestContext, id: number): QuoteDetailDto {
  const q = findQuote(deps, id);
  const latest = latestVersion(deps.db, id)!;
  const markup = latest.lines.find((l) => l.kind === "materials")?.markupPercent ?? getSettings(deps).materialsMarkupPercent;
  const plan = planForQuote(deps, q.jobId, markup);
  if (!plan) throw conflict("This job has no finish plan yet; plan the finish first, or enter the materials by hand", { lines: "No finish plan" });
  // Materials lines are placed where the old ones were (or after the labour).
  const lines = [...latest.lines];
  const firstMat = lines.findIndex((l) => l.kind === "materials");
  const kept = lines.filter((l) => l.kind !== "materials");
  const at = firstMat >= 0 ? firstMat : kept.filter((l) => l.kind === "labour").length;
  kept.splice(at, 0, ...plan.lines);
  return updateQuote(deps, ctx, id, { lines: kept, finishText: plan.finishText || latest.finishText });
}
