import { and, desc, eq, isNull, ne } from "drizzle-orm";
import type Stripe from "stripe";
import type { AppDeps } from "../../deps";
import { changeOrders, checkoutSessions, customers, jobs, mixSheets, payments } from "../../db/schema";
import { conflict, notFound } from "../../http/http-error";
import { recordAudit } from "../audit/audit.service";
import { getSettings } from "../settings/settings.service";
import type { PortalViewer } from "../portal/portal-viewer";
import { awaitsReview } from "../payments/payment-review";
import { closeOpenCheckouts, queueOf } from "../payments/checkout.service";
import { requirePayments, upstream } from "../payments/provider-calls";
import { portalLinkPath } from "../portal/portal-link";
import { approvedQuoteOf, onTimeline, type ChangeOrderRow } from "./change-order-rows";
import { toChangeOrderDto } from "./change-orders.service";
import { formatCents } from "../../../shared/quote/index";
import type { ChangeOrderDto } from "../../../shared/schemas/change-order.schema";
import type { CheckoutDto } from "../../../shared/schemas/payment.schema";

/*
 * The customer's side of change orders (under /api/portal): their own, once sent (a draft is the shop's), and with a
 * quote link only those of the link's job. Approving or declining records the time, how, the name and the address,
 * as for a quote; an approved change with an extra deposit is paid through the same hosted checkout and webhook.
 */

function portalRow(deps: AppDeps, viewer: PortalViewer, id: number): ChangeOrderRow {
  const row = deps.db
    .select({ c: changeOrders })
    .from(changeOrders)
    .innerJoin(jobs, eq(changeOrders.jobId, jobs.id))
    .where(and(eq(changeOrders.id, id), eq(jobs.customerId, viewer.customerId), ne(changeOrders.status, "draft"), viewer.via === "link" ? eq(jobs.id, viewer.jobId) : undefined))
    .get();
  if (!row) throw notFound("Change order");
  return row.c;
}

function underReview(deps: AppDeps, id: number) {
  return !!deps.db.select({ id: payments.id }).from(payments).where(and(eq(payments.changeOrderId, id), awaitsReview())).get();
}

function portalDto(deps: AppDeps, c: ChangeOrderRow): ChangeOrderDto {
  const dto = toChangeOrderDto(deps, c, { money: true, forShop: false });
  const m = dto.money!;
  dto.canPay = c.status === "approved" && m.depositCents >= 50 && m.paidCents < m.depositCents && !underReview(deps, c.id) && deps.payments !== null;
  return dto;
}

export function getPortalChangeOrder(deps: AppDeps, viewer: PortalViewer, id: number): ChangeOrderDto {
  return portalDto(deps, portalRow(deps, viewer, id));
}

export function listPortalChangeOrders(deps: AppDeps, viewer: PortalViewer, jobId: number): { items: ChangeOrderDto[] } {
  if (viewer.via === "link" && viewer.jobId !== jobId) throw notFound("Job");
  const job = deps.db.select({ id: jobs.id }).from(jobs).where(and(eq(jobs.id, jobId), eq(jobs.customerId, viewer.customerId))).get();
  if (!job) throw notFound("Job");
  const rows = deps.db.select().from(changeOrders).where(and(eq(changeOrders.jobId, jobId), ne(changeOrders.status, "draft"))).orderBy(desc(changeOrders.id)).all();
  return { items: rows.map((c) => portalDto(deps, c)) };
}

/**
 * The customer approves or declines a change order that is waiting for them. Approved: the booth and new mix sheets
 * move to the new plan version, mix sheets of earlier versions are marked superseded, and a colour change asks for a
 * new approved panel (the job's agreed panel is cleared). Declined: the job stays on the version it was on.
 */
