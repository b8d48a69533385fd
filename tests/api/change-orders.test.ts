import { describe, expect, it } from "vitest";
import request from "supertest";
import { and, eq } from "drizzle-orm";
import { cookieFor, makeShop } from "../support/test-app";
import { addMixedSheet, addPanel, readyForBooth } from "../support/booth-fixtures";
import { approvedQuote, completedEvent, postEvent, withPayments } from "../support/quotes";
import { EXTRA_LINES, changePlan, jobWithPlanChange, sentChange } from "../support/change-orders";
import { auditLog, changeOrders, coatLogs, jobMessages, jobStageEvents, jobs, mixSheets, payments } from "../../server/db/schema";
import { signQuoteLink } from "../../server/modules/portal/portal-link";
import { keyPaths } from "../support/demo-shop";
import { isMoneyKey } from "./security/money-keys";
import type { BoothDto } from "../../shared/schemas/booth.schema";
import type { ChangeOrderDto } from "../../shared/schemas/change-order.schema";

const booth = async (s: Awaited<ReturnType<typeof makeShop>>) => (await s.as("owner").get(`/api/jobs/${s.jobA.id}/booth`)).body as BoothDto;
const timeline = (s: Awaited<ReturnType<typeof makeShop>>) => s.db.select().from(jobStageEvents).where(eq(jobStageEvents.jobId, s.jobA.id)).all().map((e) => e.note ?? "");
const audits = (s: Awaited<ReturnType<typeof makeShop>>, action: string) => s.db.select().from(auditLog).where(and(eq(auditLog.entity, "change_order"), eq(auditLog.action, action))).all();

