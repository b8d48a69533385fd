import { and, asc, eq } from "drizzle-orm";
import { customers, jobItems, jobMessages, jobStageEvents, payments, quoteVersions, quotes, refunds } from "../schema";
import { getSettings } from "../../modules/settings/settings.service";
import { planForQuote } from "../../modules/quotes/quote-plan";
import { suggestedPrepLine } from "../../modules/intake/inspection.service";
import { computeQuoteTotals, formatCents, type QuoteLine } from "../../../shared/quote/index";
import type { Stage } from "../../../shared/domain/stages";
import type { SeedContext } from "./core";

/**
 * Demo quotes, deposits and the e-mails about them, matching each job's stage:
 *  - inquiry: a couple of drafts being priced;
 *  - quoted: sent quotes (one opened by the customer, one revised to a second version, one past its date, and one
 *    approved whose card payment came in short and waits for the owner's check);
 *  - booked and later: approved quotes with the deposit paid (recorded as payments), a receipt e-mailed,
 *    and a ready-for-pickup notice on jobs that reached Ready;
 *  - cancelled: declined quotes.
 * Money follows the demo settings (labour $95/h, tax 7.25 % on materials and supplies, deposit 40 %).
 */
const DAY = 86_400_000;
const HOUR = 3_600_000;
const dateOnly = (ms: number) => new Date(ms).toISOString().slice(0, 10);

/** Hours by kind of work, scaled by the number of parts (shop's rule of thumb for the demo). */
function labourLines(itemCount: number, area: number, rateCents: number): QuoteLine[] {
  const parts = Math.max(1, itemCount);
  const big = area > 2 ? 1.6 : 1;
  const h = (x: number) => Math.round(x * big * 4) / 4;
  return [
    { kind: "labour", description: "Prep: strip, sand, clean and mask", hours: h(1.5 + parts * 1.25), rateCents },
    { kind: "labour", description: "Spraying the finish", hours: h(1 + parts * 1), rateCents },
    { kind: "labour", description: "Cut, polish and reassemble", hours: h(0.75 + parts * 0.5), rateCents },
  ];
}

