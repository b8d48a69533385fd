import { describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import request from "supertest";
import { auditLog, quoteVersions, uploads } from "../../server/db/schema";
import { signQuoteLink, verifyQuoteLink } from "../../server/modules/portal/portal-link";
import { makeShop, type Shop } from "../support/test-app";
import { draftQuote, sentQuote } from "../support/quotes";
import { keysOf } from "../support/finish-fixtures";

/** The portal link from the last quote e-mail the shop sent. */
function lastLinkToken(s: Shop): string {
  const mail = [...s.sent].reverse().find((m) => m.attachments?.length);
  const m = /\/portal\/link\/(\S+)/.exec(mail?.text ?? "");
  if (!m) throw new Error("no portal link in the sent mail");
  return m[1]!;
}
const anon = (s: Shop, token: string) => ({
  get: (p: string) => request(s.app).get(p).set("X-Portal-Token", token),
  post: (p: string) => request(s.app).post(p).set("X-Portal-Token", token),
});

function photo(s: Shop, jobId: number, shareable: boolean, name: string) {
  mkdirSync(s.app.deps.uploadsDir, { recursive: true });
  writeFileSync(path.join(s.app.deps.uploadsDir, name), Buffer.from(`photo ${name}`));
  return s.db
    .insert(uploads)
    .values({ ownerType: "job", ownerId: jobId, jobId, kind: "photo", mime: "image/jpeg", size: 10, originalName: "p.jpg", storedName: name, thumbName: null, shareable, caption: shareable ? "Candy going on" : "Internal: the dent" })
    .returning()
    .get();
}

describe("signed quote links", () => {
  it("verify only what the server signed, until the expiry inside the signature", () => {
    const secret = "s".repeat(64);
    const t = signQuoteLink(secret, 12, Date.parse("2027-05-01T00:00:00Z"));
    expect(verifyQuoteLink(secret, t, Date.parse("2027-04-30T00:00:00Z"))).toEqual({ quoteId: 12, expiresAt: Date.parse("2027-05-01T00:00:00Z") });
    expect(verifyQuoteLink(secret, t, Date.parse("2027-05-01T00:00:01Z"))).toBeNull();
    expect(verifyQuoteLink("x".repeat(64), t, 0)).toBeNull();
    const [id, exp, sig] = t.split(".");
    expect(verifyQuoteLink(secret, `13.${exp}.${sig}`, 0)).toBeNull();
    expect(verifyQuoteLink(secret, `${id}.${Number(exp) + 86400}.${sig}`, 0)).toBeNull();
    expect(verifyQuoteLink(secret, "garbage", 0)).toBeNull();
  });
});

describe("the customer's portal", () => {
  it("a signed-in customer sees their own sent quotes only: no drafts, nobody else's, and never cost or markup", async () => {
    const s = await makeShop();
    const mine = await sentQuote(s);
    const draft = await draftQuote(s, s.inquiryA.id);
    const theirs = await sentQuote(s, s.jobB.id);
    const list = await s.as("customer").get("/api/portal/quotes");
    expect(list.body.items.map((q: { id: number }) => q.id)).toEqual([mine.id]);
    expect((await s.as("customer").get(`/api/portal/quotes/${draft.id}`)).status).toBe(404);
    expect((await s.as("customer").get(`/api/portal/quotes/${theirs.id}`)).status).toBe(404);
    const q = await s.as("customer").get(`/api/portal/quotes/${mine.id}`);
    expect(q.status).toBe(200);
    expect(q.body).toMatchObject({ status: "viewed", totalCents: 131036, depositCents: 52414, canDecide: true, canPay: false, jobTitle: "Helmet in candy teal" });
    expect(q.body.lines.map((l: { amountCents: number }) => l.amountCents)).toEqual([95000, 26000, 7600]);
    expect(keysOf(q.body).filter((k) => /cost|markup|notes|^rate/i.test(k))).toEqual([]);
    // Opening it made it "viewed" for the shop.
    expect((await s.as("estimator").get(`/api/quotes/${mine.id}`)).body.status).toBe("viewed");
    // Staff have no portal.
    expect((await s.as("owner").get("/api/portal/quotes")).status).toBe(403);
    expect((await request(s.app).get("/api/portal/quotes")).status).toBe(401);
  });

  it("approval is recorded with the time, the name given, how and from which address, and audited as money", async () => {
    let now = Date.parse("2027-03-01T10:00:00Z");
    const s = await makeShop({ now: () => now });
    const q = await sentQuote(s);
    now += 3600_000;
    const res = await s.as("customer").post(`/api/portal/quotes/${q.id}/approve`).set("X-Forwarded-For", "203.0.113.9").send({ name: "Avery Stone", note: "Go ahead" });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: "approved", decisionName: "Avery Stone", decidedAt: new Date(now).toISOString(), canDecide: false });
    const v = s.db.select().from(quoteVersions).where(eq(quoteVersions.quoteId, q.id)).get()!;
    expect(v).toMatchObject({ status: "approved", decidedVia: "account", decidedBy: s.customer.id, decisionNote: "Go ahead", decidedAt: now });
    expect(v.decidedAddress).toMatch(/127\.0\.0\.1|::1|::ffff:127\.0\.0\.1/);
    const audit = s.db.select().from(auditLog).where(eq(auditLog.action, "approved")).get()!;
    expect(audit).toMatchObject({ kind: "money", entity: "quote", userId: s.customer.id });
    expect((await s.as("customer").post(`/api/portal/quotes/${q.id}/approve`).send({ name: "Avery Stone" })).status).toBe(409);
    expect((await s.as("customer").post(`/api/portal/quotes/${q.id}/decline`).send({})).status).toBe(409);
    expect((await s.as("customer").post(`/api/portal/quotes/${q.id}/approve`).send({})).status).toBe(400);
  });

  it("approving needs a name; declining records the reason", async () => {
    const s = await makeShop();
    const q = await sentQuote(s);
    const noName = await s.as("customer").post(`/api/portal/quotes/${q.id}/approve`).send({ name: "  " });
    expect(noName.status).toBe(400);
    expect(noName.body.error.fields).toHaveProperty("name");
    const res = await s.as("customer").post(`/api/portal/quotes/${q.id}/decline`).send({ reason: "Going with a vinyl wrap" });
    expect(res.body).toMatchObject({ status: "declined", canDecide: false, canPay: false });
    expect(s.db.select().from(quoteVersions).get()!.decisionNote).toBe("Going with a vinyl wrap");
    expect((await s.as("estimator").get(`/api/quotes/${q.id}`)).body.status).toBe("declined");
  });

  it("jobs show the stage, the items, the finish in words and only shareable photos, without internal notes", async () => {
    const s = await makeShop();
    await sentQuote(s);
    await s.as("estimator").patch("/api/quotes/1").send({});
    s.db.update(quoteVersions).set({ finishText: "Sealer, 2 coats · Candy teal, 4 coats · 2K clear, 3 coats" }).run();
    const shared = photo(s, s.jobA.id, true, "a".repeat(32) + ".jpg");
    const hidden = photo(s, s.jobA.id, false, "b".repeat(32) + ".jpg");
    const other = photo(s, s.jobB.id, true, "c".repeat(32) + ".jpg");
    const jobsRes = await s.as("customer").get("/api/portal/jobs");
    expect(jobsRes.body.items.map((j: { id: number }) => j.id).sort()).toEqual([s.jobA.id, s.inquiryA.id].sort());
    const job = await s.as("customer").get(`/api/portal/jobs/${s.jobA.id}`);
    expect(job.body).toMatchObject({ stage: "in_prep", finishText: "Sealer, 2 coats · Candy teal, 4 coats · 2K clear, 3 coats", items: [expect.objectContaining({ name: "Helmet shell" })] });
    expect(job.body.photos).toEqual([expect.objectContaining({ id: shared.id, caption: "Candy going on", url: `/api/portal/photos/${shared.id}` })]);
    expect(JSON.stringify(job.body)).not.toContain("Internal");
    expect((await s.as("customer").get(`/api/portal/photos/${shared.id}`)).status).toBe(200);
    expect((await s.as("customer").get(`/api/portal/photos/${hidden.id}`)).status).toBe(404);
    expect((await s.as("customer").get(`/api/portal/photos/${other.id}`)).status).toBe(404);
    expect((await s.as("customer").get(`/api/portal/jobs/${s.jobB.id}`)).status).toBe(404);
    expect((await s.as("customer").get("/api/portal/jobs/abc")).status).toBe(400);
  });
});

