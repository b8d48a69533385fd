import { and, asc, desc, eq, inArray, or, type SQL } from "drizzle-orm";
import type Stripe from "stripe";
import type { AppDeps } from "../../deps";
import type { Tx } from "../../db/client";
import { checkoutSessions, customers, jobs, payments, quoteVersions, refunds, users, webhookEvents } from "../../db/schema";
import { badRequest, conflict, notFound } from "../../http/http-error";
import type { RequestContext } from "../../http/context";
import { iso, isoOrNull } from "../../http/dates";
import { recordStageMove } from "../jobs/stage-move";
import { recordAudit } from "../audit/audit.service";
import { getSettings } from "../settings/settings.service";
import { sendAndLog } from "../messages/messages.service";
import { composeReceiptMail } from "../messages/compose";
import { paidCentsFor, totalsOf } from "../quotes/quote-versions";
import { formatCents } from "../../../shared/quote/index";
import type { PaymentDto, PaymentStatus } from "../../../shared/schemas/payment.schema";
import { markCheckout } from "./checkout.service";
import { changeDue } from "../change-orders/change-order-rows";
import { onTimeline } from "../change-orders/change-order-rows";
import { awaitsReview, awaitsReviewFlag, needsReview } from "./payment-review";
import { requirePayments, upstream } from "./provider-calls";

/*
 * Deposits through the card-payment provider's hosted checkout.
 *
 * The product never records a payment because a browser came back to a "success" page: a payment (and a
 * refund) is written only when the provider's webhook says so, after its signature is checked against the
 * webhook secret (constructEvent on the exact request bytes). Each event id is applied once (webhook_events),
 * and a checkout session / payment intent can carry one payment only (unique indexes), so a redelivered or
 * duplicated event changes nothing. A payment beyond what is still due on the quote's deposit (the deposit paid
 * twice) is recorded, since the money was taken, but flagged for the owner, who refunds or accepts it. A refund event that arrives before its payment is answered 409, so the
 * provider delivers it again later (out-of-order delivery).
 */

type WebhookOutcome = { received: true; duplicate?: true; outcome: string; paymentId?: number; receipt?: boolean };

/** Verifies and applies one provider webhook delivery. */
export async function handleWebhook(deps: AppDeps, raw: Buffer | undefined, signature: string | undefined): Promise<WebhookOutcome> {
  const pay = requirePayments(deps);
  if (!raw || !signature) throw badRequest("A signed webhook body is required");
  let event: Stripe.Event;
  try {
    event = pay.stripe.webhooks.constructEvent(raw, signature, pay.webhookSecret);
  } catch {
    throw badRequest("The webhook signature does not match; nothing was recorded");
  }
  const now = deps.now();
  let receiptFor: number | null = null;
  const result = deps.db.transaction((tx): WebhookOutcome => {
    if (tx.select({ id: webhookEvents.id }).from(webhookEvents).where(eq(webhookEvents.id, event.id)).get()) {
      return { received: true, duplicate: true, outcome: "already applied" };
    }
    let outcome = "ignored";
    let paymentId: number | undefined;
    switch (event.type) {
      case "checkout.session.completed":
      case "checkout.session.async_payment_succeeded": {
        const r = recordPayment(tx, deps, event.id, event.data.object as Stripe.Checkout.Session, now);
        outcome = r.outcome;
        paymentId = r.paymentId;
        if (r.receipt) receiptFor = r.paymentId ?? null;
        break;
      }
      case "checkout.session.expired": {
        const session = event.data.object as Stripe.Checkout.Session;
        markCheckout(tx, session.id, "expired", now);
        outcome = "checkout expired";
        break;
      }
      case "refund.created":
      case "refund.updated": {
        outcome = recordRefund(tx, event.id, event.data.object as Stripe.Refund, now);
        break;
      }
      case "charge.refunded": {
        const charge = event.data.object as Stripe.Charge;
        const list = (charge.refunds?.data ?? []) as Stripe.Refund[];
        const outcomes = list.map((r) => recordRefund(tx, event.id, { ...r, payment_intent: r.payment_intent ?? charge.payment_intent }, now));
        outcome = outcomes.join("; ") || "no refunds listed";
        break;
      }
    }
    tx.insert(webhookEvents).values({ id: event.id, type: event.type, outcome, receivedAt: now }).run();
    return { received: true, outcome, ...(paymentId ? { paymentId } : {}) };
  });
  if (receiptFor) {
    // In the background: the provider wants a quick answer, and a mail problem must not undo the payment.
    sendDepositReceipt(deps, receiptFor).catch(() => undefined);
  }
  return { ...result, ...(receiptFor ? { receipt: true } : {}) };
}


