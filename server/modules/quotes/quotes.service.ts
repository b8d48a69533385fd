import { updateAtVersion } from "../../db/edit-version";
import { and, asc, count, desc, eq, inArray, isNotNull, isNull, lt, or, sql, type SQL } from "drizzle-orm";
import type { z } from "zod";
import type { AppDeps } from "../../deps";
import type { Tx } from "../../db/client";
import { customers, jobItems, jobs, payments, quoteVersions, quotes, users } from "../../db/schema";
import { badRequest, conflict, notFound } from "../../http/http-error";
import type { RequestContext } from "../../http/context";
import { iso, isoOrNull } from "../../http/dates";
import { recordStageMove } from "../jobs/stage-move";
import { recordAudit } from "../audit/audit.service";
import { getSettings } from "../settings/settings.service";
import { findJobFor } from "../jobs/jobs.access";
import { logMessage } from "../messages/messages.service";
import { composeQuoteMail } from "../messages/compose";
import { linkExpiry, portalLinkPath, signQuoteLink } from "../portal/portal-link";
import { planForQuote } from "./quote-plan";
import { renderQuotePdf, type QuotePdfData } from "./quote-pdf";
import { parseSort, type Page } from "../../../shared/api/pagination";
import { computeQuoteTotals, type QuoteLine, type QuoteTotals } from "../../../shared/quote/index";
import type {
  ListQuotesQuery,
  QuoteDetailDto,
  QuoteDto,
  QuoteStatus,
  QuoteVersionDto,
  QuoteVersionSummary,
  sendQuoteInputSchema,
  updateQuoteInputSchema,
} from "../../../shared/schemas/quote.schema";

type VersionRow = typeof quoteVersions.$inferSelect;

/** Calendar date (YYYY-MM-DD) in the server's time zone, `addDays` later. */
export function localDate(ms: number, addDays = 0): string {
  const d = new Date(ms);
  d.setDate(d.getDate() + addDays);
  const pad = (n: number) => String(n).padStart(2, "0");
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
}

/** A sent (or viewed) quote past its valid-until date reads as expired; nothing is written for it. */
export function displayStatus(v: Pick<VersionRow, "status" | "validUntil">, today: string): QuoteStatus {
  if ((v.status === "sent" || v.status === "viewed") && v.validUntil < today) return "expired";
  return v.status;
}

export function totalsOf(v: Pick<VersionRow, "lines" | "taxPercent" | "taxedKinds" | "depositPercent" | "taxRounding">): QuoteTotals {
  return computeQuoteTotals(v.lines, { taxPercent: v.taxPercent, taxedKinds: v.taxedKinds, depositPercent: v.depositPercent, taxRounding: v.taxRounding });
}

export function latestVersion(db: Tx, quoteId: number): VersionRow | undefined {
  return db.select().from(quoteVersions).where(eq(quoteVersions.quoteId, quoteId)).orderBy(desc(quoteVersions.version)).limit(1).get();
}

/** The version the customer is looking at: the latest one that was ever sent. */
export function offeredVersion(db: Tx, quoteId: number): VersionRow | undefined {
  return db
    .select()
    .from(quoteVersions)
    .where(and(eq(quoteVersions.quoteId, quoteId), isNotNull(quoteVersions.sentAt)))
    .orderBy(desc(quoteVersions.version))
    .limit(1)
    .get();
}

/** Deposits that count for a quote (not a change order's extra deposit): received, less refunds; a flagged payment counts once the owner accepts it. */
export function paidCentsFor(db: Tx, quoteId: number): number {
  const row = db
    .select({ n: sql<number>`coalesce(sum(${payments.amountCents} - ${payments.refundedCents}), 0)` })
    .from(payments)
    .where(and(eq(payments.quoteId, quoteId), isNull(payments.changeOrderId), or(eq(payments.flagged, false), isNotNull(payments.reviewedAt))))
    .get();
  return Number(row?.n ?? 0);
}

function toVersionDto(v: VersionRow, createdByName: string | null, today: string): QuoteVersionDto {
  return {
    id: v.id,
    quoteId: v.quoteId,
    version: v.version,
    status: displayStatus(v, today),
    lines: v.lines,
    totals: totalsOf(v),
    taxPercent: v.taxPercent,
    taxedKinds: v.taxedKinds,
    taxRounding: v.taxRounding,
    depositPercent: v.depositPercent,
    validUntil: v.validUntil,
    intro: v.intro,
    terms: v.terms,
    finishText: v.finishText,
    createdAt: iso(v.createdAt),
    updatedAt: iso(v.updatedAt),
    createdByName,
    sentAt: isoOrNull(v.sentAt),
    sentTo: v.sentTo,
    viewedAt: isoOrNull(v.viewedAt),
    decidedAt: isoOrNull(v.decidedAt),
    decidedVia: v.decidedVia,
    decisionName: v.decisionName,
    decisionNote: v.decisionNote,
    decidedAddress: v.decidedAddress,
    supersededAt: isoOrNull(v.supersededAt),
  };
}

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

