import express from "express";
import type Stripe from "stripe";
import type { Refusal, PaymentsState } from "./state";
import type { DeliveryMode } from "./types";

export function apiError(res: express.Response, status: number, message: string, extra: Record<string, unknown> = {}) {
  res.status(status).json({ error: { type: "invalid_request_error", message, ...extra } });
}

const refuse = (res: express.Response, r: Refusal) => apiError(res, r.status, r.message, { ...(r.param ? { param: r.param } : {}), ...(r.code ? { code: r.code } : {}) });

/** Checks the secret key, as the provider's API does. */
export const requireKey = (apiKey: string, message: string): express.RequestHandler => (req, res, next) => {
  if (req.headers.authorization !== `Bearer ${apiKey}`) return apiError(res, 401, message);
  next();
};

/**
 * The small part of the provider's HTTP API the product calls through the provider's SDK:
 *
 *   POST /v1/checkout/sessions               create a hosted checkout (mode "payment", one price_data line)
 *   GET  /v1/checkout/sessions/:id           read it back
 *   POST /v1/checkout/sessions/:id/expire    end an open checkout: it can no longer be paid
 *   GET  /v1/payment_intents/:id             the payment behind a completed checkout
 *   POST /v1/refunds                         refund all or part of a payment intent
 */
export function providerApi(state: PaymentsState, apiKey: string, mode: DeliveryMode) {
  const v1 = express.Router();
  v1.use(express.urlencoded({ extended: true }));
  v1.use(requireKey(apiKey, "Invalid API key provided."));
  v1.use((_req, _res, next) => {
    if (mode.apiLatencyMs > 0) setTimeout(next, mode.apiLatencyMs);
    else next();
  });
  v1.post("/checkout/sessions", (req, res) => {
    const made = state.createSession(req.body as Stripe.Checkout.SessionCreateParams);
    if (!made.ok) return refuse(res, made);
    res.json(made.session);
  });
  v1.get("/checkout/sessions/:id", (req, res) => {
    const s = state.session(req.params.id);
    if (!s) return apiError(res, 404, `No such checkout.session: '${req.params.id}'`, { code: "resource_missing" });
    res.json(s);
  });
  v1.post("/checkout/sessions/:id/expire", (req, res) => {
    const outcome = state.expire(req.params.id);
    if (!outcome.ok) return refuse(res, outcome);
    res.json(outcome.session);
  });
  v1.get("/payment_intents/:id", (req, res) => {
    const pi = state.intent(req.params.id);
    if (!pi) return apiError(res, 404, `No such payment_intent: '${req.params.id}'`, { code: "resource_missing" });
    res.json(pi);
  });
  v1.post("/refunds", (req, res) => {
    const made = state.refund(req.body as Stripe.RefundCreateParams);
    if (!made.ok) return refuse(res, made);
    res.json(made.refund);
  });
  v1.use((req, res) => apiError(res, 404, `Unrecognized request URL (${req.method}: ${req.originalUrl}). This stand-in implements only the calls the product uses.`));
  return v1;
}