describe("change orders: the shop's side", () => {
  it("saving the plan of an approved job keeps version 1 for the booth and opens a draft change order for version 2", async () => {
    const s = await makeShop();
    const { booth: fx, saved, change } = await jobWithPlanChange(s);
    expect(saved.latest.version).toBe(2);
    const co = (await s.as("owner").get(`/api/change-orders/${change.id}`)).body as ChangeOrderDto;
    expect(co).toMatchObject({ kind: "plan", status: "draft", colourChanged: true, fromVersion: { version: 1 }, toVersion: { version: 2 } });
    // Side by side: only the candy (position 1) changed.
    expect(co.layers.map((p) => p.changed)).toEqual([false, true, false]);
    expect(co.layers[1]).toMatchObject({ before: { name: "Candy garnet" }, after: { name: "Candy cobalt" } });
    expect(co.affectedLayerIds).toEqual([fx.layers[1]!.id]);
    // The booth card stays on version 1 and marks the candy as waiting.
    const card = await booth(s);
    expect(card.plan).toMatchObject({ version: 1 });
    expect(card.layers.map((l) => l.changeWaiting)).toEqual([false, true, false]);
    expect(card.changesWaiting).toEqual([change.id]);
    expect(timeline(s).some((n) => n.startsWith(`Change order #${change.id} opened`))).toBe(true);
    expect(audits(s, "created")).toHaveLength(1);
    // Saving again edits the draft's version 2 in place: no version 3, still one change order.
    const again = await changePlan(s, fx.plan.id, (doc) => {
      doc.layers[1]!.coats = 4;
    });
    expect(again.latest.version).toBe(2);
    expect((await s.as("owner").get(`/api/jobs/${s.jobA.id}/change-orders`)).body.items).toHaveLength(1);
  });

  it("the office prices and sends it; edits need the version; the painter reads it without money", async () => {
    const s = await makeShop();
    const { change } = await jobWithPlanChange(s);
    const noVersion = await s.as("estimator").patch(`/api/change-orders/${change.id}`).send({ lines: EXTRA_LINES });
    expect(noVersion.status).toBe(400);
    expect(noVersion.body.error.fields).toHaveProperty("version");
    const badLine = await s.as("estimator").patch(`/api/change-orders/${change.id}`).send({ lines: [{ kind: "labour", description: "x" }], version: change.version });
    expect(badLine.status).toBe(400);
    expect(Object.keys(badLine.body.error.fields)).toContain("lines.0.hours");
    const priced = await s.as("estimator").patch(`/api/change-orders/${change.id}`).send({ lines: EXTRA_LINES, summary: "Candy cobalt instead of garnet", version: change.version });
    expect(priced.status).toBe(200);
    // 2 h × $95 = $190 of labour; the approved quote taxes only materials and supplies and asks 40 % deposit (by hand).
    expect(priced.body.money).toMatchObject({ subtotalCents: 19000, taxCents: 0, totalCents: 19000, depositCents: 7600, paidCents: 0 });
    const stale = await s.as("estimator").patch(`/api/change-orders/${change.id}`).send({ summary: "Other", version: change.version });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("version_conflict");

    const sent = await s.as("estimator").post(`/api/change-orders/${change.id}/send`).send({});
    expect(sent.status).toBe(200);
    expect(sent.body).toMatchObject({ status: "sent", sentTo: "avery.stone@example.test" });
    expect(s.sent.at(-1)!.subject).toBe("A change to your job needs your answer: Helmet in candy teal");
    expect(s.sent.at(-1)!.text).toMatch(new RegExp(`/portal/link/[^\\s]+\\?change=${change.id}`));
    expect(s.sent.at(-1)!.text).toContain("adds $190.00 to the price");
    expect(s.db.select().from(jobMessages).where(eq(jobMessages.kind, "change_order")).all()).toHaveLength(1);
    // A sent change order is the customer's to answer.
    expect((await s.as("estimator").patch(`/api/change-orders/${change.id}`).send({ summary: "Late edit", version: sent.body.version })).status).toBe(409);

    const painter = await s.as("painter").get(`/api/jobs/${s.jobA.id}/change-orders`);
    expect(painter.status).toBe(200);
    expect(painter.body.items[0].summary).toBe("Candy cobalt instead of garnet");
    expect(keyPaths(painter.body).filter((k) => isMoneyKey(k.key))).toEqual([]);
    expect(painter.body.items[0].money).toBeUndefined();
  });

  it("a change order needs an approved job, and bad input names the field", async () => {
    const s = await makeShop();
    const notApproved = await s.as("estimator").post(`/api/jobs/${s.jobA.id}/change-orders`).send({ kind: "prep", summary: "Rust under the tank badge" });
    expect(notApproved.status).toBe(409);
    const badKind = await s.as("estimator").post(`/api/jobs/${s.jobA.id}/change-orders`).send({ kind: "paint", summary: "x" });
    expect(badKind.status).toBe(400);
    expect(badKind.body.error.fields).toHaveProperty("kind");
    await jobWithPlanChange(s);
    const prep = await s.as("estimator").post(`/api/jobs/${s.jobA.id}/change-orders`).send({ kind: "prep", summary: "Pinholes in the fibreglass after stripping", lines: EXTRA_LINES });
    expect(prep.status).toBe(201);
    expect(prep.body).toMatchObject({ kind: "prep", status: "draft", fromVersion: null, money: { totalCents: 19000 } });
    // Extra prep holds every layer of the card until the customer answers.
    expect((await booth(s)).layers.every((l) => l.changeWaiting)).toBe(true);
  });
});