function findQuote(deps: AppDeps, id: number) {
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

/** What the audit trail keeps of a version: its money and its state. */
function auditView(v: Pick<VersionRow, "version" | "status" | "lines" | "taxPercent" | "taxedKinds" | "taxRounding" | "depositPercent" | "validUntil" | "totalCents" | "depositCents">) {
  return {
    version: v.version,
    status: v.status,
    lines: v.lines,
    taxPercent: v.taxPercent,
    taxedKinds: v.taxedKinds,
    taxRounding: v.taxRounding,
    depositPercent: v.depositPercent,
    validUntil: v.validUntil,
    totalCents: v.totalCents,
    depositCents: v.depositCents,
  };
}

/** Stored money columns for a version's content; refuses a quote whose discounts exceed its charges. */
function moneyColumns(v: Pick<VersionRow, "lines" | "taxPercent" | "taxedKinds" | "depositPercent" | "taxRounding">) {
  const t = totalsOf(v);
  if (t.subtotalCents < 0) throw badRequest("The discounts are larger than the charges", { lines: "Discounts exceed the charges" });
  return { subtotalCents: t.subtotalCents, taxCents: t.taxCents, totalCents: t.totalCents, depositCents: t.depositCents };
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
function refuseIfApproved(db: Tx, quoteId: number) {
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

/** Everything the PDF shows, for one version. */
export function pdfDataFor(deps: AppDeps, v: VersionRow): QuotePdfData {
  const job = deps.db
    .select({ id: jobs.id, title: jobs.title, c: customers })
    .from(quotes)
    .innerJoin(jobs, eq(quotes.jobId, jobs.id))
    .innerJoin(customers, eq(jobs.customerId, customers.id))
    .where(eq(quotes.id, v.quoteId))
    .get()!;
  const items = deps.db
    .select({ name: jobItems.name, substrate: jobItems.substrate, surfaceArea: jobItems.surfaceArea, areaUnit: jobItems.areaUnit })
    .from(jobItems)
    .where(eq(jobItems.jobId, job.id))
    .orderBy(asc(jobItems.id))
    .all();
  return {
    shop: getSettings(deps),
    quoteId: v.quoteId,
    version: v.version,
    status: displayStatus(v, localDate(deps.now())),
    issuedAt: v.sentAt ?? deps.now(),
    validUntil: v.validUntil,
    customer: { name: job.c.name, email: job.c.email, phone: job.c.phone, address: job.c.address },
    job: { id: job.id, title: job.title },
    items,
    finishText: v.finishText,
    intro: v.intro,
    terms: v.terms,
    lines: v.lines,
    totals: totalsOf(v),
    taxPercent: v.taxPercent,
    taxedKinds: v.taxedKinds,
    depositPercent: v.depositPercent,
  };
}

export const pdfFileName = (v: Pick<VersionRow, "quoteId" | "version">) => `quote-${v.quoteId}-v${v.version}.pdf`;

export async function quotePdf(deps: AppDeps, id: number, version?: number): Promise<{ filename: string; content: Buffer }> {
  findQuote(deps, id);
  const v = version
    ? deps.db.select().from(quoteVersions).where(and(eq(quoteVersions.quoteId, id), eq(quoteVersions.version, version))).get()
    : latestVersion(deps.db, id);
  if (!v) throw notFound("Quote version");
  return { filename: pdfFileName(v), content: await renderQuotePdf(pdfDataFor(deps, v)) };
}

/** A fresh signed link to the quote in the customer portal. */
export function quoteLink(deps: AppDeps, quoteId: number, validUntil: string) {
  const expiresAt = linkExpiry(deps.now(), validUntil);
  const token = signQuoteLink(deps.appSecret, quoteId, expiresAt);
  return { url: `${deps.publicUrl}${portalLinkPath(token)}`, token, expiresAt };
}

/**
 * E-mails the quote (PDF attached, portal link in the text) and only then marks it sent. If the mail server
 * fails, the user gets the 502 and the quote stays exactly as it was (a draft stays a draft); the failed attempt
 * is logged on the job. Sending a quote that is already out sends the same version again.
 */
export async function sendQuote(deps: AppDeps, ctx: RequestContext, id: number, input: z.output<typeof sendQuoteInputSchema>): Promise<QuoteDetailDto> {
  const q = findQuote(deps, id);
  const today = localDate(deps.now());
  const v = latestVersion(deps.db, id)!;
  const shown = displayStatus(v, today);
  if (shown === "approved") throw conflict("This quote is already approved; there is nothing to send", { status: "Approved" });
  if (shown === "declined") throw conflict("The customer declined this version. Revise it (a new version) before sending again", { status: "Declined" });
  if (shown === "expired") throw conflict("This version has expired. Revise it to set a new valid-until date, then send", { status: "Expired" });
  if (v.status === "draft") {
    refuseIfApproved(deps.db, id);
    const t = totalsOf(v);
    const fields: Record<string, string> = {};
    if (v.lines.length === 0 || t.totalCents <= 0) fields.lines = "Add the charges before sending";
    if (v.validUntil < today) fields.validUntil = "The valid-until date has passed";
    if (Object.keys(fields).length) throw badRequest("The quote is not ready to send", fields);
  }
  const to = input.to ?? q.customerEmail;
  if (!to) throw badRequest("The customer has no e-mail address on file; enter one to send to", { to: "Enter an e-mail address" });

  // The attached PDF is the quote as the customer receives it: sent, not a draft.
  const pdf = await renderQuotePdf({ ...pdfDataFor(deps, v), ...(v.status === "draft" ? { status: "sent" as const, issuedAt: deps.now() } : {}) });
  const link = quoteLink(deps, id, v.validUntil);
  const t = totalsOf(v);
  const mail = composeQuoteMail({
    shop: getSettings(deps),
    customerName: q.customerName,
    jobTitle: q.jobTitle,
    quoteId: id,
    version: v.version,
    totalCents: t.totalCents,
    depositCents: t.depositCents,
    depositPercent: v.depositPercent,
    validUntil: v.validUntil,
    link: link.url,
    linkExpiresAt: link.expiresAt,
    intro: v.intro,
    message: input.message ?? null,
  });
  const message = { to, ...mail, attachments: [{ filename: pdfFileName(v), content: pdf, contentType: "application/pdf" }] };

  let sent: { messageId: string };
  try {
    sent = await deps.mailer.send(message);
  } catch (err) {
    logMessage(deps.db, {
      jobId: q.jobId,
      quoteVersionId: v.id,
      kind: "quote",
      to,
      subject: mail.subject,
      status: "failed",
      error: err instanceof Error ? err.message : "Sending failed",
      attachments: [pdfFileName(v)],
      sentBy: ctx.actor.id,
      at: deps.now(),
    });
    throw err;
  }

  const now = deps.now();
  deps.db.transaction((tx) => {
    const fresh = tx.select().from(quoteVersions).where(eq(quoteVersions.id, v.id)).get()!;
    const first = fresh.sentAt == null;
    tx.update(quoteVersions)
      .set({ status: fresh.status === "draft" ? "sent" : fresh.status, sentAt: fresh.sentAt ?? now, sentBy: fresh.sentBy ?? ctx.actor.id, sentTo: to, updatedAt: now })
      .where(eq(quoteVersions.id, v.id))
      .run();
    if (first) {
      // The versions sent before this one are replaced by it.
      tx.update(quoteVersions)
        .set({ supersededAt: now })
        .where(and(eq(quoteVersions.quoteId, id), lt(quoteVersions.version, v.version), isNotNull(quoteVersions.sentAt), isNull(quoteVersions.supersededAt)))
        .run();
    }
    tx.update(quotes).set({ updatedAt: now }).where(eq(quotes.id, id)).run();
    logMessage(tx, {
      jobId: q.jobId,
      quoteVersionId: v.id,
      kind: "quote",
      to,
      subject: mail.subject,
      status: "sent",
      attachments: [pdfFileName(v)],
      providerMessageId: sent.messageId,
      sentBy: ctx.actor.id,
      at: now,
    });
    recordAudit(tx, ctx, { kind: "money", entity: "quote", entityId: id, action: first ? "sent" : "resent", after: { version: v.version, to, totalCents: t.totalCents, depositCents: t.depositCents } }, now);
    const job = tx.select({ stage: jobs.stage }).from(jobs).where(eq(jobs.id, q.jobId)).get();
    if (first && job?.stage === "inquiry") {
      recordStageMove(tx, { jobId: q.jobId, from: "inquiry", to: "quoted", userId: ctx.actor.id, note: `Quote #${id} sent`, at: now });
    }
  });
  return getQuote(deps, id);
}

