import { and, asc, eq, isNotNull, isNull, lt } from "drizzle-orm";
import type { z } from "zod";
import type { AppDeps } from "../../deps";
import { customers, jobItems, jobs, quoteVersions, quotes } from "../../db/schema";
import { badRequest, conflict, notFound } from "../../http/http-error";
import type { RequestContext } from "../../http/context";
import { recordStageMove } from "../jobs/stage-move";
import { recordAudit } from "../audit/audit.service";
import { getSettings } from "../settings/settings.service";
import { logMessage } from "../messages/messages.service";
import { composeQuoteMail } from "../messages/compose";
import { linkExpiry, portalLinkPath, signQuoteLink } from "../portal/portal-link";
import { renderQuotePdf, type QuotePdfData } from "./quote-pdf";
import type {
  QuoteDetailDto,
  sendQuoteInputSchema,
} from "../../../shared/schemas/quote.schema";
import { findQuote, getQuote, refuseIfApproved } from "./quotes.service";
import { displayStatus, latestVersion, totalsOf, type VersionRow } from "./quote-versions";
import { localDate } from "./quote-dates";

/** Sending a quote: the PDF, the signed portal link, and the e-mail that marks it sent. */

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
