import { and, desc, eq, isNotNull, isNull, or, sql } from "drizzle-orm";
import type { Tx } from "../../db/client";
import { payments, quoteVersions } from "../../db/schema";
import { badRequest } from "../../http/http-error";
import { iso, isoOrNull } from "../../http/dates";
import { computeQuoteTotals, type QuoteTotals } from "../../../shared/quote/index";
import type {
  QuoteStatus,
  QuoteVersionDto,
} from "../../../shared/schemas/quote.schema";

/** Quote versions: the stored row, its status on a day, its totals, and the version offered to the customer. */

export type VersionRow = typeof quoteVersions.$inferSelect;

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

export function toVersionDto(v: VersionRow, createdByName: string | null, today: string): QuoteVersionDto {
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

/** What the audit trail keeps of a version: its money and its state. */
export function auditView(v: Pick<VersionRow, "version" | "status" | "lines" | "taxPercent" | "taxedKinds" | "taxRounding" | "depositPercent" | "validUntil" | "totalCents" | "depositCents">) {
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
export function moneyColumns(v: Pick<VersionRow, "lines" | "taxPercent" | "taxedKinds" | "depositPercent" | "taxRounding">) {
  const t = totalsOf(v);
  if (t.subtotalCents < 0) throw badRequest("The discounts are larger than the charges", { lines: "Discounts exceed the charges" });
  return { subtotalCents: t.subtotalCents, taxCents: t.taxCents, totalCents: t.totalCents, depositCents: t.depositCents };
}
