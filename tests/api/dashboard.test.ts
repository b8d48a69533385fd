import { describe, expect, it } from "vitest";
import { makeShop, addJob } from "../support/test-app";
import { addMixedBatch } from "../support/batches";
import { approvedQuote, payDeposit, withPayments } from "../support/quotes";
import { coatLogs, jobStageEvents } from "../../server/db/schema";

describe("dashboard", () => {
  it("counts jobs by stage and lists due-this-week and overdue jobs from the records", async () => {
    const now = new Date(2027, 2, 10, 12).getTime();
    const s = await makeShop({ now: () => now });
    addJob(s, s.customerB.id, { title: "Overdue tank", stage: "in_booth", dueDate: "2027-03-01" });
    addJob(s, s.customerB.id, { title: "Due Friday", stage: "booked", dueDate: "2027-03-12" });
    addJob(s, s.customerB.id, { title: "Ready, late but done", stage: "ready", dueDate: "2027-03-01" });
    const res = await s.as("estimator").get("/api/dashboard");
    expect(res.status).toBe(200);
    const byStage = Object.fromEntries(res.body.jobs.byStage.map((r: { stage: string; count: number }) => [r.stage, r.count]));
    expect(byStage).toMatchObject({ in_prep: 2, inquiry: 1, in_booth: 1, booked: 1, ready: 1, delivered: 0 });
    expect(res.body.jobs.overdue.map((j: { title: string }) => j.title)).toEqual(["Overdue tank"]);
    expect(res.body.jobs.dueThisWeek.map((j: { title: string }) => j.title)).toEqual(["Due Friday"]);
    // The estimator sees the jobs part only: no money at all.
    expect(res.body.money).toBeNull();
  });

  it("gives the owner deposits received and outstanding, revenue by month, material spend and booth hours", async () => {
    const s = await makeShop();
    const si = await withPayments(s);
    const paidQuote = await approvedQuote(s, s.jobA.id);
    const { webhook } = await payDeposit(s, si, paidQuote.id);
    expect(webhook.status).toBe(200);
    const waiting = await approvedQuote(s, s.inquiryA.id);

    addMixedBatch(s, s.jobA.id, {
      layerKind: "clear",
      mixedAt: new Date(),
      lines: [
        { ml: 400, vocGPerL: 420, category: "clear", costCents: 4012 },
        { ml: 100, vocGPerL: 300, category: "hardener", costCents: 1999 },
      ],
    });
    const batch = addMixedBatch(s, s.jobA.id, { layerKind: "candy", mixedAt: new Date(), lines: [{ ml: 300, vocGPerL: 500, category: "clear", costCents: 1000 }] });
    // Three coats by the painter on a layer of 5 minutes per coat (the default), one of them corrected by a later entry.
    const base = { jobId: s.jobA.id, planVersionId: batch.planVersionId, layerId: batch.layerId, painterId: s.painter.id };
    const first = s.db.insert(coatLogs).values({ ...base, coatNumber: 1, at: Date.now() - 60_000 }).returning().get();
    s.db.insert(coatLogs).values({ ...base, coatNumber: 1, at: Date.now() - 50_000, correctsId: first.id, correctionReason: "time" }).run();
    s.db.insert(coatLogs).values({ ...base, coatNumber: 2, at: Date.now() - 30_000 }).run();
    s.db.insert(jobStageEvents).values({ jobId: s.jobA.id, fromStage: "ready", toStage: "delivered", at: Date.now() }).run();

    const res = await s.as("owner").get("/api/dashboard");
    const money = res.body.money;
    expect(money.deposits.receivedCents).toBe(paidQuote.depositCents);
    expect(money.deposits.outstandingCents).toBe(waiting.depositCents);
    expect(money.deposits.outstandingQuotes).toBe(1);
    const thisMonth = money.revenueByMonth.at(-1);
    expect(money.revenueByMonth).toHaveLength(12);
    expect(thisMonth.depositsCents).toBe(paidQuote.depositCents);
    expect(thisMonth.deliveredCents).toBe(paidQuote.totalCents);
    expect(money.materialSpendByCategory).toEqual([
      { category: "clear", costCents: 5012 },
      { category: "hardener", costCents: 1999 },
    ]);
    expect(money.boothHoursByPainter).toEqual([{ painterId: s.painter.id, painterName: "Test painter", hours: (2 * 5) / 60, coats: 2 }]);
  });
});
