import { describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { auditLog, customers, jobMessages, jobs, quoteVersions, shopSettings } from "../../server/db/schema";
import { HttpError } from "../../server/http/http-error";
import type { Mailer } from "../../server/mail/mailer";
import { estimateJobPlan } from "../../server/modules/plans/plan-estimate.service";
import { DEFAULT_SETTINGS } from "../../shared/schemas/settings.schema";
import { addJob, makeShop, type Shop, editAt } from "../support/test-app";
import { draftQuote, SAMPLE_LINES, sentQuote } from "../support/quotes";
import { finishFixtures } from "../support/finish-fixtures";
import { binary, pdfText } from "../support/pdf-text";


function setSettings(s: Shop, patch: Partial<typeof DEFAULT_SETTINGS>) {
  const data = { ...DEFAULT_SETTINGS, labourRateCents: 9500, taxPercent: 7.25, taxAppliesTo: ["materials", "supplies"], depositPercent: 40, materialsMarkupPercent: 30, shopSuppliesPercent: 8, ...patch };
  s.db.insert(shopSettings).values({ id: 1, data, updatedAt: Date.now() }).onConflictDoUpdate({ target: shopSettings.id, set: { data } }).run();
}

// The sample quote: 10 h × $95 = $950.00; materials $200 + 30 % = $260.00; supplies 8 % of $950 = $76.00;
// subtotal $1,286.00; tax 7.25 % of ($260 + $76) = $24.36; total $1,310.36; deposit 40 % = $524.144 → $524.14 [C].
const SAMPLE = { subtotal: 128600, tax: 2436, total: 131036, deposit: 52414 };

describe("creating and editing quotes", () => {
  it("a new quote starts as a draft with the shop's rates, supplies, tax, deposit, terms and validity", async () => {
    const s = await makeShop({ now: () => Date.parse("2027-03-01T10:00:00") });
    setSettings(s, { quoteValidDays: 30, quoteTerms: "Half down, half on collection." });
    const res = await s.as("estimator").post("/api/quotes").send({ jobId: s.jobA.id });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ jobId: s.jobA.id, version: 1, status: "draft", customerName: "Avery Stone", validUntil: "2027-03-31", offeredVersion: null, planAvailable: false });
    const v = res.body.current;
    expect(v).toMatchObject({ taxPercent: 7.25, taxedKinds: ["materials", "supplies"], depositPercent: 40, taxRounding: "invoice", terms: "Half down, half on collection." });
    expect(v.lines.filter((l: { kind: string }) => l.kind === "labour").every((l: { rateCents: number }) => l.rateCents === 9500)).toBe(true);
    expect(v.lines.at(-1)).toMatchObject({ kind: "supplies", basis: "percent", percent: 8 });
    // No hours yet: nothing to charge.
    expect(v.totals.totalCents).toBe(0);
    const audit = s.db.select().from(auditLog).where(and(eq(auditLog.entity, "quote"), eq(auditLog.action, "created"))).all();
    expect(audit).toHaveLength(1);
    expect(audit[0]).toMatchObject({ kind: "money", userId: s.estimator.id });
  });

  it("editing a draft changes it in place, recomputes the totals with the shared function and audits the money change", async () => {
    const s = await makeShop();
    const q = await draftQuote(s);
    expect(q.version).toBe(1);
    expect(q.current.totals).toMatchObject({ subtotalCents: SAMPLE.subtotal, taxCents: SAMPLE.tax, totalCents: SAMPLE.total, depositCents: SAMPLE.deposit });
    expect(q).toMatchObject({ totalCents: SAMPLE.total, depositCents: SAMPLE.deposit });
    // Stored money columns match what the shared function computes.
    const row = s.db.select().from(quoteVersions).where(eq(quoteVersions.quoteId, q.id)).get()!;
    expect([row.subtotalCents, row.taxCents, row.totalCents, row.depositCents]).toEqual([SAMPLE.subtotal, SAMPLE.tax, SAMPLE.total, SAMPLE.deposit]);
    const updated = s.db.select().from(auditLog).where(and(eq(auditLog.entity, "quote"), eq(auditLog.action, "updated"))).all();
    expect(updated).toHaveLength(1);
    expect(updated[0]!.after).toMatchObject({ totalCents: SAMPLE.total, taxPercent: 7.25, depositPercent: 40 });

    // Tax per line instead of per invoice: $260.00 → $18.85, $76.00 → $5.51; $24.36 either way here [C].
    const perLine = await editAt(s, "owner", `/api/quotes/${q.id}`, { taxRounding: "line", taxedKinds: ["labour"] });
    expect(perLine.status).toBe(200);
    // Only labour taxed now: 7.25 % of $950 = $68.875 → $68.88 (half-up) [C].
    expect(perLine.body.current.totals).toMatchObject({ taxableCents: 95000, taxCents: 6888 });
    expect(perLine.body.version).toBe(1);
  });

  it("bad input is a 400 naming each field; never a 500", async () => {
    const s = await makeShop();
    const q = await draftQuote(s);
    const cases: [object, string][] = [
      [{ lines: [{ kind: "labour", description: "Prep", rateCents: 9500 }] }, "lines.0.hours"],
      [{ lines: [{ kind: "labour", description: "Prep", hours: 1.234, rateCents: 9500 }] }, "lines.0.hours"],
      [{ lines: [{ kind: "labour", description: "Prep", hours: "lots", rateCents: 9500 }] }, "lines.0.hours"],
      [{ lines: [{ kind: "materials", description: "Paint", costCents: 12.5, markupPercent: 30 }] }, "lines.0.costCents"],
      [{ lines: [{ kind: "materials", description: "Paint", costCents: 1e12, markupPercent: 30 }] }, "lines.0.costCents"],
      [{ lines: [{ kind: "supplies", description: "Supplies" }] }, "lines.0.basis"],
      [{ lines: [{ kind: "discount", description: "Off", basis: "percent" }] }, "lines.0.percent"],
      [{ lines: [{ kind: "gold", description: "x" }] }, "lines.0.kind"],
      [{ lines: [{ kind: "sublet", description: "", amountCents: 100 }] }, "lines.0.description"],
      [{ taxPercent: -1 }, "taxPercent"],
      [{ depositPercent: 101 }, "depositPercent"],
      [{ validUntil: "next tuesday" }, "validUntil"],
      [{ taxedKinds: ["discount"] }, "taxedKinds.0"],
      [{ lines: "none" }, "lines"],
    ];
    for (const [bodyIn, field] of cases) {
      const res = await editAt(s, "estimator", `/api/quotes/${q.id}`, bodyIn);
      expect({ field, status: res.status }).toEqual({ field, status: 400 });
      expect(Object.keys(res.body.error.fields ?? {})).toContain(field);
    }
    const tooMuchOff = await editAt(s, "estimator", `/api/quotes/${q.id}`, { lines: [...SAMPLE_LINES, { kind: "discount", description: "Too much", basis: "fixed", amountCents: 10_000_000 }] });
    expect(tooMuchOff.status).toBe(400);
    expect(tooMuchOff.body.error.fields).toHaveProperty("lines");
    for (const path of ["/api/quotes/abc", "/api/quotes/0", "/api/quotes/99999", "/api/quotes/1/versions/x", "/api/quotes/1/pdf?version=zero"]) {
      const res = await s.as("owner").get(path);
      expect([400, 404]).toContain(res.status);
    }
    expect((await s.as("owner").post("/api/quotes").send({ jobId: 99999 })).status).toBe(404);
    expect((await s.as("owner").post("/api/quotes").send({ jobId: "x" })).status).toBe(400);
  });

  it("lists quotes with their latest version, filtered by job and status", async () => {
    const s = await makeShop();
    const a = await sentQuote(s);
    await draftQuote(s, s.jobB.id);
    const all = await s.as("owner").get("/api/quotes");
    expect(all.body.total).toBe(2);
    const sent = await s.as("owner").get("/api/quotes?status=sent");
    expect(sent.body.items.map((q: { id: number }) => q.id)).toEqual([a.id]);
    const byJob = await s.as("owner").get(`/api/quotes?jobId=${s.jobB.id}`);
    expect(byJob.body.items).toHaveLength(1);
    expect(byJob.body.items[0]).toMatchObject({ status: "draft", jobTitle: "Guitar body in sunburst" });
    expect((await s.as("owner").get("/api/quotes?status=lost")).status).toBe(400);
  });
});

