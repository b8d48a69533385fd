import express from "express";
import { randomBytes } from "node:crypto";
import type { Server } from "node:http";
import type { AddressInfo } from "node:net";
import Stripe from "stripe";

/**
 * A local stand-in for the card-payment provider, for development, the demo and the tests. It speaks the small
 * part of the provider's HTTP API the product uses, through the provider's own SDK pointed at it:
 *
 *   POST /v1/checkout/sessions        create a hosted checkout (mode "payment", one price_data line)
 *   GET  /v1/checkout/sessions/:id    read it back
 *   POST /v1/checkout/sessions/:id/expire   end an open checkout: it can no longer be paid
 *   GET  /v1/payment_intents/:id      the payment behind a completed checkout
 *   POST /v1/refunds                  refund all or part of a payment intent
 *
 * It serves its own simple checkout page (GET /pay/:id) where the test card 4242 4242 4242 4242 pays and
 * 4000 0000 0000 0002 is declined, and it sends signed webhook events (checkout.session.completed,
 * payment_intent.succeeded, checkout.session.expired, charge.refunded, refund.created …) to the product's webhook address, signed with
 * the webhook secret exactly as the provider signs them. Deliveries that get no 2xx are retried a few times.
 *
 * For tests (and a curious developer) it can misbehave on purpose: deliver every event twice, hold events and
 * deliver them in reverse order, or report a paid amount different from the session's. See `control` and the
 * /_control endpoints (which need the secret key, as the API does).
 */

export const TEST_CARDS = { pays: "4242424242424242", declined: "4000000000000002" } as const;

type Session = {
  id: string;
  object: "checkout.session";
  amount_total: number;
  amount_subtotal: number;
  currency: string;
  status: "open" | "complete" | "expired";
  payment_status: "unpaid" | "paid";
  payment_intent: string | null;
  url: string;
  success_url: string;
  cancel_url: string | null;
  metadata: Record<string, string>;
  client_reference_id: string | null;
  customer_email: string | null;
  mode: "payment";
  livemode: false;
  created: number;
  expires_at: number;
  line_items_summary: { name: string; description: string | null; amount: number; quantity: number }[];
};

type PaymentIntent = {
  id: string;
  object: "payment_intent";
  amount: number;
  amount_received: number;
  currency: string;
  status: "succeeded";
  latest_charge: string;
  metadata: Record<string, string>;
  created: number;
  livemode: false;
};

type Refund = {
  id: string;
  object: "refund";
  amount: number;
  currency: string;
  payment_intent: string;
  charge: string;
  status: "succeeded";
  reason: string | null;
  metadata: Record<string, string>;
  created: number;
};

export type StandInEvent = { id: string; object: "event"; type: string; created: number; api_version: string; livemode: false; pending_webhooks: number; request: { id: null; idempotency_key: null }; data: { object: unknown } };

export type DeliveryRecord = { eventId: string; type: string; attempt: number; status: number | "error"; at: string };

export type DeliveryMode = {
  /** Send every event this many times (1 = normal). */
  copies: number;
  /** Keep events until `flush()` instead of sending them at once. */
  hold: boolean;
  /** When flushing held events, send them newest first. */
  reverse: boolean;
  /** Report this amount as paid instead of the session's amount (to test mismatch handling). */
  paidAmountOverride: number | null;
  /** Answer every API call this many ms late, as a distant provider does (so two calls at once really overlap). */
  apiLatencyMs: number;
};

export type PaymentsStandInOptions = {
  port?: number;
  host?: string;
  /** The product's webhook address; can be set later with setWebhookUrl (the product's port may not be known yet). */
  webhookUrl?: string | null;
  webhookSecret?: string;
  apiKey?: string;
  /** Retry schedule for deliveries that fail, in ms. */
  retryDelaysMs?: number[];
  /** Do not keep the process alive just for this server (tests). */
  unref?: boolean;
};

