import { and, eq, isNull } from "drizzle-orm";
import type Stripe from "stripe";
import type { AppDeps } from "../../deps";
import type { Tx } from "../../db/client";
import { checkoutSessions, customers, payments } from "../../db/schema";
import { conflict } from "../../http/http-error";
import { getPortalQuote } from "../portal/portal.service";
import type { PortalViewer } from "../portal/portal-viewer";
import { portalLinkPath } from "../portal/portal-link";
import { offeredVersion } from "../quotes/quote-versions";
import type { CheckoutDto } from "../../../shared/schemas/payment.schema";
import { createKeyedQueue } from "./one-at-a-time";
import { providerStatus, requirePayments, upstream } from "./provider-calls";

/*
 * One open checkout per quote. Opening a checkout first expires every earlier open one of the quote at the provider,
 * so a customer who opened checkout twice (two tabs, a link and an account, a double click) can pay only the newest.
 * Checkouts of one quote are opened one at a time (a queue per quote in this process), so two requests at the same
 * moment cannot both find nothing open. A payment that still gets through twice (e.g. two server processes) is
 * recorded and flagged for the owner as more than is due (payments.service).
 */


const queues = new WeakMap<AppDeps, ReturnType<typeof createKeyedQueue<number>>>();
/** The queue of checkouts being opened: a quote's by its id, a change order's by minus its id. */
export function queueOf(deps: AppDeps) {
  let q = queues.get(deps);
  if (!q) queues.set(deps, (q = createKeyedQueue<number>()));
  return q;
}

/** Starts a hosted checkout for the deposit of an approved quote and returns where to send the customer. */
export function createCheckout(deps: AppDeps, viewer: PortalViewer, quoteId: number): Promise<CheckoutDto> {
  requirePayments(deps);
  // Refused at once when the viewer may not see the quote (404), without waiting behind anyone.
  getPortalQuote(deps, viewer, quoteId);
  return queueOf(deps)(quoteId, () => openCheckout(deps, viewer, quoteId));
}

function payableQuote(deps: AppDeps, viewer: PortalViewer, quoteId: number) {
  const quote = getPortalQuote(deps, viewer, quoteId);
  if (quote.status !== "approved") throw conflict("Approve the quote before paying the deposit", { status: quote.status });
  if (quote.paymentUnderReview) throw conflict("A payment for this quote is being checked by the shop; they will be in touch", { status: "under_review" });
  if (quote.paidCents >= quote.depositCents) throw conflict("The deposit for this quote is already paid. Thank you!", { status: "paid" });
  if (!quote.canPay) throw conflict("This quote cannot be paid online; please contact the shop");
  return quote;
}

async function openCheckout(deps: AppDeps, viewer: PortalViewer, quoteId: number): Promise<CheckoutDto> {
  const pay = requirePayments(deps);
  payableQuote(deps, viewer, quoteId);
  await closeOpenCheckouts(deps, quoteId);
  // Read again: a payment may have been recorded while the earlier checkouts were being closed.
  const quote = payableQuote(deps, viewer, quoteId);
  const v = offeredVersion(deps.db, quoteId)!;
  const amount = quote.depositCents - quote.paidCents;
  const back = viewer.via === "link" ? `${deps.publicUrl}${portalLinkPath(viewer.token)}` : `${deps.publicUrl}/portal/quotes/${quoteId}`;
  const email = deps.db.select({ email: customers.email }).from(customers).where(eq(customers.id, viewer.customerId)).get()?.email;
  let session: Stripe.Checkout.Session;
  try {
    session = await pay.stripe.checkout.sessions.create({
      mode: "payment",
      line_items: [
        {
          quantity: 1,
          price_data: {
            currency: pay.currency,
            unit_amount: amount,
            product_data: { name: `Deposit: ${quote.jobTitle}`, description: `${quote.shop.name} · quote #${quoteId}, version ${v.version} · ${quote.depositPercent} % deposit` },
          },
        },
      ],
      client_reference_id: `quote-${quoteId}-v${v.version}`,
      ...(email ? { customer_email: email } : {}),
      metadata: { quoteId: String(quoteId), quoteVersionId: String(v.id), jobId: String(quote.jobId) },
      success_url: `${back}?paid=1`,
      cancel_url: `${back}?cancelled=1`,
    });
  } catch (err) {
    upstream(deps.log, err, "start the checkout");
  }
  if (!session.url) upstream(deps.log, new Error("no checkout address was returned"), "start the checkout");
  deps.db
    .insert(checkoutSessions)
    .values({
      id: session.id,
      quoteId,
      quoteVersionId: v.id,
      jobId: quote.jobId,
      amountCents: amount,
      currency: pay.currency,
      url: session.url,
      createdBy: viewer.userId,
      via: viewer.via,
      status: "open",
      createdAt: deps.now(),
    })
    .run();
  return { url: session.url, sessionId: session.id };
}

/**
 * Expires every checkout of the quote (or of one of its change orders) that is still open here, at the provider. One the provider will not expire
 * because it was paid meanwhile ends this request with 409 until its payment is recorded; one that ended by itself
 * (expired at the provider) is simply marked so. Nothing new is opened while an earlier one may still be paid.
 */
export async function closeOpenCheckouts(deps: AppDeps, quoteId: number, changeOrderId: number | null = null) {
  const pay = requirePayments(deps);
  const forWhat = changeOrderId == null ? isNull(checkoutSessions.changeOrderId) : eq(checkoutSessions.changeOrderId, changeOrderId);
  const open = deps.db
    .select({ id: checkoutSessions.id })
    .from(checkoutSessions)
    .where(and(eq(checkoutSessions.quoteId, quoteId), forWhat, eq(checkoutSessions.status, "open")))
    .all();
  for (const { id } of open) {
    let state: "expired" | "complete";
    try {
      await pay.stripe.checkout.sessions.expire(id);
      state = "expired";
    } catch (err) {
      const status = providerStatus(err);
      if (status === undefined || status >= 500) upstream(deps.log, err, "end the earlier checkout for this deposit");
      state = await stateAtProvider(deps, id);
    }
    markCheckout(deps.db, id, state, deps.now());
    if (state === "complete" && !deps.db.select({ id: payments.id }).from(payments).where(eq(payments.sessionId, id)).get())
      throw conflict("A payment for this deposit has just gone through. It shows here as soon as the card provider confirms it; there is no need to pay again.", {
        status: "processing",
      });
  }
}

/** Why the provider would not expire a checkout: it was paid (complete) or had ended already (expired, or unknown there). */
async function stateAtProvider(deps: AppDeps, id: string): Promise<"expired" | "complete"> {
  try {
    const s = await requirePayments(deps).stripe.checkout.sessions.retrieve(id);
    if (s.status === "complete") return "complete";
    if (s.status === "expired") return "expired";
    return upstream(deps.log, new Error(`the earlier checkout ${id} is still ${s.status} and could not be expired`), "end the earlier checkout for this deposit");
  } catch (err) {
    if (providerStatus(err) === 404) return "expired";
    throw err;
  }
}

/** Records that a checkout ended (paid, or expired); a checkout already closed stays as it is. */
export function markCheckout(db: Tx, id: string, state: "expired" | "complete", now: number) {
  db.update(checkoutSessions)
    .set({ status: state, closedAt: now })
    .where(and(eq(checkoutSessions.id, id), eq(checkoutSessions.status, "open")))
    .run();
}