describe("versions", () => {
  it("changing a sent quote makes a new draft version; the sent one stays readable and unchanged", async () => {
    const s = await makeShop();
    const q = await sentQuote(s);
    expect(q).toMatchObject({ status: "sent", version: 1, offeredVersion: 1 });

    const revised = await editAt(s, "estimator", `/api/quotes/${q.id}`, { lines: [...SAMPLE_LINES, { kind: "sublet", description: "Chrome plating", amountCents: 20000 }] });
    expect(revised.status).toBe(200);
    expect(revised.body).toMatchObject({ version: 2, status: "draft", offeredVersion: 1 });
    expect(revised.body.versions.map((v: { version: number; status: string }) => [v.version, v.status])).toEqual([
      [2, "draft"],
      [1, "sent"],
    ]);
    const v1 = await s.as("estimator").get(`/api/quotes/${q.id}/versions/1`);
    expect(v1.body).toMatchObject({ version: 1, status: "sent", supersededAt: null });
    expect(v1.body.lines).toHaveLength(3);
    expect(v1.body.totals.totalCents).toBe(SAMPLE.total);
    expect(s.db.select().from(auditLog).where(eq(auditLog.action, "new_version")).all()).toHaveLength(1);

    // Editing the new draft stays in version 2.
    expect((await editAt(s, "estimator", `/api/quotes/${q.id}`, { intro: "Now with chrome" })).body.version).toBe(2);

    // Sending version 2 replaces version 1 for the customer.
    const sent2 = await s.as("estimator").post(`/api/quotes/${q.id}/send`).send({});
    expect(sent2.body).toMatchObject({ version: 2, status: "sent", offeredVersion: 2 });
    expect((await s.as("estimator").get(`/api/quotes/${q.id}/versions/1`)).body.supersededAt).not.toBeNull();
    const portal = await s.as("customer").get(`/api/portal/quotes/${q.id}`);
    expect(portal.body).toMatchObject({ version: 2, intro: "Now with chrome" });
    expect((await s.as("owner").get(`/api/quotes/${q.id}/versions/3`)).status).toBe(404);
  });

  it("work bought in from another shop reads \"Outside work\" to people; the stored line kind stays \"sublet\"", async () => {
    const s = await makeShop();
    const q = await sentQuote(s);
    const revised = await editAt(s, "estimator", `/api/quotes/${q.id}`, {
      lines: [...SAMPLE_LINES, { kind: "sublet", description: "Chrome plating", amountCents: 20000 }],
      taxedKinds: ["materials", "sublet"],
    });
    expect(revised.status).toBe(200);
    expect(revised.body.current.lines.at(-1)).toMatchObject({ kind: "sublet", amountCents: 20000 });
    expect((await s.as("estimator").post(`/api/quotes/${q.id}/send`).send({})).status).toBe(200);
    const portal = await s.as("customer").get(`/api/portal/quotes/${q.id}`);
    expect(portal.body.taxLabel).toBe("Sales tax (7.25 % on materials and outside work)");
    const pdf = await s.as("estimator").get(`/api/quotes/${q.id}/pdf`).buffer(true).parse(binary);
    const text = (await pdfText(pdf.body as Buffer)).replace(/\s+/g, " ");
    expect(text).toContain("outside work");
    expect(text).not.toMatch(/sublet/i);
  });

  it("revise makes the next version explicitly; discard throws a draft away; a sent quote cannot be discarded", async () => {
    const s = await makeShop();
    const q = await sentQuote(s);
    expect((await s.as("estimator").delete(`/api/quotes/${q.id}`)).status).toBe(409);
    const rev = await s.as("estimator").post(`/api/quotes/${q.id}/versions`);
    expect(rev.status).toBe(201);
    expect(rev.body).toMatchObject({ version: 2, status: "draft" });
    expect((await s.as("estimator").post(`/api/quotes/${q.id}/versions`)).status).toBe(409);
    const gone = await s.as("estimator").delete(`/api/quotes/${q.id}`);
    expect(gone.body).toEqual({ deleted: "version" });
    expect((await s.as("estimator").get(`/api/quotes/${q.id}`)).body).toMatchObject({ version: 1, status: "sent" });

    const draft = await draftQuote(s, s.jobB.id);
    expect((await s.as("owner").delete(`/api/quotes/${draft.id}`)).body).toEqual({ deleted: "quote" });
    expect((await s.as("owner").get(`/api/quotes/${draft.id}`)).status).toBe(404);
  });

  it("an approved quote can no longer change or be revised", async () => {
    const s = await makeShop();
    const q = await sentQuote(s);
    expect((await s.as("customer").post(`/api/portal/quotes/${q.id}/approve`).send({ name: "Avery Stone" })).status).toBe(200);
    const patch = await editAt(s, "estimator", `/api/quotes/${q.id}`, { intro: "x" });
    expect(patch.status).toBe(409);
    expect(patch.body.error.message).toMatch(/approved/);
    expect((await s.as("estimator").post(`/api/quotes/${q.id}/versions`)).status).toBe(409);
    expect((await s.as("estimator").post(`/api/quotes/${q.id}/send`).send({})).status).toBe(409);
    expect((await s.as("estimator").get(`/api/quotes/${q.id}`)).body.status).toBe("approved");
  });

  it("a sent quote past its valid-until date reads as expired; revising gives it a fresh date", async () => {
    let now = Date.parse("2027-03-01T10:00:00");
    const s = await makeShop({ now: () => now });
    setSettings(s, { quoteValidDays: 10 });
    const q = await sentQuote(s);
    expect(q.validUntil).toBe("2027-03-11");
    now = Date.parse("2027-03-11T18:00:00");
    expect((await s.as("owner").get(`/api/quotes/${q.id}`)).body.status).toBe("sent");
    now = Date.parse("2027-03-12T08:00:00");
    expect((await s.as("owner").get(`/api/quotes/${q.id}`)).body.status).toBe("expired");
    expect((await s.as("owner").get("/api/quotes?status=expired")).body.items).toHaveLength(1);
    expect((await s.as("owner").get("/api/quotes?status=sent")).body.items).toHaveLength(0);
    // Nothing was written: expiry is read from the date.
    expect(s.db.select().from(quoteVersions).get()!.status).toBe("sent");
    const approve = await s.as("customer").post(`/api/portal/quotes/${q.id}/approve`).send({ name: "Avery Stone" });
    expect(approve.status).toBe(409);
    expect(approve.body.error.message).toMatch(/expired/);
    expect((await s.as("owner").post(`/api/quotes/${q.id}/send`).send({})).status).toBe(409);
    const rev = await s.as("owner").post(`/api/quotes/${q.id}/versions`);
    expect(rev.body.current.validUntil).toBe("2027-03-22");
  });
});