describe("the booth while a change waits", () => {
  it("refuses a coat on a held layer: the painter cannot override; the owner can, with a reason that is recorded", async () => {
    const s = await makeShop();
    const fx = readyForBooth(s);
    await approvedQuote(s);
    s.db.update(jobs).set({ stage: "in_prep" }).where(eq(jobs.id, s.jobA.id)).run();
    await changePlan(s, fx.plan.id, (doc) => {
      doc.layers[0]!.name = "White sealer";
    });
    const coat = { jobId: s.jobA.id, layerId: fx.layers[0]!.id, coatNumber: 1, boothTemp: 21, tempUnit: "C", humidityPct: 50 };
    const painter = await s.as("painter").post("/api/coat-logs").send({ ...coat, changeOverrideReason: "Customer said yes on the phone" });
    expect(painter.status).toBe(409);
    expect(painter.body.error.message).toContain("Change waiting for the customer");
    expect(painter.body.error.fields).toHaveProperty("changeOverrideReason");
    const ownerNoReason = await s.as("owner").post("/api/coat-logs").send(coat);
    expect(ownerNoReason.status).toBe(409);
    expect(ownerNoReason.body.error.fields.changeOverrideReason).toMatch(/reason/);
    expect(s.db.select().from(coatLogs).all()).toHaveLength(0);
    const owner = await s.as("owner").post("/api/coat-logs").send({ ...coat, changeOverrideReason: "Customer agreed in the shop; paperwork follows" });
    expect(owner.status).toBe(201);
    expect(s.db.select().from(coatLogs).all()[0]!.changeOverrideReason).toBe("Customer agreed in the shop; paperwork follows");
    expect(s.db.select().from(auditLog).where(eq(auditLog.action, "change_wait_overridden")).all()).toHaveLength(1);
  });
});

