import { and, asc, desc, eq, isNotNull } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import { customers, jobItems, jobs, payments, quoteVersions, quotes, uploads } from "../../db/schema";
import { conflict, notFound } from "../../http/http-error";
import { iso, isoOrNull } from "../../http/dates";
import { recordAudit } from "../audit/audit.service";
import { getSettings } from "../settings/settings.service";
import { displayStatus, offeredVersion, paidCentsFor, totalsOf } from "../quotes/quote-versions";
import { localDate } from "../quotes/quote-dates";
import { readStored } from "../uploads/storage";
import type { PortalViewer } from "./portal-viewer";
import { portalInspection } from "../intake/inspection.service";
import { awaitsReview } from "../payments/payment-review";
import { jobPlanRow, loadPlanVersion } from "../plans/plans.service";
import { planVersions } from "../../db/schema";
import { customerLineDetail, describeFinish, taxLabel } from "../../../shared/quote/index";
import type {
  PortalJobDto,
  PortalQuoteDto,
  PortalQuoteSummaryDto,
  PortalSessionDto,
  QuoteStatus,
} from "../../../shared/schemas/quote.schema";

export function portalSession(viewer: PortalViewer): PortalSessionDto {
  return { via: viewer.via, customerName: viewer.name, quoteId: viewer.quoteId, expiresAt: viewer.expiresAt ? iso(viewer.expiresAt) : null };
}

/** A quote the viewer may see: their own, sent at least once (drafts are the shop's), and with a link only that one. */
function reachableQuote(deps: AppDeps, viewer: PortalViewer, quoteId: number) {
  if (viewer.via === "link" && viewer.quoteId !== quoteId) throw notFound("Quote");
  const q = deps.db
    .select({ id: quotes.id, jobId: jobs.id, jobTitle: jobs.title, jobStage: jobs.stage, customerId: jobs.customerId, customerName: customers.name })
    .from(quotes)
    .innerJoin(jobs, eq(quotes.jobId, jobs.id))
    .innerJoin(customers, eq(jobs.customerId, customers.id))
    .where(and(eq(quotes.id, quoteId), eq(jobs.customerId, viewer.customerId)))
    .get();
  const offered = q ? offeredVersion(deps.db, quoteId) : undefined;
  if (!q || !offered) throw notFound("Quote");
  return { q, v: offered };
}

function underReview(deps: AppDeps, quoteId: number) {
  return !!deps.db
    .select({ id: payments.id })
    .from(payments)
    .where(and(eq(payments.quoteId, quoteId), awaitsReview()))
    .get();
}

function items(deps: AppDeps, jobId: number) {
  return deps.db
    .select({ name: jobItems.name, substrate: jobItems.substrate, surfaceArea: jobItems.surfaceArea, areaUnit: jobItems.areaUnit })
    .from(jobItems)
    .where(eq(jobItems.jobId, jobId))
    .orderBy(asc(jobItems.id))
    .all();
}

function toPortalQuote(deps: AppDeps, viewer: PortalViewer, q: ReturnType<typeof reachableQuote>["q"], v: typeof quoteVersions.$inferSelect): PortalQuoteDto {
  const today = localDate(deps.now());
  const status = displayStatus(v, today);
  const t = totalsOf(v);
  const s = getSettings(deps);
  const paid = paidCentsFor(deps.db, q.id);
  const review = underReview(deps, q.id);
  const latestSent = !v.supersededAt;
  return {
    id: q.id,
    version: v.version,
    status,
    jobId: q.jobId,
    jobTitle: q.jobTitle,
    jobStage: q.jobStage,
    customerName: q.customerName,
    shop: { name: s.shopName, address: s.shopAddress, phone: s.shopPhone, email: s.shopEmail },
    items: items(deps, q.jobId),
    finishText: v.finishText,
    lines: v.lines.map((line, i) => ({ kind: line.kind, description: line.description, detail: customerLineDetail(line), amountCents: t.lines[i]!.amountCents })),
    subtotalCents: t.subtotalCents,
    discountCents: t.discountCents,
    taxCents: t.taxCents,
    taxLabel: taxLabel(v.taxPercent, v.taxedKinds),
    totalCents: t.totalCents,
    depositCents: t.depositCents,
    depositPercent: v.depositPercent,
    balanceCents: t.balanceCents,
    validUntil: v.validUntil,
    intro: v.intro,
    terms: v.terms,
    sentAt: isoOrNull(v.sentAt),
    decidedAt: isoOrNull(v.decidedAt),
    decisionName: v.decisionName,
    paidCents: paid,
    paymentUnderReview: review,
    canDecide: latestSent && (status === "sent" || status === "viewed"),
    canPay: latestSent && status === "approved" && t.depositCents >= 50 && paid < t.depositCents && !review && deps.payments !== null,
    inspection: portalInspection(deps, q.jobId, (id, thumb) => photoUrl(viewer, id, thumb)),
  };
}