const EXPIRED_MESSAGE = "This checkout has expired: a newer one was opened for the same payment. No money was taken. Go back and pay from there.";

const rid = (prefix: string) => `${prefix}_test_${randomBytes(12).toString("hex")}`;
const nowSec = () => Math.floor(Date.now() / 1000);

function escapeHtml(s: string) {
  return s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);
}

function money(cents: number, currency: string) {
  const s = (cents / 100).toFixed(2).replace(/\B(?=(\d{3})+(?!\d))/g, ",");
  return currency.toLowerCase() === "usd" ? `$${s}` : `${s} ${currency.toUpperCase()}`;
}

function apiError(res: express.Response, status: number, message: string, type = "invalid_request_error", extra: Record<string, unknown> = {}) {
  res.status(status).json({ error: { type, message, ...extra } });
}

export async function startPaymentsStandIn(options: PaymentsStandInOptions = {}) {
  const host = options.host ?? "127.0.0.1";
  const apiKey = options.apiKey ?? `sk_test_standin_${randomBytes(12).toString("hex")}`;
  const webhookSecret = options.webhookSecret ?? `whsec_standin_${randomBytes(18).toString("hex")}`;
  const retryDelays = options.retryDelaysMs ?? [300, 1000, 3000, 8000];
  let webhookUrl = options.webhookUrl ?? null;
  const signer = new Stripe(apiKey);

  const sessions = new Map<string, Session>();
  const intents = new Map<string, PaymentIntent>();
  const refundsByIntent = new Map<string, Refund[]>();
  const deliveries: DeliveryRecord[] = [];
  const held: StandInEvent[] = [];
  const pending = new Set<Promise<void>>();
  /** Every event made, by id, so it can be replayed. */
  const deliveredEvents = new Map<string, StandInEvent>();
  const mode: DeliveryMode = { copies: 1, hold: false, reverse: false, paidAmountOverride: null, apiLatencyMs: 0 };
  let baseUrl = "";

  function makeEvent(type: string, object: unknown): StandInEvent {
    const event: StandInEvent = {
      id: rid("evt"),
      object: "event",
      type,
      created: nowSec(),
      api_version: "2026-10-28.endive",
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      data: { object: JSON.parse(JSON.stringify(object)) },
    };
    deliveredEvents.set(event.id, event);
    return event;
  }

  async function deliverOnce(event: StandInEvent, attempt: number): Promise<boolean> {
    if (!webhookUrl) return true;
    const payload = JSON.stringify(event);
    const header = signer.webhooks.generateTestHeaderString({ payload, secret: webhookSecret });
    let status: number | "error";
    try {
      const res = await fetch(webhookUrl, { method: "POST", headers: { "content-type": "application/json", "stripe-signature": header }, body: payload });
      status = res.status;
      await res.arrayBuffer().catch(() => undefined);
    } catch {
      status = "error";
    }
    deliveries.push({ eventId: event.id, type: event.type, attempt, status, at: new Date().toISOString() });
    return typeof status === "number" && status >= 200 && status < 300;
  }

  /**
   * Sends one event; a delivery that gets no 2xx is retried later in the background. Every copy is the same
   * event (same id, same body), as a provider's redelivery is. Resolves when the first attempt of each copy is done.
   */
  function deliver(event: StandInEvent): Promise<void> {
    let firstDone!: () => void;
    const first = new Promise<void>((r) => (firstDone = r));
    const job = (async () => {
      for (let copy = 0; copy < Math.max(1, mode.copies); copy++) {
        let ok = await deliverOnce(event, 1);
        if (copy === Math.max(1, mode.copies) - 1) firstDone();
        for (let attempt = 2; !ok; attempt++) {
          const wait = retryDelays[attempt - 2];
          if (wait === undefined) break;
          await new Promise((r) => setTimeout(r, wait).unref?.());
          ok = await deliverOnce(event, attempt);
        }
      }
    })();
    pending.add(job);
    void job.finally(() => {
      pending.delete(job);
      firstDone();
    });
    return first;
  }

  function emit(type: string, object: unknown) {
    const event = makeEvent(type, object);
    if (mode.hold) held.push(event);
    else void deliver(event);
    return event;
  }

  /** Sends held events (newest first when `reverse`), one after the other; failed ones are retried in the background. */
  async function flush() {
    const events = held.splice(0, held.length);
    if (mode.reverse) events.reverse();
    for (const e of events) await deliver(e);
  }

  /** Waits until every delivery in flight (with its retries) is done. */
  async function settle() {
    while (pending.size) await Promise.allSettled([...pending]);
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
    emit("payment_intent.succeeded", intent);
    emit("checkout.session.completed", session);
  }

  /** Ends an open checkout, as the provider's expire call does; anything but an open one is refused. */
  function expire(sessionId: string): { ok: true; session: Session } | { ok: false; status: number; message: string } {
    const session = sessions.get(sessionId);
    if (!session) return { ok: false, status: 404, message: `No such checkout.session: '${sessionId}'` };
    if (session.status !== "open") return { ok: false, status: 400, message: `Only Checkout Sessions with a status of open can be expired. This one is ${session.status}.` };
    session.status = "expired";
    session.expires_at = nowSec();
    emit("checkout.session.expired", session);
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
      emit("payment_intent.payment_failed", { id: rid("pi"), object: "payment_intent", amount: session.amount_total, currency: session.currency, status: "requires_payment_method", metadata: session.metadata, last_payment_error: { code: "card_declined", message: "Your card was declined." } });
      return { result: "declined", message: "Your card was declined. No money was taken. Try another card." };
    }
    if (digits !== TEST_CARDS.pays)
      return { result: "invalid", message: "This is a test checkout: use the test card 4242 4242 4242 4242 (pays) or 4000 0000 0000 0002 (declined)." };
    complete(session);
    return { result: "paid" };
  }

  const app = express();
  app.disable("x-powered-by");

  // ---- provider API (what the SDK calls) ----
  const v1 = express.Router();
  v1.use(express.urlencoded({ extended: true }));
  v1.use((req, res, next) => {
    if (req.headers.authorization !== `Bearer ${apiKey}`) return apiError(res, 401, "Invalid API key provided.");
    if (mode.apiLatencyMs > 0) setTimeout(next, mode.apiLatencyMs);
    else next();
  });
  v1.post("/checkout/sessions", (req, res) => {
    // The SDK's own parameter shape; form-encoded, so every leaf arrives as a string and is converted below.
    const b = req.body as Stripe.Checkout.SessionCreateParams;
    const item = Array.isArray(b.line_items) ? b.line_items[0] : undefined;
    const amount = Number(item?.price_data?.unit_amount);
    const quantity = Number(item?.quantity ?? 1);
    if (b.mode !== "payment") return apiError(res, 400, "This stand-in only supports mode=payment.", "invalid_request_error", { param: "mode" });
    if (!Number.isInteger(amount) || amount < 50) return apiError(res, 400, "Amount must be at least 50 cents.", "invalid_request_error", { param: "line_items[0][price_data][unit_amount]" });
    if (!b.success_url) return apiError(res, 400, "Missing required param: success_url.", "invalid_request_error", { param: "success_url" });
    const id = rid("cs");
    const total = amount * (Number.isInteger(quantity) && quantity > 0 ? quantity : 1);
    const session: Session = {
      id,
      object: "checkout.session",
      amount_total: total,
      amount_subtotal: total,
      currency: String(item?.price_data?.currency ?? "usd").toLowerCase(),
      status: "open",
      payment_status: "unpaid",
      payment_intent: null,
      url: `${baseUrl}/pay/${id}`,
      success_url: String(b.success_url),
      cancel_url: b.cancel_url ? String(b.cancel_url) : null,
      metadata: (b.metadata ?? {}) as Record<string, string>,
      client_reference_id: b.client_reference_id ?? null,
      customer_email: b.customer_email ?? null,
      mode: "payment",
      livemode: false,
      created: nowSec(),
      expires_at: nowSec() + 24 * 3600,
      line_items_summary: [
        {
          name: String(item?.price_data?.product_data?.name ?? "Payment"),
          description: item?.price_data?.product_data?.description ? String(item.price_data.product_data.description) : null,
          amount,
          quantity,
        },
      ],
    };
    sessions.set(id, session);
    res.json(session);
  });
  v1.get("/checkout/sessions/:id", (req, res) => {
    const s = sessions.get(req.params.id);
    if (!s) return apiError(res, 404, `No such checkout.session: '${req.params.id}'`, "invalid_request_error", { code: "resource_missing" });
    res.json(s);
  });
  v1.post("/checkout/sessions/:id/expire", (req, res) => {
    const outcome = expire(req.params.id);
    if (!outcome.ok) return apiError(res, outcome.status, outcome.message, "invalid_request_error", outcome.status === 404 ? { code: "resource_missing" } : {});
    res.json(outcome.session);
  });
  v1.get("/payment_intents/:id", (req, res) => {
    const pi = intents.get(req.params.id);
    if (!pi) return apiError(res, 404, `No such payment_intent: '${req.params.id}'`, "invalid_request_error", { code: "resource_missing" });
    res.json(pi);
  });
  v1.post("/refunds", (req, res) => {
    const b = req.body as Stripe.RefundCreateParams;
    const pi = intents.get(String(b.payment_intent ?? ""));
    if (!pi) return apiError(res, 400, `No such payment_intent: '${b.payment_intent ?? ""}'`, "invalid_request_error", { param: "payment_intent" });
    const done = (refundsByIntent.get(pi.id) ?? []).reduce((s, r) => s + r.amount, 0);
    const left = pi.amount_received - done;
    const amount = b.amount === undefined ? left : Number(b.amount);
    if (!Number.isInteger(amount) || amount <= 0) return apiError(res, 400, "Refund amount must be a positive whole number of cents.", "invalid_request_error", { param: "amount" });
    if (amount > left)
      return apiError(res, 400, `Refund amount (${money(amount, pi.currency)}) is greater than unrefunded amount on charge (${money(left, pi.currency)})`, "invalid_request_error", { param: "amount" });
    const refund: Refund = {
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
    refundsByIntent.set(pi.id, [...(refundsByIntent.get(pi.id) ?? []), refund]);
    const all = refundsByIntent.get(pi.id)!;
    emit("refund.created", refund);
    emit("charge.refunded", {
      id: pi.latest_charge,
      object: "charge",
      amount: pi.amount_received,
      amount_refunded: all.reduce((s, r) => s + r.amount, 0),
      currency: pi.currency,
      payment_intent: pi.id,
      refunded: all.reduce((s, r) => s + r.amount, 0) >= pi.amount_received,
      refunds: { object: "list", data: all, has_more: false },
    });
    res.json(refund);
  });
  v1.use((req, res) => apiError(res, 404, `Unrecognized request URL (${req.method}: ${req.originalUrl}). This stand-in implements only the calls the product uses.`));
  app.use("/v1", v1);

  // ---- hosted checkout page (what the customer's browser sees) ----
  const page = (session: Session, message?: { tone: "error" | "info"; text: string }) => {
    const line = session.line_items_summary[0]!;
    return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Pay ${escapeHtml(money(session.amount_total, session.currency))} · Test checkout</title>
<style>
  :root { color-scheme: light; font-family: system-ui, -apple-system, "Segoe UI", sans-serif; }
  body { margin: 0; background: #eef1f4; color: #17202a; }
  .bar { background: #1f2a37; color: #fff; padding: 12px 16px; font-size: 14px; }
  .bar strong { color: #ffd27a; }
  main { max-width: 440px; margin: 24px auto; padding: 0 16px; }
  .card { background: #fff; border-radius: 14px; box-shadow: 0 1px 3px rgba(0,0,0,.12); padding: 20px; }
  h1 { font-size: 20px; margin: 0 0 4px; }
  .amount { font-size: 32px; font-weight: 700; margin: 8px 0 4px; font-variant-numeric: tabular-nums; }
  .muted { color: #4b5866; font-size: 14px; margin: 0; }
  label { display: block; font-weight: 600; font-size: 14px; margin: 16px 0 6px; }
  input { box-sizing: border-box; width: 100%; min-height: 48px; font-size: 18px; padding: 8px 12px; border: 1px solid #8a96a3; border-radius: 10px; }
  .row { display: flex; gap: 12px; } .row > div { flex: 1; }
  button { width: 100%; min-height: 52px; margin-top: 20px; border: 0; border-radius: 10px; background: #0b6e4f; color: #fff; font-size: 18px; font-weight: 700; cursor: pointer; }
  .msg { margin-top: 16px; padding: 12px; border-radius: 10px; font-size: 15px; }
  .msg.error { background: #fdecec; border-left: 4px solid #b42318; }
  .msg.info { background: #eef4ff; border-left: 4px solid #2f5aa8; }
  .cards { font-size: 13px; color: #4b5866; margin-top: 16px; line-height: 1.5; }
  a { color: #1f4f99; }
</style></head>
<body>
<div class="bar" role="note"><strong>Test mode.</strong> Local payment stand-in: no real card is charged.</div>
<main>
  <div class="card">
    <h1>${escapeHtml(line.name)}</h1>
    ${line.description ? `<p class="muted">${escapeHtml(line.description)}</p>` : ""}
    <p class="amount">${escapeHtml(money(session.amount_total, session.currency))}</p>
    ${message ? `<div class="msg ${message.tone}" role="${message.tone === "error" ? "alert" : "status"}">${escapeHtml(message.text)}</div>` : ""}
    ${session.status === "open" ? `
    <form method="post" action="/pay/${escapeHtml(session.id)}" autocomplete="off">
      <label for="card">Card number</label>
      <input id="card" name="card" inputmode="numeric" placeholder="1234 1234 1234 1234" required>
      <div class="row">
        <div><label for="expiry">Expiry (MM / YY)</label><input id="expiry" name="expiry" placeholder="12 / 34" required></div>
        <div><label for="cvc">Security code</label><input id="cvc" name="cvc" inputmode="numeric" placeholder="123" required></div>
      </div>
      <label for="holder">Name on card</label>
      <input id="holder" name="holder" autocomplete="off">
      <button type="submit">Pay ${escapeHtml(money(session.amount_total, session.currency))}</button>
    </form>
    ` : ""}
    ${session.cancel_url ? `<p class="muted" style="margin-top:14px"><a href="${escapeHtml(session.cancel_url)}">Cancel and go back</a></p>` : ""}
    <p class="cards">Test cards: 4242 4242 4242 4242 pays; 4000 0000 0000 0002 is declined. Any future expiry and any 3 digits.</p>
  </div>
</main>
</body></html>`;
  };

  app.get("/favicon.ico", (_req, res) => {
    res.status(204).end();
  });
  app.get("/pay/:id", (req, res) => {
    const s = sessions.get(req.params.id);
    if (!s) return res.status(404).type("text/plain").send("This checkout does not exist.");
    if (s.status === "expired") return res.status(410).type("html").send(page(s, { tone: "error", text: EXPIRED_MESSAGE }));
    if (s.status !== "open") return res.redirect(303, s.success_url.replace("{CHECKOUT_SESSION_ID}", s.id));
    res.type("html").send(page(s));
  });
  app.post("/pay/:id", express.urlencoded({ extended: false }), (req, res) => {
    const s = sessions.get(req.params.id);
    if (!s) return res.status(404).type("text/plain").send("This checkout does not exist.");
    const outcome = pay(s.id, String(req.body?.card ?? ""));
    if (outcome.result === "paid") return res.redirect(303, s.success_url.replace("{CHECKOUT_SESSION_ID}", s.id));
    if (outcome.result === "expired") return res.status(410).type("html").send(page(s, { tone: "error", text: EXPIRED_MESSAGE }));
    // Shown on the same page, as a hosted checkout does (a normal 200 page; the outcome is in the words).
    res.status(200).type("html").send(page(s, { tone: "error", text: outcome.message ?? "Payment failed." }));
  });

  // ---- test controls ----
  const control = {
    setMode(patch: Partial<DeliveryMode>) {
      Object.assign(mode, patch);
      return { ...mode };
    },
    reset() {
      Object.assign(mode, { copies: 1, hold: false, reverse: false, paidAmountOverride: null, apiLatencyMs: 0 });
      held.length = 0;
      deliveries.length = 0;
    },
    pay,
    expire,
    flush,
    settle,
    deliveries: () => [...deliveries],
    /** Every event made so far (delivered or not), oldest first. */
    events: () => [...deliveredEvents.values()],
    /** Signs a payload as a delivery would be signed (for tests that post events themselves). */
    sign: (payload: string) => signer.webhooks.generateTestHeaderString({ payload, secret: webhookSecret }),
    held: () => [...held],
    session: (id: string) => sessions.get(id),
    /** Re-sends an event already sent (same id, same body), as a provider does when it retries. */
    async replay(eventId: string) {
      const original = deliveredEvents.get(eventId);
      if (!original) return false;
      await deliver(original);
      await settle();
      return true;
    },
  };
  // The controls change what the stand-in reports as paid and re-send events, so they need the stand-in's own
  // secret key (as its API does), like any other caller of a payment provider.
  const ctl = express.Router();
  ctl.use((req, res, next) => {
    if (req.headers.authorization !== `Bearer ${apiKey}`) return apiError(res, 401, "The stand-in's controls need its secret key: Authorization: Bearer <secret key>.");
    next();
  });
  ctl.use(express.json());
  ctl.post("/mode", (req, res) => {
    const b = req.body ?? {};
    res.json(
      control.setMode({
        ...(Number.isInteger(b.copies) && b.copies >= 1 && b.copies <= 5 ? { copies: b.copies } : {}),
        ...(typeof b.hold === "boolean" ? { hold: b.hold } : {}),
        ...(typeof b.reverse === "boolean" ? { reverse: b.reverse } : {}),
        ...(b.paidAmountOverride === null || Number.isInteger(b.paidAmountOverride) ? { paidAmountOverride: b.paidAmountOverride ?? null } : {}),
      }),
    );
  });
  ctl.post("/reset", (_req, res) => {
    control.reset();
    res.json({ ok: true });
  });
  ctl.post("/flush", async (_req, res) => {
    await flush();
    res.json({ delivered: deliveries.length });
  });
  ctl.post("/replay/:eventId", async (req, res) => {
    res.status((await control.replay(req.params.eventId)) ? 200 : 404).json({ ok: true });
  });
  ctl.get("/deliveries", (_req, res) => {
    res.json({ items: deliveries });
  });
  app.use("/_control", ctl);

  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(options.port ?? 0, host, () => resolve(s));
    s.once("error", reject);
  });
  if (options.unref) server.unref();
  const port = (server.address() as AddressInfo).port;
  baseUrl = `http://${host === "0.0.0.0" ? "127.0.0.1" : host}:${port}`;

  return {
    port,
    host,
    url: baseUrl,
    apiKey,
    webhookSecret,
    setWebhookUrl(url: string | null) {
      webhookUrl = url;
    },
    control,
    /** SDK settings that point at this stand-in. */
    sdkConfig: { secretKey: apiKey, webhookSecret, host, port, protocol: "http" as const },
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections?.();
        server.close(() => resolve());
      }),
  };
}

export type PaymentsStandIn = Awaited<ReturnType<typeof startPaymentsStandIn>>;
