import { randomBytes } from "node:crypto";

/** Card numbers the stand-in's checkout page knows: one pays, one is declined. */
export const TEST_CARDS = { pays: "4242424242424242", declined: "4000000000000002" } as const;

export type Session = {
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

export type PaymentIntent = {
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

export type Refund = {
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

export const NORMAL_MODE: DeliveryMode = { copies: 1, hold: false, reverse: false, paidAmountOverride: null, apiLatencyMs: 0 };

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

/** A provider-style id: `cs_test_…`, `pi_test_…`. */
export const rid = (prefix: string) => `${prefix}_test_${randomBytes(12).toString("hex")}`;
export const nowSec = () => Math.floor(Date.now() / 1000);

export function money(cents: number, currency: string) {
  const s = (cents / 100).toFixed(2).replace(/\B(?=(\d{3})+(?!\d))/g, ",");
  return currency.toLowerCase() === "usd" ? `$${s}` : `${s} ${currency.toUpperCase()}`;
}