function recordPayment(tx: Tx, deps: AppDeps, eventId: string, session: Stripe.Checkout.Session, now: number): { outcome: string; paymentId?: number; receipt?: boolean } {
  if (session.payment_status !== "paid") return { outcome: "checkout not paid yet" };
  const ours = tx.select().from(checkoutSessions).where(eq(checkoutSessions.id, session.id)).get();
  if (!ours) return { outcome: "unknown checkout session (not started here)" };
  const intent = typeof session.payment_intent === "string" ? session.payment_intent : (session.payment_intent?.id ?? `none:${session.id}`);
  const existing = tx
    .select({ id: payments.id })
    .from(payments)
    .where(or(eq(payments.sessionId, session.id), eq(payments.paymentIntentId, intent)))
    .get();
  if (existing) return { outcome: "payment already recorded", paymentId: existing.id };

  const version = tx.select().from(quoteVersions).where(eq(quoteVersions.id, ours.quoteVersionId)).get()!;
  const expected = ours.amountCents;
  const amount = session.amount_total ?? 0;
  const currency = (session.currency ?? "").toLowerCase();
  // What is still due now, from the payments already counted (this transaction sees every one before it).
  const change = ours.changeOrderId != null ? changeDue(tx, ours.changeOrderId) : null;
  const deposit = change ? change.depositCents : totalsOf(version).depositCents;
  const due = Math.max(0, deposit - (change ? change.paidCents : paidCentsFor(tx, ours.quoteId)));
  const reasons: string[] = [];
  if (amount > due)
    reasons.push(
      due === 0
        ? `the deposit of ${formatCents(deposit)} was already paid, so this ${formatCents(amount)} is more than is due (paid twice?)`
        : `paid ${formatCents(amount)} but only ${formatCents(due)} of the deposit was still due`,
    );
  else if (amount !== expected) reasons.push(`paid ${formatCents(amount)} but the deposit asked was ${formatCents(expected)}`);
  if (currency !== ours.currency) reasons.push(`paid in ${currency.toUpperCase() || "an unknown currency"}, expected ${ours.currency.toUpperCase()}`);
  if (change) {
    if (change.status !== "approved") reasons.push(`change order #${ours.changeOrderId} was ${change.status}, not approved, when the payment arrived`);
  } else if (version.status !== "approved") reasons.push(`the quote version was ${version.status}, not approved, when the payment arrived`);
  const flagged = reasons.length > 0;
  tx.update(checkoutSessions).set({ status: "complete", closedAt: now }).where(eq(checkoutSessions.id, session.id)).run();
  const paymentId = tx
    .insert(payments)
    .values({
      jobId: ours.jobId,
      quoteId: ours.quoteId,
      quoteVersionId: ours.quoteVersionId,
      changeOrderId: ours.changeOrderId,
      sessionId: session.id,
      paymentIntentId: intent,
      eventId,
      amountCents: amount,
      expectedCents: expected,
      currency: currency || ours.currency,
      flagged,
      flagReason: flagged ? reasons.join("; ") : null,
      paidAt: now,
      createdAt: now,
    })
    .returning({ id: payments.id })
    .get().id;
  recordAudit(
    tx,
    null,
    {
      kind: "money",
      entity: "payment",
      entityId: paymentId,
      action: flagged ? "received_flagged" : "received",
      after: { quoteId: ours.quoteId, version: version.version, changeOrderId: ours.changeOrderId, amountCents: amount, expectedCents: expected, currency, sessionId: session.id, paymentIntentId: intent, eventId, flagReason: flagged ? reasons.join("; ") : null },
    },
    now,
  );
  if (change) {
    if (!flagged) onTimeline(tx, ours.jobId, `Extra deposit of ${formatCents(amount)} for change order #${ours.changeOrderId} paid online`, ours.createdBy, now, "payment");
    return { outcome: flagged ? "change order payment recorded and flagged for the owner" : "change order payment recorded" , paymentId };
  }
  if (!flagged) bookJob(tx, ours.jobId, ours.createdBy, now, `Deposit of ${formatCents(amount)} paid online`);
  return { outcome: flagged ? "payment recorded and flagged for the owner" : "payment recorded; job booked", paymentId, receipt: !flagged };
}