describe("opening the quote from the e-mail link (no sign-in)", () => {
  it("the link opens that quote and its job only; approval is recorded as by link", async () => {
    const s = await makeShop();
    const other = await sentQuote(s, s.inquiryA.id);
    const q = await sentQuote(s);
    const token = lastLinkToken(s);
    const a = anon(s, token);
    const session = await a.get("/api/portal/session");
    expect(session.body).toMatchObject({ via: "link", customerName: "Avery Stone", quoteId: q.id });
    expect((await a.get("/api/portal/quotes")).body.items.map((x: { id: number }) => x.id)).toEqual([q.id]);
    expect((await a.get(`/api/portal/quotes/${other.id}`)).status).toBe(404);
    expect((await a.get("/api/portal/jobs")).body.items.map((j: { id: number }) => j.id)).toEqual([s.jobA.id]);
    expect((await a.get(`/api/portal/jobs/${s.inquiryA.id}`)).status).toBe(404);
    const pdf = await request(s.app).get(`/api/portal/quotes/${q.id}/pdf?token=${encodeURIComponent(token)}`);
    expect(pdf.status).toBe(200);
    expect(pdf.headers["content-type"]).toBe("application/pdf");

    const ok = await a.post(`/api/portal/quotes/${q.id}/approve`).send({ name: "A. Stone" });
    expect(ok.status).toBe(200);
    const v = s.db.select().from(quoteVersions).where(eq(quoteVersions.quoteId, q.id)).get()!;
    expect(v).toMatchObject({ status: "approved", decidedVia: "link", decidedBy: null, decisionName: "A. Stone" });
    const audit = s.db.select().from(auditLog).where(eq(auditLog.action, "approved")).get()!;
    expect(audit.userId).toBeNull();
    expect(audit.after).toMatchObject({ via: "link", name: "A. Stone" });
  });

  it("an altered, foreign or expired link is refused with 401", async () => {
    let now = Date.parse("2027-03-01T10:00:00Z");
    const s = await makeShop({ now: () => now });
    const q = await sentQuote(s);
    const token = lastLinkToken(s);
    const [id, exp, sig] = token.split(".");
    expect((await anon(s, `${id}.${Number(exp) + 1}.${sig}`).get(`/api/portal/quotes/${q.id}`)).status).toBe(401);
    expect((await anon(s, signQuoteLink("another-secret-".repeat(4), q.id, now + 86_400_000)).get(`/api/portal/quotes/${q.id}`)).status).toBe(401);
    expect((await anon(s, "not-a-token").get("/api/portal/session")).status).toBe(401);
    expect((await anon(s, token).get(`/api/portal/quotes/${q.id}`)).status).toBe(200);
    now = Number(exp) * 1000 + 1;
    const expired = await anon(s, token).get(`/api/portal/quotes/${q.id}`);
    expect(expired.status).toBe(401);
    expect(expired.body.error.message).toMatch(/expired/);
  });
});
