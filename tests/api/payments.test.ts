import { afterEach, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import type { Server } from "node:http";
import { auditLog, jobMessages, jobStageEvents, jobs, payments, refunds, users, webhookEvents } from "../../server/db/schema";
import request from "supertest";
import { createPayments } from "../../server/payments/provider";
import { signQuoteLink } from "../../server/modules/portal/portal-link";
import { makeShop, type Shop } from "../support/test-app";
import { approvedQuote, completedEvent, listenForWebhooks, payDeposit, postEvent, sentQuote, submitCard, withPayments } from "../support/quotes";

/*
 * The deposit path against the local payments stand-in, through the provider's SDK. Here the app listens on a
 * port, so the stand-in delivers its signed webhooks itself (with its retries, duplicates and reordering).
 */

let server: Server | undefined;
afterEach(async () => {
  const si = await (await import("../support/quotes")).testPaymentsStandIn();
  si.control.reset();
  si.setWebhookUrl(null);
  await new Promise<void>((r) => (server ? server.close(() => r()) : r()));
  server = undefined;
});

/** A shop whose app listens, with the stand-in delivering webhooks to it, and an approved quote on an inquiry job. */
async function payingShop() {
  const s = await makeShop();
  const si = await withPayments(s);
  server = await listenForWebhooks(s, si);
  const q = await approvedQuote(s, s.inquiryA.id);
  return { s, si, q };
}

/** The customer's browser on the stand-in's checkout page: fill in the card and submit the form. */
async function payOnPage(url: string, card: string) {
  const page = await fetch(url);
  const html = await page.text();
  const action = /<form method="post" action="([^"]+)"/.exec(html)![1]!;
  const res = await submitCard(new URL(action, url).href, card);
  return { page: html, res, body: res.status === 303 ? "" : await res.text() };
}

const stageOf = (s: Shop, id: number) => s.db.select({ stage: jobs.stage }).from(jobs).where(eq(jobs.id, id)).get()!.stage;

