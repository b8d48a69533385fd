import type Stripe from "stripe";
import { money, nowSec, rid, TEST_CARDS, type DeliveryMode, type PaymentIntent, type Refund, type Session } from "./types";
import type { WebhookSender } from "./webhooks";

export const EXPIRED_MESSAGE = "This checkout has expired: a newer one was opened for the same payment. No money was taken. Go back and pay from there.";

/** A refusal in the provider's own words, with the parameter it is about. */
export type Refusal = { ok: false; status: number; message: string; param?: string; code?: string };

/**
 * What the provider knows: checkouts, the payments behind them and their refunds, and the moves between them.
 * Every move emits the events the provider would send.
 */
export function createPaymentsState(opts: { mode: DeliveryMode; webhooks: WebhookSender; baseUrl: () => string }) {
  const { mode, webhooks } = opts;
  const sessions = new Map<string, Session>();
  const intents = new Map<string, PaymentIntent>();
  const refundsByIntent = new Map<string, Refund[]>();

  /** Opens a hosted checkout from the SDK's parameters (form-encoded: every leaf arrives as a string). */
  function createSession(b: Stripe.Checkout.SessionCreateParams): { ok: true; session: Session } | Refusal {
    const item = Array.isArray(b.line_items) ? b.line_items[0] : undefined;
    const amount = Number(item?.price_data?.unit_amount);
    const quantity = Number(item?.quantity ?? 1);
    if (b.mode !== "payment") return { ok: false, status: 400, message: "This stand-in only supports mode=payment.", param: "mode" };
    if (!Number.isInteger(amount) || amount < 50) return { ok: false, status: 400, message: "Amount must be at least 50 cents.", param: "line_items[0][price_data][unit_amount]" };
    if (!b.success_url) return { ok: false, status: 400, message: "Missing required param: success_url.", param: "success_url" };
    const id = rid("cs");
    const total = amount * (Number.isInteger(quantity) && quantity > 0 ? quantity : 1);
    const product = item?.price_data?.product_data;
    const session: Session = {
      id,
      object: "checkout.session",
      amount_total: total,
      amount_subtotal: total,
      currency: String(item?.price_data?.currency ?? "usd").toLowerCase(),
      status: "open",
      payment_status: "unpaid",
      payment_intent: null,
      url: `${opts.baseUrl()}/pay/${id}`,
      success_url: String(b.success_url),
      cancel_url: b.cancel_url ? String(b.cancel_url) : null,
      metadata: (b.metadata ?? {}) as Record<string, string>,
      client_reference_id: b.client_reference_id ?? null,
      customer_email: b.customer_email ?? null,
      mode: "payment",
      livemode: false,
      created: nowSec(),
      expires_at: nowSec() + 24 * 3600,
      line_items_summary: [{ name: String(product?.name ?? "Payment"), description: product?.description ? String(product.description) : null, amount, quantity }],
    };
    sessions.set(id, session);
    return { ok: true, session };
  }

  function complete(session: Session) {
    const amount = mode.paidAmountOverride ?? session.amount_total;
    const intent: PaymentIntent = {
      id: rid("pi"),
      object: "payment_intent",
      amount,
      amount_received: amount,
      currency: session.currency,
      status: "succeeded",
      latest_charge: rid("ch"),
      metadata: session.metadata,
      created: nowSec(),
      livemode: false,
    };
    intents.set(intent.id, intent);
    session.status = "complete";
    session.payment_status = "paid";
    session.payment_intent = intent.id;
    session.amount_total = amount;
    webhooks.emit("payment_intent.succeeded", intent);
    webhooks.emit("checkout.session.completed", session);
  }

  /** Ends an open checkout, as the provider's expire call does; anything but an open one is refused. */
  function expire(sessionId: string): { ok: true; session: Session } | Refusal {
    const session = sessions.get(sessionId);
    if (!session) return { ok: false, status: 404, message: `No such checkout.session: '${sessionId}'`, code: "resource_missing" };
    if (session.status !== "open") return { ok: false, status: 400, message: `Only Checkout Sessions with a status of open can be expired. This one is ${session.status}.` };
    session.status = "expired";
    session.expires_at = nowSec();
    webhooks.emit("checkout.session.expired", session);
    return { ok: true, session };
  }

  /** What the checkout page does with a card number: "paid", "declined" or a message for other input. */
  function pay(sessionId: string, cardNumber: string): { result: "paid" | "declined" | "invalid" | "expired"; message?: string } {
    const session = sessions.get(sessionId);
    if (!session) return { result: "invalid", message: "This checkout does not exist." };
    if (session.status === "expired") return { result: "expired", message: EXPIRED_MESSAGE };
    if (session.status !== "open") return { result: "invalid", message: "This checkout is already finished." };
    const digits = cardNumber.replace(/[\s-]/g, "");
    if (digits === TEST_CARDS.declined) {
      webhooks.emit("payment_intent.payment_failed", { id: rid("pi"), object: "payment_intent", amount: session.amount_total, currency: session.currency, status: "requires_payment_method", metadata: session.metadata, last_payment_error: { code: "card_declined", message: "Your card was declined." } });
      return { result: "declined", message: "Your card was declined. No money was taken. Try another card." };
    }
    if (digits !== TEST_CARDS.pays) return { result: "invalid", message: "This is a test checkout: use the test card 4242 4242 4242 4242 (pays) or 4000 0000 0000 0002 (declined)." };
    complete(session);
    return { result: "paid" };
  }

  /** Refunds all that is left of a payment, or part of it; never more than is left. */
  function refund(b: Stripe.RefundCreateParams): { ok: true; refund: Refund } | Refusal {
    const pi = intents.get(String(b.payment_intent ?? ""));
    if (!pi) return { ok: false, status: 400, message: `No such payment_intent: '${b.payment_intent ?? ""}'`, param: "payment_intent" };
    const done = (refundsByIntent.get(pi.id) ?? []).reduce((s, r) => s + r.amount, 0);
    const left = pi.amount_received - done;
    const amount = b.amount === undefined ? left : Number(b.amount);
    if (!Number.isInteger(amount) || amount <= 0) return { ok: false, status: 400, message: "Refund amount must be a positive whole number of cents.", param: "amount" };
    if (amount > left) return { ok: false, status: 400, message: `Refund amount (${money(amount, pi.currency)}) is greater than unrefunded amount on charge (${money(left, pi.currency)})`, param: "amount" };
    const made: Refund = {
      id: rid("re"),
      object: "refund",
      amount,
      currency: pi.currency,
      payment_intent: pi.id,
      charge: pi.latest_charge,
      status: "succeeded",
      reason: b.reason ?? null,
      metadata: (b.metadata ?? {}) as Record<string, string>,
      created: nowSec(),
    };
    const all = [...(refundsByIntent.get(pi.id) ?? []), made];
    refundsByIntent.set(pi.id, all);
    const refunded = all.reduce((s, r) => s + r.amount, 0);
    webhooks.emit("refund.created", made);
    webhooks.emit("charge.refunded", {
      id: pi.latest_charge,
      object: "charge",
      amount: pi.amount_received,
      amount_refunded: refunded,
      currency: pi.currency,
      payment_intent: pi.id,
      refunded: refunded >= pi.amount_received,
      refunds: { object: "list", data: all, has_more: false },
    });
    return { ok: true, refund: made };
  }

  return { session: (id: string) => sessions.get(id), intent: (id: string) => intents.get(id), createSession, expire, pay, refund };
}

export type PaymentsState = ReturnType<typeof createPaymentsState>;