describe("sending", () => {
  it("sends the quote with its PDF and a portal link, marks it sent, logs it on the job and moves an inquiry to quoted", async () => {
    const s = await makeShop();
    const q = await draftQuote(s, s.inquiryA.id);
    const res = await s.as("estimator").post(`/api/quotes/${q.id}/send`).send({ message: "Here is the roof quote." });
    expect(res.status).toBe(200);
    expect(res.body.current).toMatchObject({ status: "sent", sentTo: "avery.stone@example.test" });
    expect(s.sent).toHaveLength(1);
    const mail = s.sent[0]!;
    expect(mail.to).toBe("avery.stone@example.test");
    expect(mail.subject).toMatch(/^Your quote from .+: Golf cart roof$/);
    expect(mail.text).toContain("Here is the roof quote.");
    expect(mail.text).toContain("$1,310.36");
    expect(mail.text).toMatch(/http:\/\/coatwright\.test\/portal\/link\/\d+\.\d+\.[\w-]{43}/);
    expect(mail.attachments?.[0]).toMatchObject({ filename: `quote-${q.id}-v1.pdf`, contentType: "application/pdf" });
    // The attached PDF is the sent quote, not the draft it was a moment before.
    const attached = await pdfText(mail.attachments![0]!.content as Buffer);
    expect(attached).toContain("Golf cart roof");
    expect(attached).not.toMatch(/Status\s*Draft/);
    const job = s.db.select().from(jobs).where(eq(jobs.id, s.inquiryA.id)).get()!;
    expect(job.stage).toBe("quoted");
    const log = await s.as("owner").get(`/api/messages?jobId=${s.inquiryA.id}`);
    expect(log.body.items).toEqual([expect.objectContaining({ kind: "quote", status: "sent", to: "avery.stone@example.test", attachments: [`quote-${q.id}-v1.pdf`], byName: "Test estimator" })]);
    expect(s.db.select().from(auditLog).where(eq(auditLog.action, "sent")).all()).toHaveLength(1);
    // Sending again resends the same version (no new version, same status).
    const again = await s.as("estimator").post(`/api/quotes/${q.id}/send`).send({ to: "other@example.test" });
    expect(again.body).toMatchObject({ version: 1, status: "sent" });
    expect(s.sent[1]!.to).toBe("other@example.test");
  });

  it("a failing SMTP server gives a clear 502 and leaves the quote a draft; nothing is marked sent", async () => {
    const failing: Mailer = {
      async send() {
        throw new HttpError(502, "upstream_failed", "The mail server could not be reached, so nothing was sent. Try again in a moment.");
      },
    };
    const s = await makeShop({ mailer: failing });
    const q = await draftQuote(s, s.inquiryA.id);
    const res = await s.as("estimator").post(`/api/quotes/${q.id}/send`).send({});
    expect(res.status).toBe(502);
    expect(res.body.error).toMatchObject({ code: "upstream_failed", message: expect.stringMatching(/nothing was sent/) });
    const after = await s.as("estimator").get(`/api/quotes/${q.id}`);
    expect(after.body).toMatchObject({ status: "draft", sentAt: null, offeredVersion: null });
    expect(s.db.select().from(jobs).where(eq(jobs.id, s.inquiryA.id)).get()!.stage).toBe("inquiry");
    expect(s.db.select().from(auditLog).where(eq(auditLog.action, "sent")).all()).toHaveLength(0);
    // The attempt is on the job's message log, as failed.
    expect(s.db.select().from(jobMessages).all()).toEqual([expect.objectContaining({ kind: "quote", status: "failed" })]);
    // The customer cannot see an unsent quote.
    expect((await s.as("customer").get(`/api/portal/quotes/${q.id}`)).status).toBe(404);
  });

  it("refuses to send an empty quote, and asks for an address when the customer has none", async () => {
    const s = await makeShop();
    const empty = await s.as("estimator").post("/api/quotes").send({ jobId: s.jobA.id });
    const res = await s.as("estimator").post(`/api/quotes/${empty.body.id}/send`).send({});
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("lines");
    const job = addJob(s, s.spareCustomer.id, { title: "Spare job" });
    s.db.update(customers).set({ email: null }).where(eq(customers.id, s.spareCustomer.id)).run();
    const q = await draftQuote(s, job.id);
    const noMail = await s.as("estimator").post(`/api/quotes/${q.id}/send`).send({});
    expect(noMail.status).toBe(400);
    expect(noMail.body.error.fields).toHaveProperty("to");
    expect((await s.as("estimator").post(`/api/quotes/${q.id}/send`).send({ to: "not an address" })).status).toBe(400);
  });
});