export function listPortalQuotes(deps: AppDeps, viewer: PortalViewer): PortalQuoteSummaryDto[] {
  const today = localDate(deps.now());
  const rows = deps.db
    .select({ id: quotes.id, jobId: jobs.id, jobTitle: jobs.title })
    .from(quotes)
    .innerJoin(jobs, eq(quotes.jobId, jobs.id))
    .where(and(eq(jobs.customerId, viewer.customerId), viewer.via === "link" ? eq(quotes.id, viewer.quoteId) : undefined))
    .orderBy(desc(quotes.updatedAt), desc(quotes.id))
    .all();
  return rows.flatMap((r) => {
    const v = offeredVersion(deps.db, r.id);
    if (!v) return [];
    return [
      {
        id: r.id,
        version: v.version,
        status: displayStatus(v, today),
        jobId: r.jobId,
        jobTitle: r.jobTitle,
        totalCents: v.totalCents,
        depositCents: v.depositCents,
        paidCents: paidCentsFor(deps.db, r.id),
        validUntil: v.validUntil,
        sentAt: isoOrNull(v.sentAt),
      },
    ];
  });
}

/** The quote as the customer reads it. The first time the customer opens a sent quote it becomes "viewed". */
export function getPortalQuote(deps: AppDeps, viewer: PortalViewer, quoteId: number): PortalQuoteDto {
  const { q, v } = reachableQuote(deps, viewer, quoteId);
  if (v.status === "sent" && !v.supersededAt) {
    const now = deps.now();
    deps.db.update(quoteVersions).set({ status: "viewed", viewedAt: now }).where(and(eq(quoteVersions.id, v.id), eq(quoteVersions.status, "sent"))).run();
    return toPortalQuote(deps, viewer, q, { ...v, status: "viewed", viewedAt: now });
  }
  return toPortalQuote(deps, viewer, q, v);
}

/** Approve or decline the quote on offer; recorded with the time, how (account or link) and the address. */
export function decideQuote(
  deps: AppDeps,
  viewer: PortalViewer,
  quoteId: number,
  decision: "approved" | "declined",
  input: { name?: string; note?: string | null; reason?: string | null },
  address: string | null,
): PortalQuoteDto {
  const { q } = reachableQuote(deps, viewer, quoteId);
  const now = deps.now();
  const today = localDate(now);
  deps.db.transaction((tx) => {
    const v = offeredVersion(tx, quoteId)!;
    const status: QuoteStatus = displayStatus(v, today);
    if (v.supersededAt) throw conflict("The shop has sent a newer version of this quote; open the latest one");
    if (status === "expired") throw conflict(`This quote expired on ${v.validUntil}. Ask the shop for a fresh one.`, { status: "Expired" });
    if (status === "approved" || status === "declined") throw conflict(`You already ${status} this quote`, { status });
    const name = input.name ?? viewer.name;
    const note = decision === "approved" ? (input.note ?? null) : (input.reason ?? null);
    tx.update(quoteVersions)
      .set({ status: decision, decidedAt: now, decidedVia: viewer.via, decidedBy: viewer.userId, decidedAddress: address, decisionName: name, decisionNote: note, viewedAt: v.viewedAt ?? now, updatedAt: now })
      .where(eq(quoteVersions.id, v.id))
      .run();
    tx.update(quotes).set({ updatedAt: now }).where(eq(quotes.id, quoteId)).run();
    const ctx = viewer.via === "account" ? { actor: { id: viewer.userId, name: viewer.name, email: "", role: "customer" as const, customerId: viewer.customerId }, address } : null;
    recordAudit(
      tx,
      ctx,
      {
        kind: "money",
        entity: "quote",
        entityId: quoteId,
        action: decision,
        before: { version: v.version, status: v.status },
        after: { version: v.version, status: decision, via: viewer.via, name, note, address, totalCents: v.totalCents, depositCents: v.depositCents },
      },
      now,
    );
  });
  return toPortalQuote(deps, viewer, q, offeredVersion(deps.db, quoteId)!);
}