describe("paying the deposit", () => {
  it("checkout → test card 4242 → signed webhook: one payment, the job booked, a receipt e-mailed", async () => {
    const { s, si, q } = await payingShop();
    expect(stageOf(s, s.inquiryA.id)).toBe("quoted");
    const checkout = await s.as("customer").post("/api/payments/checkout").send({ quoteId: q.id });
    expect(checkout.status).toBe(201);
    expect(checkout.body.url).toMatch(new RegExp(`^${si.url}/pay/cs_test_`));

    const { page, res } = await payOnPage(checkout.body.url, "4242 4242 4242 4242");
    expect(page).toContain("$524.14");
    expect(page).toContain("Card number");
    expect(res.status).toBe(303);
    expect(res.headers.get("location")).toBe(`http://coatwright.test/portal/quotes/${q.id}?paid=1`);
    await si.control.settle();

    const rows = s.db.select().from(payments).all();
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ quoteId: q.id, amountCents: 52414, expectedCents: 52414, currency: "usd", flagged: false, refundedCents: 0 });
    expect(stageOf(s, s.inquiryA.id)).toBe("booked");
    const event = s.db.select().from(jobStageEvents).where(eq(jobStageEvents.jobId, s.inquiryA.id)).all().at(-1)!;
    expect(event).toMatchObject({ fromStage: "quoted", toStage: "booked", userId: s.customer.id, note: "Deposit of $524.14 paid online" });
    expect(s.db.select().from(auditLog).where(eq(auditLog.action, "received")).all()).toHaveLength(1);

    await expect.poll(() => s.sent.find((m) => m.subject.startsWith("Deposit received"))).toBeDefined();
    const receipt = s.sent.find((m) => m.subject.startsWith("Deposit received"))!;
    expect(receipt.to).toBe("avery.stone@example.test");
    expect(receipt.text).toContain("$524.14");
    expect(receipt.text).toContain("$786.22"); // balance: $1,310.36 − $524.14 [C]
    await expect.poll(() => s.db.select().from(jobMessages).all().some((m) => m.kind === "deposit_receipt" && m.status === "sent")).toBe(true);

    const portal = await s.as("customer").get(`/api/portal/quotes/${q.id}`);
    expect(portal.body).toMatchObject({ paidCents: 52414, canPay: false });
    const again = await s.as("customer").post("/api/payments/checkout").send({ quoteId: q.id });
    expect(again.status).toBe(409);
    const list = await s.as("estimator").get(`/api/payments?jobId=${s.inquiryA.id}`);
    expect(list.body.items).toEqual([expect.objectContaining({ amountCents: 52414, status: "paid", flagged: false, version: 1 })]);
  });

  it("a deposit paid online by a customer without a portal account is credited to the customer's online payment, not to a former user", async () => {
    const { s, si, q } = await payingShop();
    // The customer has no portal account (closed), and pays from the quote link in the shop's e-mail.
    s.db.update(users).set({ active: false }).where(eq(users.id, s.customer.id)).run();
    const token = signQuoteLink(s.app.deps.appSecret, q.id, s.app.deps.now() + 86_400_000);
    const checkout = await request(s.app).post("/api/payments/checkout").set("X-Portal-Token", token).send({ quoteId: q.id });
    expect(checkout.status).toBe(201);
    await payOnPage(checkout.body.url, "4242 4242 4242 4242");
    await si.control.settle();
    expect(stageOf(s, s.inquiryA.id)).toBe("booked");
    const job = await s.as("owner").get(`/api/jobs/${s.inquiryA.id}`);
    const booked = job.body.events.find((e: { toStage: string }) => e.toStage === "booked");
    expect(booked).toMatchObject({ byName: "The customer, paying online", note: "Deposit of $524.14 paid online" });
  });

  it("a declined card (4000 0000 0000 0002) leaves the job unpaid and unbooked", async () => {
    const { s, si, q } = await payingShop();
    const checkout = await s.as("customer").post("/api/payments/checkout").send({ quoteId: q.id });
    const { res, body } = await payOnPage(checkout.body.url, "4000 0000 0000 0002");
    expect(res.status).toBe(200);
    expect(body).toContain("Your card was declined");
    await si.control.settle();
    expect(s.db.select().from(payments).all()).toHaveLength(0);
    expect(stageOf(s, s.inquiryA.id)).toBe("quoted");
    // The failure event was delivered and acknowledged, and changed nothing.
    expect(s.db.select().from(webhookEvents).all().map((e) => e.type)).toEqual(["payment_intent.payment_failed"]);
    expect((await s.as("customer").get(`/api/portal/quotes/${q.id}`)).body).toMatchObject({ paidCents: 0, canPay: true });
  });

  it("checkout needs an approved quote, a customer (or the quote link) and configured payments", async () => {
    const s = await makeShop();
    const q = await sentQuote(s);
    expect((await s.as("customer").post("/api/payments/checkout").send({ quoteId: q.id })).status).toBe(503);
    await withPayments(s);
    const notYet = await s.as("customer").post("/api/payments/checkout").send({ quoteId: q.id });
    expect(notYet.status).toBe(409);
    expect(notYet.body.error.message).toMatch(/Approve the quote/);
    expect((await s.as("painter").post("/api/payments/checkout").send({ quoteId: q.id })).status).toBe(403);
    expect((await s.as("customer").post("/api/payments/checkout").send({ quoteId: "x" })).status).toBe(400);
    expect((await s.as("customer").post("/api/payments/checkout").send({ quoteId: 9999 })).status).toBe(404);
  });
});