describe("the quote PDF", () => {
  it("parses, and carries the shop, customer, items, finish, lines, totals, deposit, terms and valid-until date", async () => {
    const s = await makeShop();
    setSettings(s, { shopName: "Harrow Creek Custom Finishes", shopPhone: "555-0100", quoteTerms: "Balance due on collection." });
    const q = await draftQuote(s);
    await editAt(s, "estimator", `/api/quotes/${q.id}`, { finishText: "Sealer, 2 coats · Candy teal, 4 coats · 2K clear, 3 coats", terms: "Balance due on collection.", validUntil: "2027-04-30" });
    const res = await s.as("estimator").get(`/api/quotes/${q.id}/pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toBe("application/pdf");
    const bytes = res.body as Buffer;
    expect(bytes.subarray(0, 5).toString()).toBe("%PDF-");
    // Inter is embedded (a subset font file in the PDF).
    expect(bytes.toString("latin1")).toMatch(/\/FontName \/[A-Z]{6}\+Inter/);
    // Spacing between text runs is layout, not content: compare without whitespace.
    const squash = (t: string) => t.replace(/\s+/g, "");
    const text = squash(await pdfText(bytes));
    for (const expected of [
      "Harrow Creek Custom Finishes",
      "555-0100",
      "Avery Stone",
      "Helmet in candy teal",
      "Helmet shell",
      "Sealer, 2 coats · Candy teal, 4 coats · 2K clear, 3 coats",
      "Prep and paint",
      "10 h × $95.00/h",
      "$950.00",
      "$260.00",
      "$76.00",
      "Subtotal$1,286.00",
      "$24.36",
      "Total$1,310.36",
      "Deposit to book the work (40 %)$524.14",
      "Balance due on collection$786.22",
      "Balance due on collection.",
      "April 30, 2027",
    ]) {
      expect(text).toContain(squash(expected));
    }
    // The customer's copy never shows the shop's cost or markup of materials.
    expect(text).not.toContain("$200.00");
    expect(text).not.toMatch(/markup/i);
    const old = await s.as("estimator").get(`/api/quotes/${q.id}/pdf?version=1`).buffer(true).parse(binary);
    expect(old.status).toBe(200);
    expect((await s.as("estimator").get(`/api/quotes/${q.id}/pdf?version=9`)).status).toBe(404);
  });
});

describe("materials from the finish plan", () => {
  it("a new quote on a planned job takes one materials line per costed layer, at the shop's markup, and the finish in words", async () => {
    const s = await makeShop();
    setSettings(s, {});
    finishFixtures(s);
    const estimate = estimateJobPlan(s.app.deps, s.jobA.id)!;
    expect(estimate.layers[0]!.costCents).toBeGreaterThan(0);
    const res = await s.as("estimator").post("/api/quotes").send({ jobId: s.jobA.id });
    expect(res.body.planAvailable).toBe(true);
    const mats = res.body.current.lines.filter((l: { kind: string }) => l.kind === "materials");
    expect(mats).toEqual([expect.objectContaining({ costCents: estimate.layers[0]!.costCents, markupPercent: 30, layerId: estimate.layers[0]!.layerId, description: expect.stringMatching(/^Clear: materials, about \d+ mL ready to spray$/) })]);
    expect(res.body.current.finishText).toBe("Clear, 1 coat");
    // Cost + 30 % markup, rounded half-up once (shared/quote/totals.ts).
    expect(res.body.current.totals.materialsCents).toBe(estimate.layers[0]!.costCents + Math.round((estimate.layers[0]!.costCents * 30) / 100 + 1e-9));

    // Refilling replaces edited materials lines with the plan's again.
    await editAt(s, "estimator", `/api/quotes/${res.body.id}`, { lines: [{ kind: "materials", description: "Hand-entered paint", costCents: 100, markupPercent: 0 }] });
    const refilled = await s.as("estimator").post(`/api/quotes/${res.body.id}/fill-materials`);
    expect(refilled.status).toBe(200);
    expect(refilled.body.current.lines.map((l: { description: string }) => l.description)).toEqual([mats[0].description]);
  });

  it("without a plan the office is told to plan first", async () => {
    const s = await makeShop();
    const q = await draftQuote(s, s.jobB.id);
    const res = await s.as("estimator").post(`/api/quotes/${q.id}/fill-materials`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/no finish plan/);
  });
});

describe("ready for pickup", () => {
  it("moving a job to Ready e-mails the customer in the background and logs it; the office can send it again", async () => {
    const s = await makeShop();
    s.db.update(jobs).set({ stage: "finishing" }).where(eq(jobs.id, s.jobA.id)).run();
    const move = await s.as("painter").post(`/api/jobs/${s.jobA.id}/stage`).send({ stage: "ready" });
    expect(move.status).toBe(200);
    await expect.poll(() => s.sent.length).toBe(1);
    expect(s.sent[0]).toMatchObject({ to: "avery.stone@example.test", subject: "Ready to collect: Helmet in candy teal" });
    await expect.poll(() => s.db.select().from(jobMessages).all().length).toBe(1);
    const log = await s.as("owner").get(`/api/messages?jobId=${s.jobA.id}`);
    expect(log.body.items[0]).toMatchObject({ kind: "ready_notice", status: "sent", byName: "Sent automatically" });

    // Back to finishing and ready again the same day: no second automatic notice.
    await s.as("painter").post(`/api/jobs/${s.jobA.id}/stage`).send({ stage: "finishing" });
    await s.as("painter").post(`/api/jobs/${s.jobA.id}/stage`).send({ stage: "ready" });
    await new Promise((r) => setTimeout(r, 50));
    expect(s.sent).toHaveLength(1);

    const manual = await s.as("estimator").post("/api/messages/ready-notice").send({ jobId: s.jobA.id });
    expect(manual.status).toBe(201);
    expect(manual.body).toMatchObject({ kind: "ready_notice", status: "sent", byName: "Test estimator" });
    expect(s.sent).toHaveLength(2);
  });

  it("only a ready job can be announced; painters and customers cannot read the message log", async () => {
    const s = await makeShop();
    const res = await s.as("owner").post("/api/messages/ready-notice").send({ jobId: s.jobB.id });
    expect(res.status).toBe(400);
    expect((await s.as("painter").get(`/api/messages?jobId=${s.jobA.id}`)).status).toBe(403);
    expect((await s.as("customer").get(`/api/messages?jobId=${s.jobA.id}`)).status).toBe(403);
    expect((await s.as("owner").get("/api/messages?jobId=99999")).status).toBe(404);
  });
});

describe("painters never see quotes", () => {
  it("every quote route answers 403 to a painter, even for the painter's own job", async () => {
    const s = await makeShop();
    const q = await sentQuote(s);
    for (const [m, path] of [
      ["get", "/api/quotes"],
      ["get", `/api/quotes/${q.id}`],
      ["get", `/api/quotes/${q.id}/pdf`],
      ["get", `/api/quotes/${q.id}/versions/1`],
      ["patch", `/api/quotes/${q.id}`],
      ["post", `/api/quotes/${q.id}/send`],
      ["get", "/api/payments"],
    ] as const) {
      const res = await s.as("painter")[m](path);
      expect({ path, status: res.status }).toEqual({ path, status: 403 });
    }
    // And the painter's job view carries no quote money.
    const job = await s.as("painter").get(`/api/jobs/${s.jobA.id}`);
    expect(JSON.stringify(job.body)).not.toMatch(/totalCents|depositCents/);
  });
});