/** A paid deposit books the job (when it is still at inquiry or quoted), as a move by the customer/system. */
function bookJob(tx: Tx, jobId: number, by: string | null, now: number, note: string) {
  const job = tx.select({ stage: jobs.stage, customerId: jobs.customerId }).from(jobs).where(eq(jobs.id, jobId)).get();
  if (!job || (job.stage !== "inquiry" && job.stage !== "quoted")) return;
  // Attribute the move to the customer's own account when they have one (the payer), else to nobody (the system).
  const customerUser =
    by ??
    tx
      .select({ id: users.id })
      .from(users)
      .where(and(eq(users.customerId, job.customerId), eq(users.role, "customer"), eq(users.active, true)))
      .orderBy(asc(users.createdAt))
      .get()?.id ??
    null;
  recordStageMove(tx, { jobId, from: job.stage, to: "booked", userId: customerUser, via: "payment", note, at: now });
}

function recordRefund(tx: Tx, eventId: string, refund: Pick<Stripe.Refund, "id" | "amount" | "status" | "metadata"> & { payment_intent: Stripe.Refund["payment_intent"] }, now: number): string {
  if (refund.status !== "succeeded") return `refund ${refund.id} is ${refund.status}`;
  if (tx.select({ id: refunds.id }).from(refunds).where(eq(refunds.providerRefundId, refund.id)).get()) return `refund ${refund.id} already recorded`;
  const intent = typeof refund.payment_intent === "string" ? refund.payment_intent : refund.payment_intent?.id;
  const payment = intent ? tx.select().from(payments).where(eq(payments.paymentIntentId, intent)).get() : undefined;
  // Not ours, or its payment has not arrived yet: a 409 makes the provider deliver this event again later.
  if (!payment) throw conflict(`No payment recorded yet for refund ${refund.id}; deliver again later`);
  const requestedBy = refund.metadata?.requestedBy;
  const requester = requestedBy ? tx.select({ id: users.id }).from(users).where(eq(users.id, requestedBy)).get()?.id ?? null : null;
  tx.insert(refunds)
    .values({ paymentId: payment.id, providerRefundId: refund.id, eventId, amountCents: refund.amount, reason: refund.metadata?.reason || null, requestedBy: requester, at: now })
    .run();
  const refunded = Math.min(payment.amountCents, payment.refundedCents + refund.amount);
  tx.update(payments).set({ refundedCents: refunded }).where(eq(payments.id, payment.id)).run();
  recordAudit(
    tx,
    null,
    { kind: "money", entity: "payment", entityId: payment.id, action: "refunded", before: { refundedCents: payment.refundedCents }, after: { refundedCents: refunded, refundId: refund.id, amountCents: refund.amount, requestedBy: requester } },
    now,
  );
  return `refund ${refund.id} recorded`;
}

/** E-mails the customer a receipt for a deposit and logs it on the job. */
export async function sendDepositReceipt(deps: AppDeps, paymentId: number) {
  const row = deps.db
    .select({ p: payments, jobTitle: jobs.title, customerName: customers.name, email: customers.email, version: quoteVersions })
    .from(payments)
    .innerJoin(jobs, eq(payments.jobId, jobs.id))
    .innerJoin(customers, eq(jobs.customerId, customers.id))
    .innerJoin(quoteVersions, eq(payments.quoteVersionId, quoteVersions.id))
    .where(eq(payments.id, paymentId))
    .get();
  if (!row?.email) return null;
  const t = totalsOf(row.version);
  const mail = composeReceiptMail({
    shop: getSettings(deps),
    customerName: row.customerName,
    jobTitle: row.jobTitle,
    jobId: row.p.jobId,
    quoteId: row.p.quoteId,
    version: row.version.version,
    amountCents: row.p.amountCents,
    balanceCents: t.totalCents - paidCentsFor(deps.db, row.p.quoteId),
    paidAt: row.p.paidAt,
    reference: row.p.paymentIntentId,
  });
  return sendAndLog(deps, { jobId: row.p.jobId, quoteVersionId: row.version.id, kind: "deposit_receipt", sentBy: null }, { to: row.email, ...mail });
}

function statusOf(p: { amountCents: number; refundedCents: number }): PaymentStatus {
  if (p.refundedCents <= 0) return "paid";
  return p.refundedCents >= p.amountCents ? "refunded" : "partially_refunded";
}

