import { describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { editAt, makeShop, type Shop } from "../support/test-app";
import { addBoothPlan, addPanel, addPhoto, signOffPrep } from "../support/booth-fixtures";
import { sentQuote } from "../support/quotes";
import { HttpError } from "../../server/http/http-error";
import { auditLog, customers, jobMessages, jobs, panelSignOffs, uploads } from "../../server/db/schema";
import { signQuoteLink } from "../../server/modules/portal/portal-link";
import type { BoothDto } from "../../shared/schemas/booth.schema";

/**
 * CIEDE2000 check values from Sharma, Wu & Dalal (2005), "The CIEDE2000 color-difference formula: implementation
 * notes, supplementary test data and mathematical observations", Table 1: pair 1 ΔE00 = 2.0425, pair 7 ΔE00 = 2.3669.
 */
const TARGET = { label: "Customer's sample chip", labL: 50, labA: 2.6772, labB: -79.7751 };
const PAIR_1 = { labL: 50, labA: 0, labB: -82.7485 };

/** Two panels of job A with photos; the first against the target is Sharma pair 1. */
async function twoPanels(s: Shop) {
  const a = addPanel(s, { jobId: s.jobA.id, coats: 3, ...PAIR_1 });
  const b = addPanel(s, { jobId: s.jobA.id, coats: 5, candyName: "Candy cobalt", labL: 40, labA: 10, labB: -60 });
  const pa = await addPhoto(s, { ownerType: "panel", ownerId: a.id, jobId: s.jobA.id });
  const pb = await addPhoto(s, { ownerType: "panel", ownerId: b.id, jobId: s.jobA.id });
  return { a, b, pa, pb };
}

const send = (s: Shop, panelId: number, body: object = {}) => s.as("estimator").post(`/api/panels/${panelId}/send-to-customer`).send(body);

describe("the customer signs off the colour", () => {
  it("the office sends two panels in one e-mail, each with its photo, let-down, coats and ΔE00 to the target", async () => {
    const s = await makeShop();
    const { a, b, pa } = await twoPanels(s);
    const res = await send(s, a.id, { alsoPanelIds: [b.id], target: TARGET, message: "Two depths of the candy for you." });
    expect(res.status).toBe(200);
    expect(res.body.signOffs).toHaveLength(2);
    const first = res.body.signOffs.find((x: { panelId: number }) => x.panelId === a.id);
    expect(first).toMatchObject({ status: "waiting", coats: 3, letDownClear: 6, letDownToner: 1, targetLabel: "Customer's sample chip", photo: { url: `/api/uploads/${pa.id}` } });
    expect(first.deltaE).toBe(2.04); // Sharma et al. 2005 pair 1: 2.0425, kept to two decimals
    expect(s.sent).toHaveLength(1);
    expect(s.sent[0]!.to).toBe("avery.stone@example.test");
    expect(s.sent[0]!.subject).toBe("Choose your colour: Helmet in candy teal");
    expect(s.sent[0]!.text).toContain("Candy garnet over Fine silver, 6:1, 3 coats");
    expect(s.sent[0]!.text).toContain("ΔE00 2.04 from Customer's sample chip");
    expect(s.sent[0]!.text).toContain("Two depths of the candy for you.");
    // The photos sent are now the customer's to see; the e-mail is on the job.
    expect(s.db.select().from(uploads).all().every((u) => u.shareable)).toBe(true);
    expect(s.db.select().from(jobMessages).where(eq(jobMessages.jobId, s.jobA.id)).all()).toEqual([expect.objectContaining({ kind: "colour_panels", status: "sent" })]);
  });

  it("the customer approves one: time, address and name recorded; it becomes the job's colour, the other is not chosen", async () => {
    const s = await makeShop();
    const { a, b } = await twoPanels(s);
    await send(s, a.id, { alsoPanelIds: [b.id], target: TARGET });
    const portal = await s.as("customer").get(`/api/portal/jobs/${s.jobA.id}/colour`);
    expect(portal.status).toBe(200);
    expect(portal.body.waiting.map((x: { panelId: number }) => x.panelId).sort()).toEqual([a.id, b.id].sort());
    expect(portal.body.waiting[0].photo.url).toMatch(/^\/api\/portal\/photos\/\d+$/);
    expect(portal.body.waiting[0].decidedAddress).toBeNull();
    const photo = await s.as("customer").get(portal.body.waiting[0].photo.url);
    expect(photo.status).toBe(200);

    const ok = await s.as("customer").post(`/api/portal/panels/${b.id}/approve`).send({ name: "Avery Stone", note: "The deeper one" });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ approvedPanelId: b.id, waiting: [] });
    const rows = s.db.select().from(panelSignOffs).all();
    expect(rows.find((r) => r.panelId === b.id)).toMatchObject({ status: "approved", decidedVia: "account", decidedBy: s.customer.id, decisionName: "Avery Stone", decisionNote: "The deeper one", decidedAt: expect.any(Number) });
    expect(rows.find((r) => r.panelId === b.id)!.decidedAddress).toMatch(/127\.0\.0\.1/);
    expect(rows.find((r) => r.panelId === a.id)!.status).toBe("not_chosen");
    expect(s.db.select().from(jobs).where(eq(jobs.id, s.jobA.id)).get()!.approvedPanelId).toBe(b.id);
    const colour = await s.as("estimator").get(`/api/jobs/${s.jobA.id}/colour`);
    expect(colour.body).toMatchObject({ approvedByCustomer: true, approvedPanel: { id: b.id } });
    expect(colour.body.signOffs.find((x: { panelId: number }) => x.panelId === b.id).decidedAddress).toMatch(/127\.0\.0\.1/);
    expect(s.db.select().from(auditLog).where(eq(auditLog.action, "customer_approved")).all()).toHaveLength(1);

    const twice = await s.as("customer").post(`/api/portal/panels/${b.id}/approve`).send({ name: "Avery Stone" });
    expect(twice.status).toBe(409);
    expect(twice.body.error.message).toBe("You already approved this panel");
    expect((await s.as("customer").post(`/api/portal/panels/${a.id}/approve`).send({ name: "Avery Stone" })).status).toBe(409);
  });

  it("a holder of the quote link approves too; nobody reaches another customer's panels", async () => {
    const s = await makeShop();
    const { a } = await twoPanels(s);
    const q = await sentQuote(s);
    await send(s, a.id);
    const bPanel = addPanel(s, { jobId: s.jobB.id });
    await addPhoto(s, { ownerType: "panel", ownerId: bPanel.id, jobId: s.jobB.id });
    await send(s, bPanel.id);
    // Another customer: 404 for their panel and their job's colour page; a panel never sent: 404.
    expect((await s.as("customer").post(`/api/portal/panels/${bPanel.id}/approve`).send({ name: "Avery Stone" })).status).toBe(404);
    expect((await s.as("customer").get(`/api/portal/jobs/${s.jobB.id}/colour`)).status).toBe(404);
    const never = addPanel(s, { jobId: s.jobA.id });
    expect((await s.as("customer").post(`/api/portal/panels/${never.id}/approve`).send({ name: "Avery Stone" })).status).toBe(404);
    expect((await s.as("estimator").post(`/api/portal/panels/${a.id}/approve`).send({ name: "Avery Stone" })).status).toBe(403);

    const token = signQuoteLink(s.app.deps.appSecret, q.id, Date.now() + 86_400_000);
    const missingName = await s.as("anonymous").post(`/api/portal/panels/${a.id}/approve`).set("x-portal-token", token).send({});
    expect(missingName.status).toBe(400);
    expect(missingName.body.error.fields).toHaveProperty("name");
    const viaLink = await s.as("anonymous").post(`/api/portal/panels/${a.id}/approve`).set("x-portal-token", token).send({ name: "Avery Stone" });
    expect(viaLink.status).toBe(200);
    expect(s.db.select().from(panelSignOffs).where(eq(panelSignOffs.panelId, a.id)).get()).toMatchObject({ status: "approved", decidedVia: "link", decidedBy: null });
    expect(s.db.select().from(panelSignOffs).where(eq(panelSignOffs.panelId, bPanel.id)).get()!.status).toBe("waiting");
  });

  it("sending again replaces the waiting offer; ΔE00 defaults to the job's agreed panel", async () => {
    const s = await makeShop();
    const { a, b } = await twoPanels(s);
    const ref = addPanel(s, { jobId: s.jobA.id, labL: 50, labA: 0, labB: 0 });
    s.db.update(jobs).set({ approvedPanelId: ref.id }).where(eq(jobs.id, s.jobA.id)).run();
    const c = addPanel(s, { jobId: s.jobA.id, labL: 50, labA: -1, labB: 2 });
    await addPhoto(s, { ownerType: "panel", ownerId: c.id, jobId: s.jobA.id });
    const res = await send(s, c.id, { alsoPanelIds: [a.id] });
    const sentC = res.body.signOffs.find((x: { panelId: number }) => x.panelId === c.id);
    expect(sentC).toMatchObject({ targetLabel: `the agreed panel #${ref.id}`, deltaE: 2.37 }); // Sharma et al. 2005 pair 7: 2.3669
    const again = await send(s, a.id, { alsoPanelIds: [b.id] });
    expect(again.status).toBe(200);
    const statuses = s.db.select().from(panelSignOffs).where(eq(panelSignOffs.panelId, a.id)).all().map((r) => r.status);
    expect(statuses.sort()).toEqual(["replaced", "waiting"]);
    const portal = await s.as("customer").get(`/api/portal/jobs/${s.jobA.id}/colour`);
    expect(portal.body.waiting).toHaveLength(3);
  });

  it("refuses what cannot be sent with a 4xx naming the field, and records nothing", async () => {
    const s = await makeShop();
    const { a } = await twoPanels(s);
    const loose = addPanel(s, {});
    await addPhoto(s, { ownerType: "panel", ownerId: loose.id, jobId: null });
    const bare = addPanel(s, { jobId: s.jobA.id });
    const other = addPanel(s, { jobId: s.jobB.id });
    const cases: [number, object, number, string][] = [
      [loose.id, {}, 409, "jobId"],
      [bare.id, {}, 400, "photo"],
      [a.id, { alsoPanelIds: [other.id] }, 400, "alsoPanelIds"],
      [a.id, { alsoPanelIds: [bare.id] }, 400, "photo"],
      [a.id, { to: "not-an-address" }, 400, "to"],
      [a.id, { target: { label: "Chip", labL: 120, labA: 0, labB: 0 } }, 400, "target.labL"],
    ];
    for (const [id, body, status, field] of cases) {
      const res = await send(s, id, body);
      expect({ field, status: res.status }).toEqual({ field, status });
      expect(Object.keys(res.body.error.fields ?? {})).toContain(field);
    }
    s.db.update(customers).set({ email: null }).where(eq(customers.id, s.customerA.id)).run();
    const noMail = await send(s, a.id);
    expect(noMail.status).toBe(400);
    expect(noMail.body.error.fields).toHaveProperty("to");
    expect((await s.as("estimator").post("/api/panels/99999/send-to-customer").send({})).status).toBe(404);
    expect((await s.as("painter").post(`/api/panels/${a.id}/send-to-customer`).send({})).status).toBe(403);
    expect(s.db.select().from(panelSignOffs).all()).toEqual([]);
    expect(s.sent).toEqual([]);
  });

  it("when the mail server fails the panels are not marked sent, and the attempt is on the job", async () => {
    const s = await makeShop({
      mailer: {
        send: async () => {
          throw new HttpError(502, "upstream_failed", "The mail server could not be reached, so nothing was sent. Try again in a moment.");
        },
      },
    });
    const { a } = await twoPanels(s);
    const res = await send(s, a.id);
    expect(res.status).toBe(502);
    expect(s.db.select().from(panelSignOffs).all()).toEqual([]);
    expect(s.db.select().from(jobMessages).all()).toEqual([expect.objectContaining({ kind: "colour_panels", status: "failed" })]);
  });
});