describe("the webhook", () => {
  it("the same event delivered three times records one payment", async () => {
    const { s, si, q } = await payingShop();
    si.control.setMode({ copies: 3 });
    const checkout = await s.as("customer").post("/api/payments/checkout").send({ quoteId: q.id });
    await payOnPage(checkout.body.url, "4242424242424242");
    await si.control.settle();
    const completed = si.control.deliveries().filter((d) => d.type === "checkout.session.completed");
    expect(completed).toHaveLength(3);
    expect(new Set(completed.map((d) => d.eventId)).size).toBe(1);
    expect(completed.every((d) => d.status === 200)).toBe(true);
    expect(s.db.select().from(payments).all()).toHaveLength(1);
    expect(s.db.select().from(webhookEvents).where(eq(webhookEvents.type, "checkout.session.completed")).all()).toHaveLength(1);
    // A later replay of the same event is acknowledged as a duplicate.
    const replay = await postEvent(s, si, completedEvent(si, checkout.body.sessionId)!);
    expect(replay.status).toBe(200);
    expect(replay.body).toMatchObject({ duplicate: true });
    expect(s.db.select().from(payments).all()).toHaveLength(1);
  });

  it("a different event for an already-paid checkout does not record a second payment", async () => {
    const s = await makeShop();
    const si = await withPayments(s);
    const q = await approvedQuote(s, s.inquiryA.id);
    const { event } = await payDeposit(s, si, q.id);
    const copy = { ...event, id: `${event.id}_second` };
    const res = await postEvent(s, si, copy);
    expect(res.status).toBe(200);
    expect(res.body.outcome).toBe("payment already recorded");
    expect(s.db.select().from(payments).all()).toHaveLength(1);
  });

  it("a bad signature gets 400 and records nothing", async () => {
    const s = await makeShop();
    const si = await withPayments(s);
    const q = await approvedQuote(s, s.inquiryA.id);
    const checkout = await s.as("customer").post("/api/payments/checkout").send({ quoteId: q.id });
    si.control.pay(checkout.body.sessionId, "4242 4242 4242 4242");
    const event = completedEvent(si, checkout.body.sessionId)!;

    const wrongSecret = await postEvent(s, si, event, { secretOverride: "whsec_someone_else" });
    expect(wrongSecret.status).toBe(400);
    expect(wrongSecret.body.error.message).toMatch(/signature/);
    // Signed body, then altered (amount raised) in transit.
    const signedFor = JSON.stringify(event);
    const altered = signedFor.replace('"amount_total":52414', '"amount_total":1');
    const header = si.control.sign(signedFor);
    const { default: request } = await import("supertest");
    const tampered = await request(s.app).post("/api/payments/webhook").set("Content-Type", "application/json").set("Stripe-Signature", header).send(altered);
    expect(tampered.status).toBe(400);
    const noHeader = await request(s.app).post("/api/payments/webhook").set("Content-Type", "application/json").send(signedFor);
    expect(noHeader.status).toBe(400);
    const notJson = await request(s.app).post("/api/payments/webhook").set("Content-Type", "application/json").set("Stripe-Signature", header).send("{oops");
    expect(notJson.status).toBe(400);

    expect(s.db.select().from(payments).all()).toHaveLength(0);
    expect(s.db.select().from(webhookEvents).all()).toHaveLength(0);
    expect(stageOf(s, s.inquiryA.id)).toBe("quoted");
  });

  it("an amount that does not match the deposit is flagged for the owner, not accepted: the job stays unbooked until the owner accepts it", async () => {
    const { s, si, q } = await payingShop();
    si.control.setMode({ paidAmountOverride: 1000 });
    const checkout = await s.as("customer").post("/api/payments/checkout").send({ quoteId: q.id });
    await payOnPage(checkout.body.url, "4242 4242 4242 4242");
    await si.control.settle();
    const p = s.db.select().from(payments).get()!;
    expect(p).toMatchObject({ amountCents: 1000, expectedCents: 52414, flagged: true });
    expect(p.flagReason).toBe("paid $10.00 but the deposit asked was $524.14");
    expect(stageOf(s, s.inquiryA.id)).toBe("quoted");
    expect(s.sent.some((m) => m.subject.startsWith("Deposit received"))).toBe(false);
    expect(s.db.select().from(auditLog).where(eq(auditLog.action, "received_flagged")).all()).toHaveLength(1);
    const flagged = await s.as("owner").get("/api/payments?flagged=1");
    expect(flagged.body.items).toEqual([expect.objectContaining({ id: p.id, flagged: true, reviewedAt: null })]);
    // The customer is told the shop is checking it, and cannot start another checkout meanwhile.
    expect((await s.as("customer").get(`/api/portal/quotes/${q.id}`)).body).toMatchObject({ paymentUnderReview: true, canPay: false, paidCents: 0 });

    expect((await s.as("estimator").post(`/api/payments/${p.id}/accept`).send({})).status).toBe(403);
    const accepted = await s.as("owner").post(`/api/payments/${p.id}/accept`).send({ note: "Customer paid the rest in cash" });
    expect(accepted.status).toBe(200);
    expect(accepted.body.reviewedAt).not.toBeNull();
    expect(stageOf(s, s.inquiryA.id)).toBe("booked");
    expect((await s.as("owner").post(`/api/payments/${p.id}/accept`).send({})).status).toBe(409);
  });

  it("out-of-order delivery: refund events that arrive before their payment are retried and end up recorded once", async () => {
    const { s, si, q } = await payingShop();
    si.control.setMode({ hold: true, reverse: true });
    const checkout = await s.as("customer").post("/api/payments/checkout").send({ quoteId: q.id });
    await payOnPage(checkout.body.url, "4242 4242 4242 4242");
    // The provider refunds part of it before any event has reached us.
    const session = si.control.session(checkout.body.sessionId)!;
    await createPayments(si.sdkConfig).stripe.refunds.create({ payment_intent: session.payment_intent!, amount: 4000 });
    expect(si.control.held().map((e) => e.type)).toEqual(["payment_intent.succeeded", "checkout.session.completed", "refund.created", "charge.refunded"]);
    await si.control.flush(); // newest first: charge.refunded, refund.created, checkout.session.completed, payment_intent.succeeded
    await si.control.settle();
    const log = si.control.deliveries();
    expect(log.slice(0, 2).map((d) => [d.type, d.status])).toEqual([
      ["charge.refunded", 409],
      ["refund.created", 409],
    ]);
    expect(log.filter((d) => d.type === "refund.created").at(-1)!.status).toBe(200);
    expect(s.db.select().from(payments).all()).toHaveLength(1);
    expect(s.db.select().from(refunds).all()).toEqual([expect.objectContaining({ amountCents: 4000 })]);
    expect(s.db.select().from(payments).get()!.refundedCents).toBe(4000);
  });
});