export function decideChangeOrder(
  deps: AppDeps,
  viewer: PortalViewer,
  id: number,
  decision: "approved" | "declined",
  input: { name?: string; note?: string | null; reason?: string | null },
  address: string | null,
): ChangeOrderDto {
  const c = portalRow(deps, viewer, id);
  if (c.status !== "sent") throw conflict(`You already ${c.status} this change order`, { status: c.status });
  const now = deps.now();
  const name = input.name ?? viewer.name;
  const note = decision === "approved" ? (input.note ?? null) : (input.reason ?? null);
  const actorId = viewer.via === "account" ? viewer.userId : null;
  deps.db.transaction((tx) => {
    const done = tx
      .update(changeOrders)
      .set({ status: decision, decidedAt: now, decidedVia: viewer.via, decidedBy: actorId, decidedAddress: address, decisionName: name, decisionNote: note, updatedAt: now, version: c.version + 1, updatedBy: actorId })
      .where(and(eq(changeOrders.id, id), eq(changeOrders.status, "sent")))
      .run();
    if (done.changes !== 1) throw conflict("This change order was answered a moment ago; reload to see it", { status: "answered" });
    const ctx = viewer.via === "account" ? { actor: { id: viewer.userId, name: viewer.name, email: "", role: "customer" as const, customerId: viewer.customerId }, address } : null;
    const job = tx.select({ approvedPanelId: jobs.approvedPanelId }).from(jobs).where(eq(jobs.id, c.jobId)).get()!;
    let superseded = 0;
    let panelCleared = false;
    if (decision === "approved") {
      if (c.toVersionId != null) {
        superseded = tx
          .update(mixSheets)
          .set({ supersededAt: now })
          .where(and(eq(mixSheets.jobId, c.jobId), ne(mixSheets.planVersionId, c.toVersionId), isNull(mixSheets.supersededAt)))
          .run().changes;
      }
      if (c.colourChanged && job.approvedPanelId != null) {
        tx.update(jobs).set({ approvedPanelId: null, updatedAt: now }).where(eq(jobs.id, c.jobId)).run();
        panelCleared = true;
      }
    }
    recordAudit(
      tx,
      ctx,
      {
        kind: "money",
        entity: "change_order",
        entityId: id,
        action: decision,
        before: { status: c.status },
        after: { status: decision, via: viewer.via, name, note, address, totalCents: c.totalCents, depositCents: c.depositCents, supersededMixSheets: superseded, ...(panelCleared ? { clearedApprovedPanelId: job.approvedPanelId } : {}) },
      },
      now,
    );
    const words =
      decision === "approved"
        ? `Change order #${id} approved by ${name}${c.toVersionId != null ? "; the booth now works from the new plan version" : ""}${panelCleared ? "; the colour changed, so a new test panel needs the customer's approval" : ""}`
        : `Change order #${id} declined by ${name}; the job stays as approved before`;
    onTimeline(tx, c.jobId, words, actorId, now, actorId ? "user" : "system");
  });
  return getPortalChangeOrder(deps, viewer, id);
}

/** Starts the hosted checkout for an approved change order's extra deposit; the webhook records the payment. */
export function createChangeOrderCheckout(deps: AppDeps, viewer: PortalViewer, id: number): Promise<CheckoutDto> {
  requirePayments(deps);
  portalRow(deps, viewer, id);
  return queueOf(deps)(-id, () => openCheckout(deps, viewer, id));
}

function payable(deps: AppDeps, viewer: PortalViewer, id: number) {
  const dto = getPortalChangeOrder(deps, viewer, id);
  const m = dto.money!;
  if (dto.status !== "approved") throw conflict("Approve the change order before paying its deposit", { status: dto.status });
  if (m.paidCents >= m.depositCents) throw conflict(m.depositCents === 0 ? "This change needs no extra deposit" : "The extra deposit is already paid. Thank you!", { status: "paid" });
  if (!dto.canPay) throw conflict("This change order cannot be paid online; please contact the shop");
  return dto;
}

async function openCheckout(deps: AppDeps, viewer: PortalViewer, id: number): Promise<CheckoutDto> {
  const pay = requirePayments(deps);
  const c = portalRow(deps, viewer, id);
  payable(deps, viewer, id);
  await closeOpenCheckouts(deps, c.quoteId, id);
  const dto = payable(deps, viewer, id);
  const amount = dto.money!.depositCents - dto.money!.paidCents;
  const back = viewer.via === "link" ? `${deps.publicUrl}${portalLinkPath(viewer.token)}?change=${id}&` : `${deps.publicUrl}/portal/change-orders/${id}?`;
  const email = deps.db.select({ email: customers.email }).from(customers).where(eq(customers.id, viewer.customerId)).get()?.email;
  const shop = getSettings(deps);
  let session: Stripe.Checkout.Session;
  try {
    session = await pay.stripe.checkout.sessions.create({
      mode: "payment",
      line_items: [{ quantity: 1, price_data: { currency: pay.currency, unit_amount: amount, product_data: { name: `Extra deposit: ${dto.jobTitle}`, description: `${shop.shopName} · change order #${id} · ${formatCents(dto.money!.totalCents)} added` } } }],
      client_reference_id: `change-${id}`,
      ...(email ? { customer_email: email } : {}),
      metadata: { quoteId: String(c.quoteId), changeOrderId: String(id), jobId: String(c.jobId) },
      success_url: `${back}paid=1`,
      cancel_url: `${back}cancelled=1`,
    });
  } catch (err) {
    upstream(deps.log, err, "start the checkout");
  }
  if (!session.url) upstream(deps.log, new Error("no checkout address was returned"), "start the checkout");
  const approved = approvedQuoteOf(deps.db, c.jobId);
  deps.db
    .insert(checkoutSessions)
    .values({ id: session.id, quoteId: c.quoteId, quoteVersionId: approved!.id, changeOrderId: id, jobId: c.jobId, amountCents: amount, currency: pay.currency, url: session.url, createdBy: viewer.userId, via: viewer.via, status: "open", createdAt: deps.now() })
    .run();
  return { url: session.url, sessionId: session.id };
}