/** The finish in plain words for a job: its current plan, or else what its latest quote said. */
function finishWordsFor(deps: AppDeps, jobId: number): string | null {
  const plan = jobPlanRow(deps.db, jobId);
  if (plan) {
    const latest = deps.db.select({ id: planVersions.id }).from(planVersions).where(eq(planVersions.planId, plan.id)).orderBy(desc(planVersions.version)).limit(1).get();
    if (latest) {
      const words = describeFinish(loadPlanVersion(deps, latest.id).layers.map((l) => ({ name: l.name, kind: l.kind, coats: l.coats })));
      if (words) return words;
    }
  }
  const v = deps.db
    .select({ finishText: quoteVersions.finishText })
    .from(quoteVersions)
    .innerJoin(quotes, eq(quoteVersions.quoteId, quotes.id))
    .where(and(eq(quotes.jobId, jobId), isNotNull(quoteVersions.sentAt), isNotNull(quoteVersions.finishText)))
    .orderBy(desc(quoteVersions.sentAt))
    .limit(1)
    .get();
  return v?.finishText ?? null;
}

export function photoUrl(viewer: PortalViewer, id: number, thumb: boolean) {
  const params = new URLSearchParams();
  if (thumb) params.set("size", "thumb");
  if (viewer.token) params.set("token", viewer.token);
  const qs = params.toString();
  return `/api/portal/photos/${id}${qs ? `?${qs}` : ""}`;
}

function toPortalJob(deps: AppDeps, viewer: PortalViewer, job: typeof jobs.$inferSelect): PortalJobDto {
  const photos = deps.db
    .select({ id: uploads.id, caption: uploads.caption, createdAt: uploads.createdAt })
    .from(uploads)
    .where(and(eq(uploads.jobId, job.id), eq(uploads.kind, "photo"), eq(uploads.shareable, true)))
    .orderBy(asc(uploads.createdAt), asc(uploads.id))
    .all()
    .map((p) => ({ id: p.id, caption: p.caption, url: photoUrl(viewer, p.id, false), thumbUrl: photoUrl(viewer, p.id, true), takenAt: iso(p.createdAt) }));
  const quotesOut = listPortalQuotes(deps, viewer)
    .filter((q) => q.jobId === job.id)
    .map((q) => ({ id: q.id, version: q.version, status: q.status, totalCents: q.totalCents, depositCents: q.depositCents, paidCents: q.paidCents }));
  return {
    id: job.id,
    title: job.title,
    stage: job.stage,
    dueDate: job.dueDate,
    items: items(deps, job.id),
    finishText: finishWordsFor(deps, job.id),
    photos,
    quotes: quotesOut,
  };
}

export function listPortalJobs(deps: AppDeps, viewer: PortalViewer): PortalJobDto[] {
  return deps.db
    .select()
    .from(jobs)
    .where(and(eq(jobs.customerId, viewer.customerId), viewer.via === "link" ? eq(jobs.id, viewer.jobId) : undefined))
    .orderBy(desc(jobs.updatedAt), desc(jobs.id))
    .all()
    .map((j) => toPortalJob(deps, viewer, j));
}

export function getPortalJob(deps: AppDeps, viewer: PortalViewer, jobId: number): PortalJobDto {
  if (viewer.via === "link" && viewer.jobId !== jobId) throw notFound("Job");
  const job = deps.db.select().from(jobs).where(and(eq(jobs.id, jobId), eq(jobs.customerId, viewer.customerId))).get();
  if (!job) throw notFound("Job");
  return toPortalJob(deps, viewer, job);
}

/** A shareable photo of one of the viewer's jobs (full size, or the thumbnail). */
export function portalPhoto(deps: AppDeps, viewer: PortalViewer, id: number, thumb: boolean): { mime: string; content: Buffer } {
  const row = deps.db
    .select({ u: uploads, customerId: jobs.customerId })
    .from(uploads)
    .innerJoin(jobs, eq(uploads.jobId, jobs.id))
    .where(and(eq(uploads.id, id), eq(uploads.kind, "photo"), eq(uploads.shareable, true)))
    .get();
  if (!row || row.customerId !== viewer.customerId || (viewer.via === "link" && row.u.jobId !== viewer.jobId)) throw notFound("Photo");
  const name = thumb && row.u.thumbName ? row.u.thumbName : row.u.storedName;
  const content = readStored(deps.uploadsDir, name);
  if (!content) throw notFound("Photo");
  return { mime: thumb && row.u.thumbName ? "image/webp" : row.u.mime, content };
}
