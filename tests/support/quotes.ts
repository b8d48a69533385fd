import request from "supertest";
import type { Server } from "node:http";
import type { AddressInfo } from "node:net";
import { createPayments } from "../../server/payments/provider";
import { startPaymentsStandIn, type PaymentsStandIn, type StandInEvent } from "../../server/stand-ins/payments";
import type { Shop } from "./test-app";
import type { QuoteDetailDto, QuoteLineInput } from "../../shared/schemas/quote.schema";

/** One payments stand-in per test file, started on first use; it never keeps the process alive. */
let standIn: Promise<PaymentsStandIn> | undefined;
export function testPaymentsStandIn() {
  return (standIn ??= startPaymentsStandIn({ unref: true, retryDelaysMs: [50, 100, 200, 400] }));
}

/** Points a shop's app at the payments stand-in (the deps object is read per request). */
export async function withPayments(shop: Shop) {
  const si = await testPaymentsStandIn();
  shop.app.deps.payments = createPayments(si.sdkConfig);
  return si;
}

/** Demo-like lines: 10 h at $95, $200 of materials at 30 % markup, 8 % supplies. */
export const SAMPLE_LINES: QuoteLineInput[] = [
  { kind: "labour", description: "Prep and paint", hours: 10, rateCents: 9500 },
  { kind: "materials", description: "Candy red and clear", costCents: 20000, markupPercent: 30 },
  { kind: "supplies", description: "Shop supplies", basis: "percent", percent: 8 },
];

/** A draft quote on a job with sample lines and known tax/deposit (7.25 % on materials and supplies, 40 % deposit). */
export async function draftQuote(shop: Shop, jobId = shop.jobA.id, lines = SAMPLE_LINES): Promise<QuoteDetailDto> {
  const created = await shop.as("estimator").post("/api/quotes").send({ jobId });
  if (created.status !== 201) throw new Error(`create quote: ${created.status} ${JSON.stringify(created.body)}`);
  const patched = await shop
    .as("estimator")
    .patch(`/api/quotes/${created.body.id}`)
    .send({ lines, taxPercent: 7.25, taxedKinds: ["materials", "supplies"], depositPercent: 40, editVersion: created.body.editVersion });
  if (patched.status !== 200) throw new Error(`patch quote: ${patched.status} ${JSON.stringify(patched.body)}`);
  return patched.body;
}

export async function sentQuote(shop: Shop, jobId = shop.jobA.id, lines = SAMPLE_LINES): Promise<QuoteDetailDto> {
  const q = await draftQuote(shop, jobId, lines);
  const sent = await shop.as("estimator").post(`/api/quotes/${q.id}/send`).send({});
  if (sent.status !== 200) throw new Error(`send quote: ${sent.status} ${JSON.stringify(sent.body)}`);
  return sent.body;
}

export async function approvedQuote(shop: Shop, jobId = shop.jobA.id, lines = SAMPLE_LINES): Promise<QuoteDetailDto> {
  const q = await sentQuote(shop, jobId, lines);
  const ok = await shop.as("customer").post(`/api/portal/quotes/${q.id}/approve`).send({ name: "Avery Stone" });
  if (ok.status !== 200) throw new Error(`approve quote: ${ok.status} ${JSON.stringify(ok.body)}`);
  return q;
}

/** Posts a provider event to the app's webhook, signed with the stand-in's secret (or a wrong one). */
export function postEvent(shop: Shop, si: PaymentsStandIn, event: StandInEvent | object, opts: { secretOverride?: string; raw?: string } = {}) {
  const payload = opts.raw ?? JSON.stringify(event);
  const header = opts.secretOverride
    ? createPayments({ secretKey: "x", webhookSecret: opts.secretOverride }).stripe.webhooks.generateTestHeaderString({ payload, secret: opts.secretOverride })
    : si.control.sign(payload);
  return request(shop.app).post("/api/payments/webhook").set("Content-Type", "application/json").set("Stripe-Signature", header).send(payload);
}

/**
 * The customer pays the deposit of an approved quote on the stand-in with the test card, and the
 * checkout.session.completed event is handed to the app's webhook (the supertest app does not listen on a port).
 */
export async function payDeposit(shop: Shop, si: PaymentsStandIn, quoteId: number) {
  const checkout = await shop.as("customer").post("/api/payments/checkout").send({ quoteId });
  if (checkout.status !== 201) throw new Error(`checkout: ${checkout.status} ${JSON.stringify(checkout.body)}`);
  const paid = si.control.pay(checkout.body.sessionId, "4242 4242 4242 4242");
  if (paid.result !== "paid") throw new Error(`pay: ${JSON.stringify(paid)}`);
  const event = completedEvent(si, checkout.body.sessionId)!;
  const res = await postEvent(shop, si, event);
  return { checkout: checkout.body as { url: string; sessionId: string }, event, webhook: res };
}

export function completedEvent(si: PaymentsStandIn, sessionId: string) {
  return si.control.events().find((e) => e.type === "checkout.session.completed" && (e.data.object as { id: string }).id === sessionId);
}

/** Lets the shop's app listen on a port and points the stand-in's webhook deliveries at it; returns the server. */
export async function listenForWebhooks(shop: Shop, si: PaymentsStandIn): Promise<Server> {
  const server = shop.app.listen(0, "127.0.0.1");
  await new Promise((r) => server.once("listening", r));
  si.setWebhookUrl(`http://127.0.0.1:${(server.address() as AddressInfo).port}/api/payments/webhook`);
  return server;
}

/** Submits the card on a stand-in checkout page, as its form does (the customer's browser). */
export function submitCard(checkoutUrl: string, card = "4242 4242 4242 4242") {
  const url = new URL(checkoutUrl);
  return fetch(url, {
    method: "POST",
    headers: { "content-type": "application/x-www-form-urlencoded" },
    body: new URLSearchParams({ card, expiry: "12 / 34", cvc: "123", holder: "Avery Stone" }),
    redirect: "manual",
  });
}