describe("shop rule: the customer approves the colour before the first colour coat", () => {
  const CANDY_FIRST = [
    { kind: "sealer", name: "Grey sealer", coats: 1, flashMinutes: 0, dryMinutes: 0 },
    { kind: "candy", name: "Candy garnet", coats: 2, flashMinutes: 0, dryMinutes: 0 },
  ] as const;
  const booth = async (s: Shop) => (await s.as("painter").get(`/api/jobs/${s.jobA.id}/booth`)).body as BoothDto;
  const tap = async (s: Shop) => {
    const b = await booth(s);
    if (b.next.state !== "spray") throw new Error(b.next.state);
    return s.as("painter").post("/api/coat-logs").send({ jobId: s.jobA.id, layerId: b.next.layerId, coatNumber: b.next.coat });
  };

  it("with the rule on, the sealer goes on but the candy is refused with a 409 naming the rule until the customer approves", async () => {
    const s = await makeShop();
    addBoothPlan(s, s.jobA.id, [...CANDY_FIRST]);
    signOffPrep(s, s.jobA.id, s.itemA.id, s.painter.id);
    expect((await editAt(s, "owner", "/api/settings", { requireColourSignOff: true })).status).toBe(200);
    expect((await booth(s)).job.colourWaitsForCustomer).toBe(true);
    expect((await tap(s)).status).toBe(201); // the sealer is not a colour coat
    const refused = await tap(s);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/^Shop rule "Customer approves the colour before the first colour coat"/);
    expect(refused.body.error.fields).toEqual({ layerId: "Waiting for the customer's colour approval" });
    // The shop marking a panel itself does not count: the rule asks for the customer's approval.
    const { a } = await twoPanels(s);
    s.db.update(jobs).set({ approvedPanelId: a.id }).where(eq(jobs.id, s.jobA.id)).run();
    expect((await tap(s)).status).toBe(409);
    await send(s, a.id);
    await s.as("customer").post(`/api/portal/panels/${a.id}/approve`).send({ name: "Avery Stone" });
    expect((await booth(s)).job.colourWaitsForCustomer).toBe(false);
    expect((await tap(s)).status).toBe(201);
  });

  it("with the rule off (the default), the candy goes on without a sign-off", async () => {
    const s = await makeShop();
    addBoothPlan(s, s.jobA.id, [...CANDY_FIRST]);
    signOffPrep(s, s.jobA.id, s.itemA.id, s.painter.id);
    expect((await booth(s)).job.colourWaitsForCustomer).toBe(false);
    expect((await tap(s)).status).toBe(201);
    expect((await tap(s)).status).toBe(201);
  });
});