describe("change orders: the customer's side", () => {
  it("the customer approves: time, address and name kept; the booth and new mix sheets move to version 2, old sheets superseded, the colour asks for a new panel", async () => {
    const s = await makeShop();
    const { booth: fx, change } = await sentChange(s);
    const oldSheet = addMixedSheet(s, s.jobA.id, fx.version.id, fx.layers[0]!.id, Date.now());
    const panel = addPanel(s, { jobId: s.jobA.id });
    s.db.update(jobs).set({ approvedPanelId: panel.id }).where(eq(jobs.id, s.jobA.id)).run();

    const seen = await s.as("customer").get(`/api/portal/change-orders/${change.id}`);
    expect(seen.status).toBe(200);
    expect(seen.body).toMatchObject({ status: "sent", money: { totalCents: 19000, depositCents: 7600 }, decidedAddress: null, canPay: false });
    const ok = await s.as("customer").post(`/api/portal/change-orders/${change.id}/approve`).send({ name: "Avery Stone" });
    expect(ok.status).toBe(200);
    expect(ok.body.decidedAddress).toBeNull();
    const row = s.db.select().from(changeOrders).where(eq(changeOrders.id, change.id)).get()!;
    expect(row).toMatchObject({ status: "approved", decisionName: "Avery Stone", decidedVia: "account" });
    expect(row.decidedAt).toBeGreaterThan(0);
    expect(row.decidedAddress).toMatch(/127\.0\.0\.1|::1|::ffff:127\.0\.0\.1/);
    expect((await s.as("customer").post(`/api/portal/change-orders/${change.id}/approve`).send({ name: "Avery Stone" })).status).toBe(409);

    const card = await booth(s);
    expect(card.plan).toMatchObject({ version: 2 });
    expect(card.layers.some((l) => l.changeWaiting)).toBe(false);
    expect(card.layers[1]!.name).toBe("Candy cobalt");
    expect(s.db.select().from(mixSheets).where(eq(mixSheets.id, oldSheet.id)).get()!.supersededAt).not.toBeNull();
    expect((await s.as("owner").get(`/api/mix-sheets/${oldSheet.id}`)).body.superseded).toBe(true);
    const fresh = await s.as("painter").post("/api/mix-sheets").send({ jobId: s.jobA.id, layerId: card.layers[0]!.id, mode: "total", amount: 200, unit: "mL" });
    expect(fresh.status).toBe(201);
    expect(fresh.body).toMatchObject({ planVersion: 2, superseded: false });
    expect(s.db.select().from(jobs).where(eq(jobs.id, s.jobA.id)).get()!.approvedPanelId).toBeNull();
    expect(timeline(s).find((n) => n.startsWith(`Change order #${change.id} approved`))).toContain("new test panel");
    expect(audits(s, "approved")).toHaveLength(1);
  });

  it("a declined change leaves the job on the approved version", async () => {
    const s = await makeShop();
    const { change } = await sentChange(s);
    const no = await s.as("customer").post(`/api/portal/change-orders/${change.id}/decline`).send({ reason: "Keep the garnet" });
    expect(no.status).toBe(200);
    expect(no.body).toMatchObject({ status: "declined", decisionNote: "Keep the garnet" });
    const card = await booth(s);
    expect(card.plan).toMatchObject({ version: 1 });
    expect(card.layers[1]!.name).toBe("Candy garnet");
    expect(card.layers.some((l) => l.changeWaiting)).toBe(false);
    expect(timeline(s).some((n) => n.includes("declined"))).toBe(true);
  });

  it("the extra deposit goes through the same checkout and signed webhook, once; the quote's own deposit is untouched", async () => {
    const s = await makeShop();
    const si = await withPayments(s);
    const { change, quote } = await sentChange(s);
    expect((await s.as("customer").post(`/api/portal/change-orders/${change.id}/checkout`).send({})).status).toBe(409);
    await s.as("customer").post(`/api/portal/change-orders/${change.id}/approve`).send({ name: "Avery Stone" });
    const quoteBefore = (await s.as("customer").get(`/api/portal/quotes/${quote.id}`)).body.paidCents;
    const checkout = await s.as("customer").post(`/api/portal/change-orders/${change.id}/checkout`).send({});
    expect(checkout.status).toBe(201);
    expect(si.control.pay(checkout.body.sessionId, "4242 4242 4242 4242").result).toBe("paid");
    const event = completedEvent(si, checkout.body.sessionId)!;
    expect((await postEvent(s, si, event)).status).toBe(200);
    expect((await postEvent(s, si, event)).body.duplicate).toBe(true);
    const rows = s.db.select().from(payments).all();
    expect(rows).toEqual([expect.objectContaining({ changeOrderId: change.id, amountCents: 7600, flagged: false })]);
    const after = (await s.as("customer").get(`/api/portal/change-orders/${change.id}`)).body;
    expect(after).toMatchObject({ money: { paidCents: 7600 }, canPay: false });
    expect((await s.as("customer").get(`/api/portal/quotes/${quote.id}`)).body.paidCents).toBe(quoteBefore);
    expect(timeline(s).some((n) => n.startsWith("Extra deposit of $76.00"))).toBe(true);
    expect((await s.as("customer").post(`/api/portal/change-orders/${change.id}/checkout`).send({})).status).toBe(409);
  });

  it("a customer sees only their own, sent change orders; a quote link reaches its own job's", async () => {
    const s = await makeShop();
    const { change, quote } = await jobWithPlanChange(s);
    // A draft is the shop's.
    expect((await s.as("customer").get(`/api/portal/change-orders/${change.id}`)).status).toBe(404);
    await s.as("estimator").post(`/api/change-orders/${change.id}/send`).send({});
    const blake = await cookieFor(s, s.customerBUser.id);
    expect((await request(s.app).get(`/api/portal/change-orders/${change.id}`).set("Cookie", blake)).status).toBe(404);
    expect((await request(s.app).post(`/api/portal/change-orders/${change.id}/approve`).set("Cookie", blake).send({ name: "Blake Moor" })).status).toBe(404);
    expect(s.db.select().from(changeOrders).get()!.status).toBe("sent");
    expect((await s.as("customer").get(`/api/portal/change-orders/${change.id}`)).status).toBe(200);
    expect((await s.as("customer").get(`/api/portal/jobs/${s.jobA.id}/change-orders`)).body.items).toHaveLength(1);
    expect((await s.as("customer").get(`/api/portal/jobs/${s.jobB.id}/change-orders`)).status).toBe(404);
    const token = signQuoteLink(s.app.deps.appSecret, quote.id, Date.now() + 86_400_000);
    expect((await request(s.app).get(`/api/portal/change-orders/${change.id}`).set("X-Portal-Token", token)).status).toBe(200);
  });
});