export function seedQuotes(ctx: SeedContext) {
  const { db } = ctx;
  const s = getSettings({ db });
  const byStage = (stage: Stage) => ctx.jobs.filter((j) => j.stage === stage);
  let n = 0;

  const eventAt = (jobId: number, to: Stage) =>
    db
      .select({ at: jobStageEvents.at })
      .from(jobStageEvents)
      .where(and(eq(jobStageEvents.jobId, jobId), eq(jobStageEvents.toStage, to)))
      .orderBy(asc(jobStageEvents.at))
      .get()?.at;

  function linesFor(jobId: number): { lines: QuoteLine[]; finishText: string | null } {
    const items = db.select({ area: jobItems.surfaceArea, unit: jobItems.areaUnit }).from(jobItems).where(eq(jobItems.jobId, jobId)).all();
    const area = items.reduce((a, i) => a + (i.unit === "ft2" ? i.area * 0.09290304 : i.area), 0);
    const plan = planForQuote({ db }, jobId, s.materialsMarkupPercent);
    const materials: QuoteLine[] = plan?.lines.length
      ? plan.lines
      : [
          { kind: "materials", description: "Sealer, ground coat and colour materials", costCents: Math.round(6000 + area * 9000), markupPercent: s.materialsMarkupPercent },
          { kind: "materials", description: "2K urethane clear with hardener and reducer", costCents: Math.round(3000 + area * 5000), markupPercent: s.materialsMarkupPercent },
        ];
    // A job inspected at intake carries the prep line its inspection suggests.
    const prep = suggestedPrepLine({ db }, jobId);
    return {
      lines: [
        ...labourLines(items.length, area, s.labourRateCents),
        ...(prep ? [prep.line] : []),
        ...materials,
        { kind: "supplies", description: "Shop supplies (abrasives, masking, solvents)", basis: "percent", percent: s.shopSuppliesPercent },
      ],
      finishText: plan?.finishText ?? null,
    };
  }

  type VersionSeed = {
    status: "draft" | "sent" | "viewed" | "approved" | "declined";
    createdAt: number;
    sentAt?: number;
    viewedAt?: number;
    decidedAt?: number;
    declineReason?: string;
    supersededAt?: number;
    lines?: QuoteLine[];
    validUntil?: string;
  };

  function addQuote(job: SeedContext["jobs"][number], versions: VersionSeed[]) {
    const base = linesFor(job.id);
    const customer = db.select().from(customers).where(eq(customers.id, job.customerId)).get()!;
    const first = versions[0]!;
    const last = versions.at(-1)!;
    const quoteId = db
      .insert(quotes)
      .values({ jobId: job.id, createdBy: ctx.userIds.estimator, createdAt: first.createdAt, updatedAt: last.decidedAt ?? last.sentAt ?? last.createdAt })
      .returning({ id: quotes.id })
      .get().id;
    let versionId = 0;
    let total = 0;
    let deposit = 0;
    versions.forEach((v, i) => {
      const lines = v.lines ?? base.lines;
      const t = computeQuoteTotals(lines, { taxPercent: s.taxPercent, taxedKinds: s.taxAppliesTo, depositPercent: s.depositPercent });
      total = t.totalCents;
      deposit = t.depositCents;
      versionId = db
        .insert(quoteVersions)
        .values({
          quoteId,
          version: i + 1,
          status: v.status,
          lines,
          taxPercent: s.taxPercent,
          taxedKinds: s.taxAppliesTo,
          taxRounding: "invoice",
          depositPercent: s.depositPercent,
          validUntil: v.validUntil ?? dateOnly((v.sentAt ?? v.createdAt) + s.quoteValidDays * DAY),
          intro: i > 0 ? "We have revised the quote as we discussed." : null,
          terms: s.quoteTerms || null,
          finishText: base.finishText,
          subtotalCents: t.subtotalCents,
          taxCents: t.taxCents,
          totalCents: t.totalCents,
          depositCents: t.depositCents,
          createdBy: ctx.userIds.estimator,
          createdAt: v.createdAt,
          updatedAt: v.decidedAt ?? v.sentAt ?? v.createdAt,
          sentAt: v.sentAt ?? null,
          sentBy: v.sentAt ? ctx.userIds.estimator : null,
          sentTo: v.sentAt ? customer.email : null,
          viewedAt: v.viewedAt ?? (v.decidedAt ? v.decidedAt - 2 * HOUR : null),
          decidedAt: v.decidedAt ?? null,
          decidedVia: v.decidedAt ? (job.customerId === ctx.customerIds[0] ? "account" : "link") : null,
          decidedBy: v.decidedAt && job.customerId === ctx.customerIds[0] ? ctx.userIds.customer : null,
          decidedAddress: v.decidedAt ? "198.51.100.24" : null,
          decisionName: v.decidedAt ? customer.name : null,
          decisionNote: v.declineReason ?? null,
          supersededAt: v.supersededAt ?? null,
        })
        .returning({ id: quoteVersions.id })
        .get().id;
      if (v.sentAt && customer.email) {
        db.insert(jobMessages)
          .values({
            jobId: job.id,
            quoteVersionId: versionId,
            kind: "quote",
            to: customer.email,
            subject: `Your quote from ${s.shopName}: ${job.title}${i > 0 ? " (revised)" : ""}`,
            status: "sent",
            attachments: [`quote-${quoteId}-v${i + 1}.pdf`],
            sentBy: ctx.userIds.estimator,
            at: v.sentAt,
          })
          .run();
      }
    });
    return { quoteId, versionId, total, deposit, email: customer.email };
  }

  function addPayment(job: SeedContext["jobs"][number], q: ReturnType<typeof addQuote>, paidAt: number, opts: { amount?: number; refund?: number } = {}) {
    n++;
    const amount = opts.amount ?? q.deposit;
    const flagged = amount !== q.deposit;
    const paymentId = db
      .insert(payments)
      .values({
        jobId: job.id,
        quoteId: q.quoteId,
        quoteVersionId: q.versionId,
        sessionId: `cs_demo_${String(n).padStart(4, "0")}`,
        paymentIntentId: `pi_demo_${String(n).padStart(4, "0")}`,
        eventId: `evt_demo_${String(n).padStart(4, "0")}`,
        amountCents: amount,
        expectedCents: q.deposit,
        currency: "usd",
        refundedCents: opts.refund ?? 0,
        flagged,
        flagReason: flagged ? `paid ${formatCents(amount)} but the deposit asked was ${formatCents(q.deposit)}` : null,
        paidAt,
        createdAt: paidAt,
      })
      .returning({ id: payments.id })
      .get().id;
    if (opts.refund) {
      db.insert(refunds)
        .values({ paymentId, providerRefundId: `re_demo_${String(n).padStart(4, "0")}`, eventId: `evt_demo_re_${n}`, amountCents: opts.refund, reason: "Customer supplied their own decals; lettering taken off", requestedBy: ctx.userIds.owner, at: paidAt + 5 * DAY })
        .run();
    }
    if (!flagged && q.email) {
      db.insert(jobMessages)
        .values({ jobId: job.id, quoteVersionId: q.versionId, kind: "deposit_receipt", to: q.email, subject: `Deposit received: ${job.title}`, status: "sent", attachments: [], sentBy: null, at: paidAt + 60_000 })
        .run();
    }
  }

  // Inquiries: the estimator is pricing two of them (drafts). The demo customer's inquiry is left for the tour.
  byStage("inquiry")
    .filter((j) => j.customerId !== ctx.customerIds[0])
    .slice(0, 2)
    .forEach((job) => addQuote(job, [{ status: "draft", createdAt: Math.min(ctx.now - 2 * HOUR, job.createdAt + DAY), validUntil: dateOnly(ctx.now + s.quoteValidDays * DAY) }]));

  // Quoted: sent and waiting on the customer. Quotes sent too long ago to still be valid were revised lately.
  byStage("quoted").forEach((job, i) => {
    const sentAt = eventAt(job.id, "quoted") ?? ctx.now - 5 * DAY;
    const created = sentAt - 3 * HOUR;
    const fresh = sentAt > ctx.now - (s.quoteValidDays - 5) * DAY;
    if (i === 2) {
      // Past its valid-until date without an answer: reads as expired.
      const old = ctx.now - (s.quoteValidDays + 4) * DAY;
      addQuote(job, [{ status: "sent", createdAt: old - 2 * HOUR, sentAt: old }]);
    } else if (i === 3) {
      // Approved, but the card payment came in short: flagged for the owner to check.
      const q = addQuote(job, [{ status: "approved", createdAt: created, sentAt, decidedAt: Math.min(ctx.now - 2 * DAY, sentAt + DAY) }]);
      addPayment(job, q, Math.min(ctx.now - 2 * DAY, sentAt + DAY) + HOUR, { amount: Math.round(q.deposit / 2) });
    } else if (i === 1 || !fresh) {
      // Revised: version 1 sent, then version 2 with less labour sent lately.
      const base = linesFor(job.id).lines;
      const trimmed = base.map((l) => (l.kind === "labour" && l.hours ? { ...l, hours: Math.max(0.5, l.hours - 0.75) } : l));
      const v2At = Math.max(sentAt + DAY, ctx.now - (2 + i) * DAY);
      addQuote(job, [
        { status: "viewed", createdAt: created, sentAt, viewedAt: sentAt + 6 * HOUR, lines: base, supersededAt: v2At },
        { status: i % 2 === 0 ? "viewed" : "sent", createdAt: v2At - HOUR, sentAt: v2At, viewedAt: i % 2 === 0 ? v2At + 5 * HOUR : undefined, lines: trimmed },
      ]);
    } else {
      addQuote(job, [{ status: i % 2 === 0 ? "viewed" : "sent", createdAt: created, sentAt, viewedAt: i % 2 === 0 ? sentAt + 5 * HOUR : undefined }]);
    }
  });

  // Booked and later: approved quotes, deposit paid online, receipt sent.
  const later: Stage[] = ["booked", "in_prep", "in_booth", "curing", "finishing", "ready", "delivered"];
  let refunded = false;
  for (const job of ctx.jobs.filter((j) => later.includes(j.stage))) {
    const bookedAt = eventAt(job.id, "booked") ?? job.createdAt + 5 * DAY;
    const sentAt = eventAt(job.id, "quoted") ?? bookedAt - 4 * DAY;
    const decidedAt = Math.max(sentAt + 2 * HOUR, bookedAt - 6 * HOUR);
    const q = addQuote(job, [{ status: "approved", createdAt: sentAt - 3 * HOUR, sentAt, decidedAt }]);
    const refund = !refunded && job.stage === "delivered" ? 5000 : undefined;
    if (refund) refunded = true;
    addPayment(job, q, bookedAt - 5 * 60_000, { refund });
    if ((job.stage === "ready" || job.stage === "delivered") && q.email) {
      const readyAt = eventAt(job.id, "ready") ?? ctx.now - DAY;
      db.insert(jobMessages)
        .values({ jobId: job.id, kind: "ready_notice", to: q.email, subject: `Ready to collect: ${job.title}`, status: "sent", attachments: [], sentBy: null, at: readyAt + 60_000 })
        .run();
    }
  }

  // Cancelled: the customer declined.
  byStage("cancelled").forEach((job, i) => {
    const sentAt = eventAt(job.id, "quoted") ?? job.createdAt + 2 * DAY;
    const reasons = ["Going with a vinyl wrap instead", "Over budget for this season", "Selling the bike"];
    addQuote(job, [{ status: "declined", createdAt: sentAt - 3 * HOUR, sentAt, decidedAt: (eventAt(job.id, "cancelled") ?? sentAt + 3 * DAY) - HOUR, declineReason: reasons[i % reasons.length] }]);
  });
}
