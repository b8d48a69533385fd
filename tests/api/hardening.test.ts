import { describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { makeShop, type Shop, editAt } from "../support/test-app";
import { approvedQuote, draftQuote, payDeposit, sentQuote, withPayments } from "../support/quotes";
import { addJob } from "../support/test-app";
import { swatchPng } from "../support/booth-fixtures";
import { jobs, payments, refunds, shopSettings, uploads } from "../../server/db/schema";
import type { MatrixRows, Who } from "./matrix/rows";

const files = import.meta.glob<{ rows?: MatrixRows }>("./matrix/*.ts", { eager: true });
const MATRIX: MatrixRows = Object.assign({}, ...Object.values(files).map((m) => m.rows ?? {}));
const CALLERS: Who[] = ["owner", "estimator", "painter", "customer", "anonymous"];

describe("state-changing requests take JSON only (415 otherwise)", () => {
  it("a text/plain refund with no Origin header is refused before it reaches the payment provider", async () => {
    const s = await makeShop();
    const si = await withPayments(s);
    const q = await approvedQuote(s, s.inquiryA.id);
    await payDeposit(s, si, q.id);
    const p = s.db.select().from(payments).get()!;
    const refundsAtProvider = () => si.control.events().filter((e) => e.type === "refund.created" && (e.data.object as { payment_intent: string }).payment_intent === p.paymentIntentId).length;
    const res = await s.as("owner").post(`/api/payments/${p.id}/refund`).set("Content-Type", "text/plain").send('{"amountCents":100}');
    expect(res.status).toBe(415);
    expect(res.body.error).toMatchObject({ code: "unsupported_media_type", message: expect.stringMatching(/application\/json/) });
    // An empty text/plain body (a form with nothing in it) is refused too.
    expect((await s.as("owner").post(`/api/payments/${p.id}/refund`).set("Content-Type", "text/plain").send("")).status).toBe(415);
    await si.control.settle();
    expect(refundsAtProvider()).toBe(0);
    expect(s.db.select().from(refunds).all()).toEqual([]);
    // As JSON it goes through.
    expect((await s.as("owner").post(`/api/payments/${p.id}/refund`).send({ amountCents: 100 })).status).toBe(202);
  });

  it("a form post or a multipart body to a JSON route is refused and changes nothing; bare POSTs and file uploads still work", async () => {
    const s = await makeShop();
    const before = s.db.select().from(shopSettings).all();
    expect((await s.as("owner").patch("/api/settings").type("form").send("depositPercent=10")).status).toBe(415);
    expect((await s.as("owner").post("/api/customers").field("name", "Form Person")).status).toBe(415);
    expect(s.db.select().from(shopSettings).all()).toEqual(before);
    // No body, no type: a sign-out.
    expect((await s.as("owner").post("/api/auth/sign-out")).status).toBeLessThan(300);
    const photo = await s.as("painter").post("/api/uploads").field("ownerType", "job").field("ownerId", String(s.jobA.id)).attach("file", await swatchPng(), "a.png");
    expect(photo.status).toBe(201);
  });

  describe("every state-changing route of the role matrix answers 415 to its own body sent as text/plain", () => {
    for (const [key, c] of Object.entries(MATRIX).filter(([k]) => !k.startsWith("GET "))) {
      const who = CALLERS.find((w) => c.expect[w] >= 200 && c.expect[w] < 300);
      if (!who) continue;
      it(`${key} (as ${who})`, async () => {
        const s = await makeShop();
        await c.prepare?.(s);
        const [method] = key.split(" ") as [string];
        const m = method.toLowerCase() as "post" | "patch" | "put" | "delete";
        const res = await s.as(who)[m](c.path(s)).set("Content-Type", "text/plain").send(JSON.stringify(c.body?.(s) ?? {}));
        expect(res.status, JSON.stringify(res.body)).toBe(415);
      });
    }
  });
});

describe("ids are read strictly", () => {
  async function shopWith16Jobs() {
    const s = await makeShop();
    while ((s.db.select({ id: jobs.id }).from(jobs).all().at(-1)?.id ?? 0) < 16) addJob(s, s.customerA.id, { title: "Filler job" });
    s.db.update(jobs).set({ title: "Job sixteen" }).where(eq(jobs.id, 16)).run();
    return s;
  }

  it("/api/jobs/0x10 and other spellings of 16 do not reach job 16", async () => {
    const s = await shopWith16Jobs();
    expect((await s.as("owner").get("/api/jobs/16")).body.title).toBe("Job sixteen");
    for (const spelling of ["0x10", "1.6e1", "16.0", "016", "%2016", "16%20", "0b10000", "0o20", "+16"]) {
      const res = await s.as("owner").get(`/api/jobs/${spelling}`);
      expect([400, 404], `${spelling} → ${res.status}`).toContain(res.status);
      expect(JSON.stringify(res.body)).not.toMatch(/Job sixteen/);
    }
    const list = await s.as("owner").get("/api/uploads?jobId=0x10");
    expect(list.status).toBe(400);
    expect(list.body.error.fields).toHaveProperty("jobId");
  });

  it("a form field id is read strictly too, and JSON numbers still work", async () => {
    const s = await shopWith16Jobs();
    const res = await s.as("owner").post("/api/uploads").field("ownerType", "job").field("ownerId", "0x10").attach("file", await swatchPng(), "a.png");
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("ownerId");
    expect(s.db.select().from(uploads).all()).toEqual([]);
    expect((await s.as("owner").post("/api/jobs").send({ customerId: s.customerB.id, title: "By number" })).status).toBe(201);
    expect((await s.as("owner").post("/api/jobs").send({ customerId: String(s.customerB.id), title: "By digits" })).status).toBe(201);
  });

  it("quote version numbers in the address are read strictly", async () => {
    const s = await makeShop();
    const q = await draftQuote(s);
    expect((await s.as("owner").get(`/api/quotes/${q.id}/versions/1`)).status).toBe(200);
    expect((await s.as("owner").get(`/api/quotes/${q.id}/versions/0x1`)).status).toBe(400);
  });
});

describe("the payments stand-in's controls need its secret key", () => {
  it("without it, changing the paid amount or replaying an event is refused", async () => {
    const s = await makeShop();
    const si = await withPayments(s);
    si.control.reset();
    const post = (path: string, auth?: string) =>
      fetch(`${si.url}/_control${path}`, { method: "POST", headers: { "content-type": "application/json", ...(auth ? { authorization: auth } : {}) }, body: JSON.stringify({ paidAmountOverride: 1 }) });
    expect((await post("/mode")).status).toBe(401);
    expect((await post("/mode", "Bearer sk_test_guess")).status).toBe(401);
    expect((await post("/replay/evt_anything")).status).toBe(401);
    expect((await fetch(`${si.url}/_control/deliveries`)).status).toBe(401);
    // Nothing changed: a payment still reports the session's amount.
    const q = await approvedQuote(s, s.inquiryA.id);
    await payDeposit(s, si, q.id);
    const p = s.db.select().from(payments).get()!;
    expect(p.amountCents).toBe(p.expectedCents);
    // With the key, the control works.
    const ok = await post("/mode", `Bearer ${si.apiKey}`);
    expect(ok.status).toBe(200);
    expect((await ok.json()).paidAmountOverride).toBe(1);
    si.control.reset();
  });
});

describe("a job with quotes or payments stays with its customer", () => {
  const portalQuotes = async (s: Shop) => {
    const { cookieFor } = await import("../support/test-app");
    const request = (await import("supertest")).default;
    const cookie = await cookieFor(s, s.customerBUser.id);
    return (await request(s.app).get("/api/portal/quotes").set("Cookie", cookie)).body;
  };

  it("moving a job that has a sent quote to another customer is refused with 409, and the other customer's portal shows nothing of it", async () => {
    const s = await makeShop();
    const q = await sentQuote(s, s.jobA.id);
    const res = await editAt(s, "estimator", `/api/jobs/${s.jobA.id}`, { customerId: s.customerB.id });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({ code: "conflict", fields: { customerId: expect.stringMatching(/quotes/) } });
    expect(res.body.error.message).toMatch(/Avery Stone/);
    expect(s.db.select().from(jobs).where(eq(jobs.id, s.jobA.id)).get()!.customerId).toBe(s.customerA.id);
    expect(JSON.stringify(await portalQuotes(s))).not.toContain(`"id":${q.id},`);
  });

  it("a paid job is refused too; a job with nothing sent moves, and the same customer can be sent again", async () => {
    const s = await makeShop();
    const si = await withPayments(s);
    const q = await approvedQuote(s, s.inquiryA.id);
    await payDeposit(s, si, q.id);
    expect((await editAt(s, "owner", `/api/jobs/${s.inquiryA.id}`, { customerId: s.customerB.id })).status).toBe(409);
    expect((await editAt(s, "owner", `/api/jobs/${s.inquiryA.id}`, { customerId: s.customerA.id, title: "Golf cart roof, two-tone" })).status).toBe(200);
    const fresh = addJob(s, s.customerA.id, { title: "Nothing sent yet" });
    const moved = await editAt(s, "estimator", `/api/jobs/${fresh.id}`, { customerId: s.customerB.id });
    expect(moved.status).toBe(200);
    expect(moved.body.customerId).toBe(s.customerB.id);
  });
});
