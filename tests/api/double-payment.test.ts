import { afterEach, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import type { Server } from "node:http";
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import request from "supertest";
import { createApp } from "../../server/app";
import { openDb } from "../../server/db/client";
import { checkoutSessions, jobs, payments, webhookEvents } from "../../server/db/schema";
import { createPayments } from "../../server/payments/provider";
import { makeShop, memoryMailer, type Shop } from "../support/test-app";
import { approvedQuote, completedEvent, listenForWebhooks, postEvent, submitCard, testPaymentsStandIn, withPayments } from "../support/quotes";

/*
 * A deposit paid twice. One checkout per quote is open at a time: opening a new one expires the earlier one at the
 * provider (here the payments stand-in, through the provider's SDK), and the stand-in refuses to take a card on an
 * expired checkout. A payment that gets through anyway beyond what is due is recorded, flagged, listed first for the
 * owner and refunded in one call.
 *
 * The deposit of the sample quote: $1,310.36 × 40 % = $524.144 → $524.14 (tests/api/quotes.test.ts works the total).
 */
const DEPOSIT = 52414;

const servers: Server[] = [];
afterEach(async () => {
  const si = await testPaymentsStandIn();
  si.control.reset();
  si.setWebhookUrl(null);
  await Promise.all(servers.splice(0).map((srv) => new Promise<void>((r) => srv.close(() => r()))));
});

async function payingShop(options: Parameters<typeof makeShop>[0] = {}) {
  const s = await makeShop(options);
  const si = await withPayments(s);
  servers.push(await listenForWebhooks(s, si));
  const q = await approvedQuote(s, s.inquiryA.id);
  return { s, si, q };
}

const openCheckout = (s: Shop, quoteId: number) => s.as("customer").post("/api/payments/checkout").send({ quoteId });
const stageOf = (s: Shop, id: number) => s.db.select({ stage: jobs.stage }).from(jobs).where(eq(jobs.id, id)).get()!.stage;
const ourCheckouts = (s: Shop) =>
  Object.fromEntries(s.db.select({ id: checkoutSessions.id, status: checkoutSessions.status }).from(checkoutSessions).all().map((c) => [c.id, c.status]));

describe("one open checkout per quote", () => {
  it("opening checkout again expires the earlier one at the provider; its page says so and takes no card", async () => {
    const { s, si, q } = await payingShop();
    const first = await openCheckout(s, q.id);
    const second = await openCheckout(s, q.id);
    expect([first.status, second.status]).toEqual([201, 201]);
    expect(si.control.session(first.body.sessionId)!.status).toBe("expired");
    expect(si.control.session(second.body.sessionId)!.status).toBe("open");
    expect(ourCheckouts(s)).toEqual({ [first.body.sessionId]: "expired", [second.body.sessionId]: "open" });

    const page = await fetch(first.body.url);
    const html = await page.text();
    expect(page.status).toBe(410);
    expect(html).toContain("This checkout has expired");
    expect(html).not.toContain("Card number");
    const paid = await submitCard(first.body.url);
    expect(paid.status).toBe(410);
    expect(si.control.pay(first.body.sessionId, "4242 4242 4242 4242")).toMatchObject({ result: "expired" });

    await si.control.settle();
    expect(s.db.select().from(payments).all()).toHaveLength(0);
    // The provider's own "expired" event arrives too and changes nothing more.
    expect(s.db.select().from(webhookEvents).where(eq(webhookEvents.type, "checkout.session.expired")).all()).toEqual([
      expect.objectContaining({ outcome: "checkout expired" }),
    ]);
    // The newer checkout still pays.
    expect((await submitCard(second.body.url)).status).toBe(303);
    await si.control.settle();
    expect(s.db.select().from(payments).all()).toEqual([expect.objectContaining({ sessionId: second.body.sessionId, amountCents: DEPOSIT, flagged: false })]);
    expect(ourCheckouts(s)[second.body.sessionId]).toBe("complete");
  });

  it("two checkouts opened at the same moment, then both paid at the same moment: one is taken, one payment, unflagged", async () => {
    const { s, si, q } = await payingShop();
    // The provider answers 150 ms late, so the two requests really are in flight together.
    si.control.setMode({ apiLatencyMs: 150 });
    const [a, b] = await Promise.all([openCheckout(s, q.id), openCheckout(s, q.id)]);
    si.control.setMode({ apiLatencyMs: 0 });
    expect([a.status, b.status]).toEqual([201, 201]);
    expect(a.body.sessionId).not.toBe(b.body.sessionId);
    const states = [a, b].map((c) => si.control.session(c.body.sessionId)!.status);
    expect(states.sort()).toEqual(["expired", "open"]);

    // Both cards submitted at once, on both checkout pages.
    const results = await Promise.all([submitCard(a.body.url), submitCard(b.body.url)]);
    expect(results.map((r) => r.status).sort()).toEqual([303, 410]);
    await si.control.settle();

    const rows = s.db.select().from(payments).all();
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ amountCents: DEPOSIT, flagged: false });
    expect(stageOf(s, s.inquiryA.id)).toBe("booked");
    expect((await s.as("customer").get(`/api/portal/quotes/${q.id}`)).body).toMatchObject({ paidCents: DEPOSIT, paymentUnderReview: false, canPay: false });
  });

  it("an earlier checkout paid a moment before a new one is asked for (its webhook not here yet): 409, nothing new opened, then the payment is recorded once", async () => {
    const s = await makeShop();
    const si = await withPayments(s); // no webhook address: events wait for the test to hand them over
    const q = await approvedQuote(s, s.inquiryA.id);
    const first = await openCheckout(s, q.id);
    expect(si.control.pay(first.body.sessionId, "4242 4242 4242 4242").result).toBe("paid");

    const again = await openCheckout(s, q.id);
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/just gone through/);
    expect(Object.keys(ourCheckouts(s))).toEqual([first.body.sessionId]);

    expect((await postEvent(s, si, completedEvent(si, first.body.sessionId)!)).status).toBe(200);
    expect(s.db.select().from(payments).all()).toEqual([expect.objectContaining({ amountCents: DEPOSIT, flagged: false })]);
    const paidNow = await openCheckout(s, q.id);
    expect(paidNow.status).toBe(409);
    expect(paidNow.body.error.message).toMatch(/already paid/);
  });

  it("the provider unreachable while the earlier checkout is being ended: 502 and no second checkout", async () => {
    const s = await makeShop();
    const si = await withPayments(s);
    const q = await approvedQuote(s, s.inquiryA.id);
    const first = await openCheckout(s, q.id);
    s.app.deps.payments = createPayments({ ...si.sdkConfig, port: 1 });
    const res = await openCheckout(s, q.id);
    expect(res.status).toBe(502);
    expect(res.body.error.code).toBe("upstream_failed");
    expect(ourCheckouts(s)).toEqual({ [first.body.sessionId]: "open" });
  });
});

