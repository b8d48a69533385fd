import { describe, expect, it } from "vitest";
import request from "supertest";
import { eq } from "drizzle-orm";
import { makeApp } from "../support/test-app";
import { seedDemo, DEMO_PASSWORD } from "../../server/db/seed/index";
import { jobs, payments, quoteVersions, quotes } from "../../server/db/schema";
import { computeQuoteTotals } from "../../shared/quote/index";

describe("demo quotes and deposits", () => {
  it("match each job's stage, with totals from the shared function at the demo settings", async () => {
    const t = makeApp();
    await seedDemo(t.db);
    const rows = t.db.select({ stage: jobs.stage, jobId: jobs.id, v: quoteVersions }).from(quoteVersions).innerJoin(quotes, eq(quoteVersions.quoteId, quotes.id)).innerJoin(jobs, eq(quotes.jobId, jobs.id)).all();
    const latestByJob = new Map<number, (typeof rows)[number]>();
    for (const r of rows) if (!latestByJob.has(r.jobId) || latestByJob.get(r.jobId)!.v.version < r.v.version) latestByJob.set(r.jobId, r);
    const latest = [...latestByJob.values()];
    // Booked and later: approved; cancelled: declined; quoted: sent/viewed/approved (one short payment under review).
    for (const r of latest) {
      if (["booked", "in_prep", "in_booth", "curing", "finishing", "ready", "delivered"].includes(r.stage)) expect(r.v.status).toBe("approved");
      if (r.stage === "cancelled") expect(r.v.status).toBe("declined");
      if (r.stage === "quoted") expect(["sent", "viewed", "approved"]).toContain(r.v.status);
      if (r.stage === "inquiry") expect(r.v.status).toBe("draft");
      // Demo settings: tax 7.25 % on materials and supplies, deposit 40 %.
      expect(r.v).toMatchObject({ taxPercent: 7.25, taxedKinds: ["materials", "supplies"], depositPercent: 40 });
      const totals = computeQuoteTotals(r.v.lines, { taxPercent: 7.25, taxedKinds: ["materials", "supplies"], depositPercent: 40 });
      expect([r.v.totalCents, r.v.depositCents]).toEqual([totals.totalCents, totals.depositCents]);
      expect(r.v.lines.filter((l) => l.kind === "labour").every((l) => l.rateCents === 9500)).toBe(true);
    }
    expect(rows.some((r) => r.v.version === 2)).toBe(true);
    // Every booked-or-later job has its deposit on record, matching its quote.
    const paid = t.db.select().from(payments).all();
    const bookedLater = t.db.select().from(jobs).all().filter((j) => ["booked", "in_prep", "in_booth", "curing", "finishing", "ready", "delivered"].includes(j.stage));
    for (const j of bookedLater) {
      const p = paid.find((x) => x.jobId === j.id);
      expect(p).toBeDefined();
      expect(p!.amountCents).toBe(latestByJob.get(j.id)!.v.depositCents);
      expect(p!.flagged).toBe(false);
    }
    expect(paid.filter((p) => p.flagged)).toHaveLength(1);

    // The owner sees an expired quote and the flagged payment; the demo customer has a quote waiting in the portal.
    const owner = request.agent(t.app);
    await owner.post("/api/auth/sign-in").send({ email: "owner@demo.coatwright.test", password: DEMO_PASSWORD });
    expect((await owner.get("/api/quotes?status=expired")).body.total).toBeGreaterThanOrEqual(1);
    expect((await owner.get("/api/payments?flagged=1")).body.items).toHaveLength(1);
    const customer = request.agent(t.app);
    await customer.post("/api/auth/sign-in").send({ email: "customer@demo.coatwright.test", password: DEMO_PASSWORD });
    const mine = await customer.get("/api/portal/quotes");
    expect(mine.body.items.length).toBeGreaterThanOrEqual(2);
    const statuses = mine.body.items.map((q: { status: string }) => q.status);
    expect(statuses).toContain("approved");
    // Something to answer in the demo: a quote waiting for the customer, still valid.
    expect(statuses.some((st: string) => st === "sent" || st === "viewed")).toBe(true);
  });
});