/** Payments, those waiting for the owner first; `flagged: "1"` lists only those. */
export function listPayments(deps: AppDeps, q: { jobId?: number; quoteId?: number; flagged?: "1" | "0" }): { items: PaymentDto[] } {
  const where: (SQL | undefined)[] = [
    q.jobId ? eq(payments.jobId, q.jobId) : undefined,
    q.quoteId ? eq(payments.quoteId, q.quoteId) : undefined,
    q.flagged === "1" ? awaitsReview() : undefined,
  ];
  const rows = deps.db
    .select({ p: payments, jobTitle: jobs.title, customerName: customers.name, version: quoteVersions.version })
    .from(payments)
    .innerJoin(jobs, eq(payments.jobId, jobs.id))
    .innerJoin(customers, eq(jobs.customerId, customers.id))
    .innerJoin(quoteVersions, eq(payments.quoteVersionId, quoteVersions.id))
    .where(and(...where))
    // Payments waiting for the owner first, then newest first.
    .orderBy(desc(awaitsReviewFlag()), desc(payments.paidAt), desc(payments.id))
    .limit(200)
    .all();
  const ids = rows.map((r) => r.p.id);
  const allRefunds = ids.length ? deps.db.select().from(refunds).where(inArray(refunds.paymentId, ids)).orderBy(asc(refunds.at)).all() : [];
  return {
    items: rows.map(({ p, jobTitle, customerName, version }) => ({
      id: p.id,
      jobId: p.jobId,
      jobTitle,
      customerName,
      quoteId: p.quoteId,
      version,
      amountCents: p.amountCents,
      expectedCents: p.expectedCents,
      currency: p.currency,
      status: statusOf(p),
      refundedCents: p.refundedCents,
      flagged: p.flagged,
      flagReason: p.flagReason,
      needsReview: needsReview(p),
      reviewedAt: isoOrNull(p.reviewedAt),
      paidAt: iso(p.paidAt),
      providerPaymentId: p.paymentIntentId,
      refunds: allRefunds.filter((r) => r.paymentId === p.id).map((r) => ({ id: r.id, amountCents: r.amountCents, reason: r.reason, at: iso(r.at), providerId: r.providerRefundId })),
    })),
  };
}

function findPayment(deps: AppDeps, id: number) {
  const payment = deps.db.select().from(payments).where(eq(payments.id, id)).get();
  if (!payment) throw notFound("Payment");
  return payment;
}

/**
 * Asks the provider to refund all or part of a payment. The refund is recorded when the provider's webhook
 * confirms it, like the payment itself; this answers 202 with what was requested.
 */
export async function requestRefund(deps: AppDeps, ctx: RequestContext, id: number, input: { amountCents?: number; reason?: string | null }) {
  const pay = requirePayments(deps);
  const p = findPayment(deps, id);
  const left = p.amountCents - p.refundedCents;
  if (left <= 0) throw conflict("This payment is already refunded in full", { amountCents: "Nothing left to refund" });
  const amount = input.amountCents ?? left;
  if (amount > left) throw badRequest(`At most ${formatCents(left)} is left to refund`, { amountCents: `At most ${formatCents(left)}` });
  let refund: Stripe.Refund;
  try {
    refund = await pay.stripe.refunds.create({
      payment_intent: p.paymentIntentId,
      amount,
      reason: "requested_by_customer",
      metadata: { paymentId: String(p.id), requestedBy: ctx.actor.id, reason: input.reason ?? "" },
    });
  } catch (err) {
    upstream(deps.log, err, "make the refund");
  }
  deps.db.transaction((tx) =>
    recordAudit(tx, ctx, { kind: "money", entity: "payment", entityId: p.id, action: "refund_requested", after: { amountCents: amount, refundId: refund.id, reason: input.reason ?? null } }, deps.now()),
  );
  return { status: "requested" as const, providerRefundId: refund.id, amountCents: amount, message: `Refund of ${formatCents(amount)} requested; it shows here once the provider confirms it.` };
}

/** The owner accepts a flagged payment after checking it: the flag is cleared and the job is booked. */
export function acceptPayment(deps: AppDeps, ctx: RequestContext, id: number, note: string | null | undefined) {
  const p = findPayment(deps, id);
  if (!p.flagged) throw conflict("This payment was not flagged; there is nothing to accept");
  if (p.reviewedAt) throw conflict("This payment was already accepted");
  const now = deps.now();
  deps.db.transaction((tx) => {
    tx.update(payments).set({ reviewedAt: now, reviewedBy: ctx.actor.id }).where(eq(payments.id, id)).run();
    recordAudit(tx, ctx, { kind: "money", entity: "payment", entityId: id, action: "accepted", before: { flagReason: p.flagReason }, after: { reviewedBy: ctx.actor.name, note: note ?? null } }, now);
    bookJob(tx, p.jobId, ctx.actor.id, now, `Deposit of ${formatCents(p.amountCents)} accepted by ${ctx.actor.name}`);
  });
  return listPayments(deps, { quoteId: p.quoteId }).items.find((x) => x.id === id)!;
}