describe("a deposit paid twice anyway", () => {
  it("two server processes open checkouts at the same moment and both are paid: both recorded, exactly one unflagged, the owner sees the other flagged first and refunds it in one call; replays record nothing more", async () => {
    // Two apps on one database file, as two server processes would be: each one's queue knows only its own requests.
    const dbFile = path.join(mkdtempSync(path.join(tmpdir(), "cw-twice-")), "shop.db");
    const { s, si, q } = await payingShop({ dbFile });
    const second = createApp({ db: openDb(dbFile), mailer: memoryMailer().mailer, publicUrl: "http://coatwright.test", dataDir: s.app.deps.dataDir });
    second.deps.payments = createPayments(si.sdkConfig);
    si.control.setMode({ apiLatencyMs: 150 });
    const [a, b] = await Promise.all([
      openCheckout(s, q.id),
      request(second).post("/api/payments/checkout").set("Cookie", s.cookies.customer).send({ quoteId: q.id }),
    ]);
    si.control.setMode({ apiLatencyMs: 0 });
    expect([a.status, b.status]).toEqual([201, 201]);
    expect([a, b].map((c) => si.control.session(c.body.sessionId)!.status)).toEqual(["open", "open"]);

    const results = await Promise.all([submitCard(a.body.url), submitCard(b.body.url)]);
    expect(results.map((r) => r.status)).toEqual([303, 303]);
    await si.control.settle();

    const rows = s.db.select().from(payments).all();
    expect(rows).toHaveLength(2);
    const clean = rows.filter((p) => !p.flagged);
    const flagged = rows.filter((p) => p.flagged);
    expect(clean).toHaveLength(1);
    expect(flagged).toHaveLength(1);
    expect(flagged[0]!.amountCents).toBe(DEPOSIT);
    expect(flagged[0]!.flagReason).toBe("the deposit of $524.14 was already paid, so this $524.14 is more than is due (paid twice?)");

    // The owner's list: the flagged payment first; the filter lists only it.
    const list = (await s.as("owner").get("/api/payments")).body.items;
    expect(list.map((p: { id: number; needsReview: boolean }) => [p.id, p.needsReview])).toEqual([
      [flagged[0]!.id, true],
      [clean[0]!.id, false],
    ]);
    expect((await s.as("owner").get("/api/payments?flagged=1")).body.items.map((p: { id: number }) => p.id)).toEqual([flagged[0]!.id]);
    // The dashboard counts it as a payment to check; the customer is told the shop is checking.
    expect((await s.as("owner").get("/api/dashboard")).body.money.deposits.flaggedPayments).toBe(1);
    expect((await s.as("customer").get(`/api/portal/quotes/${q.id}`)).body).toMatchObject({ paidCents: DEPOSIT, paymentUnderReview: true });

    // The provider sends both completions again: still two payments, nothing applied twice.
    const applied = s.db.select().from(webhookEvents).all().length;
    for (const c of [a, b]) expect(await si.control.replay(completedEvent(si, c.body.sessionId)!.id)).toBe(true);
    expect(s.db.select().from(payments).all()).toHaveLength(2);
    expect(s.db.select().from(webhookEvents).all()).toHaveLength(applied);

    // Refund in one call: everything left on the flagged payment.
    const refund = await s.as("owner").post(`/api/payments/${flagged[0]!.id}/refund`).send({});
    expect(refund.status).toBe(202);
    await si.control.settle();
    const after = (await s.as("owner").get("/api/payments")).body.items;
    expect(after.find((p: { id: number }) => p.id === flagged[0]!.id)).toMatchObject({ status: "refunded", refundedCents: DEPOSIT, needsReview: false });
    expect((await s.as("owner").get("/api/payments?flagged=1")).body.items).toEqual([]);
    expect((await s.as("customer").get(`/api/portal/quotes/${q.id}`)).body).toMatchObject({ paidCents: DEPOSIT, paymentUnderReview: false, canPay: false });
    expect(stageOf(s, s.inquiryA.id)).toBe("booked");
    second.deps.db.$client.close();
  });

  it("a payment larger than what is still due is recorded and flagged, naming what was due", async () => {
    const { s, si, q } = await payingShop();
    si.control.setMode({ paidAmountOverride: 2 * DEPOSIT });
    const c = await openCheckout(s, q.id);
    expect((await submitCard(c.body.url)).status).toBe(303);
    await si.control.settle();
    expect(s.db.select().from(payments).get()).toMatchObject({
      amountCents: 2 * DEPOSIT,
      flagged: true,
      flagReason: "paid $1,048.28 but only $524.14 of the deposit was still due",
    });
    expect(stageOf(s, s.inquiryA.id)).toBe("quoted");
  });
});