describe("refunds", () => {
  it("the owner refunds through the provider; the refund is recorded from its webhook", async () => {
    const { s, si, q } = await payingShop();
    const checkout = await s.as("customer").post("/api/payments/checkout").send({ quoteId: q.id });
    await payOnPage(checkout.body.url, "4242 4242 4242 4242");
    await si.control.settle();
    const p = s.db.select().from(payments).get()!;

    expect((await s.as("estimator").post(`/api/payments/${p.id}/refund`).send({ amountCents: 100 })).status).toBe(403);
    expect((await s.as("owner").post(`/api/payments/${p.id}/refund`).send({ amountCents: 99_999_999 })).status).toBe(400);
    expect((await s.as("owner").post(`/api/payments/${p.id}/refund`).send({ amountCents: -5 })).status).toBe(400);
    const res = await s.as("owner").post(`/api/payments/${p.id}/refund`).send({ amountCents: 10000, reason: "Smaller job" });
    expect(res.status).toBe(202);
    expect(res.body).toMatchObject({ status: "requested", amountCents: 10000, providerRefundId: expect.stringMatching(/^re_test_/) });
    await si.control.settle();
    const after = (await s.as("owner").get(`/api/payments?quoteId=${q.id}`)).body.items[0];
    expect(after).toMatchObject({ status: "partially_refunded", refundedCents: 10000, refunds: [expect.objectContaining({ amountCents: 10000, reason: "Smaller job" })] });
    expect(s.db.select().from(refunds).get()!.requestedBy).toBe(s.owner.id);
    // Both refund.created and charge.refunded name the same refund: one row.
    expect(s.db.select().from(refunds).all()).toHaveLength(1);
    expect(s.db.select().from(auditLog).where(eq(auditLog.action, "refund_requested")).all()).toHaveLength(1);
    expect(s.db.select().from(auditLog).where(eq(auditLog.action, "refunded")).all()).toHaveLength(1);

    // The rest: no amount means everything left.
    expect((await s.as("owner").post(`/api/payments/${p.id}/refund`).send({})).status).toBe(202);
    await si.control.settle();
    expect((await s.as("owner").get(`/api/payments?quoteId=${q.id}`)).body.items[0]).toMatchObject({ status: "refunded", refundedCents: 52414 });
    expect((await s.as("owner").post(`/api/payments/${p.id}/refund`).send({})).status).toBe(409);
    expect((await s.as("owner").post("/api/payments/9999/refund").send({})).status).toBe(404);
  });

  it("a second full refund asked before the first is confirmed: the provider refuses it and the owner gets 409, not a 5xx", async () => {
    const s = await makeShop();
    const si = await withPayments(s);
    const q = await approvedQuote(s, s.inquiryA.id);
    await payDeposit(s, si, q.id);
    const p = s.db.select().from(payments).get()!;
    // No webhook address here, so the first refund is not yet recorded when the second is asked for.
    expect((await s.as("owner").post(`/api/payments/${p.id}/refund`).send({})).status).toBe(202);
    const again = await s.as("owner").post(`/api/payments/${p.id}/refund`).send({});
    expect(again.status).toBe(409);
    expect(again.body.error).toMatchObject({ code: "conflict", message: expect.stringMatching(/refused to make the refund: Refund amount/) });
    expect(s.db.select().from(auditLog).where(eq(auditLog.action, "refund_requested")).all()).toHaveLength(1);
  });

  it("the provider unreachable: a clear 502 and nothing recorded", async () => {
    const s = await makeShop();
    const si = await withPayments(s);
    const q = await approvedQuote(s, s.inquiryA.id);
    await payDeposit(s, si, q.id);
    s.app.deps.payments = createPayments({ ...si.sdkConfig, port: 1 });
    const res = await s.as("owner").post("/api/payments/1/refund").send({});
    expect(res.status).toBe(502);
    expect(res.body.error.code).toBe("upstream_failed");
    expect(s.db.select().from(refunds).all()).toHaveLength(0);
  });
});

describe("who sees payments", () => {
  it("the office lists payments; painters and customers get 403", async () => {
    const s = await makeShop();
    expect((await s.as("owner").get("/api/payments")).status).toBe(200);
    expect((await s.as("estimator").get("/api/payments")).status).toBe(200);
    expect((await s.as("painter").get("/api/payments")).status).toBe(403);
    expect((await s.as("customer").get("/api/payments")).status).toBe(403);
  });
});
