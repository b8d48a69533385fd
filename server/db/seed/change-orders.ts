import { asc, desc, eq } from "drizzle-orm";
import { changeOrders, customers, layerComponents, planLayers, planVersions, plans } from "../schema";
import { getSettings } from "../../modules/settings/settings.service";
import { approvedQuoteOf, changeDue, onTimeline, pairsOf } from "../../modules/change-orders/change-order-rows";
import { colourChangedIn } from "../../../shared/domain/change-orders";
import type { SeedContext } from "./core";

/**
 * Demo change orders:
 *  - the demo customer's hood scoop, in prep: the shop wants one more coat of candy for depth (plan version 2); the
 *    change was sent and waits for the customer, so the booth card holds the candy layer;
 *  - another customer's full-face helmet, in the booth: pinholes in the chin bar found after stripping, extra prep that
 *    the customer approved in the portal.
 */
const HOUR = 3_600_000;

/** A copy of a version's layers as the next version, with one change made to the candy layer. */
function nextVersionWithMoreCandy(ctx: SeedContext, planId: number, by: string, at: number): number | null {
  const from = ctx.db.select().from(planVersions).where(eq(planVersions.planId, planId)).orderBy(desc(planVersions.version)).limit(1).get();
  if (!from) return null;
  const to = ctx.db.insert(planVersions).values({ planId, version: from.version + 1, note: "One more coat of candy for depth", createdBy: by, createdAt: at }).returning({ id: planVersions.id }).get().id;
  for (const layer of ctx.db.select().from(planLayers).where(eq(planLayers.versionId, from.id)).orderBy(asc(planLayers.position)).all()) {
    const { id, versionId: _v, ...rest } = layer;
    const copy = ctx.db.insert(planLayers).values({ ...rest, versionId: to, coats: layer.kind === "candy" ? layer.coats + 1 : layer.coats }).returning({ id: planLayers.id }).get().id;
    for (const c of ctx.db.select().from(layerComponents).where(eq(layerComponents.layerId, id)).all()) {
      const { id: _c, layerId: _l, ...comp } = c;
      ctx.db.insert(layerComponents).values({ ...comp, layerId: copy }).run();
    }
  }
  return to;
}

export function seedChangeOrders(ctx: SeedContext) {
  const demoCustomer = ctx.customerIds[0]!;
  const rate = getSettings({ db: ctx.db }).labourRateCents;
  const est = ctx.userIds.estimator;

  const scoop = ctx.jobs.find((j) => j.customerId === demoCustomer && j.stage === "in_prep");
  const scoopQuote = scoop && approvedQuoteOf(ctx.db, scoop.id);
  const scoopPlan = scoop && ctx.db.select().from(plans).where(eq(plans.jobId, scoop.id)).get();
  if (scoop && scoopQuote && scoopPlan) {
    const at = ctx.now - 20 * HOUR;
    const fromVersionId = ctx.db.select({ id: planVersions.id }).from(planVersions).where(eq(planVersions.planId, scoopPlan.id)).orderBy(desc(planVersions.version)).limit(1).get()!.id;
    const toVersionId = nextVersionWithMoreCandy(ctx, scoopPlan.id, est, at)!;
    const lines = [
      { kind: "labour" as const, description: "One more candy coat, with flash and tack", hours: 0.75, rateCents: rate },
      { kind: "materials" as const, description: "Candy for the extra coat", costCents: 2400, markupPercent: 30 },
    ];
    const id = ctx.db
      .insert(changeOrders)
      .values({
        jobId: scoop.id,
        quoteId: scoopQuote.quoteId,
        kind: "plan",
        status: "sent",
        summary: "One more coat of candy on the scoop for a deeper colour, as we talked about at drop-off",
        colourChanged: colourChangedIn(pairsOf(ctx.db, { fromVersionId, toVersionId })),
        fromVersionId,
        toVersionId,
        lines,
        taxPercent: scoopQuote.taxPercent,
        taxedKinds: scoopQuote.taxedKinds,
        taxRounding: scoopQuote.taxRounding,
        depositPercent: scoopQuote.depositPercent,
        sentAt: at + HOUR,
        sentTo: customerOf(ctx, scoop.customerId).email,
        sentBy: est,
        createdBy: est,
        createdAt: at,
        updatedAt: at + HOUR,
        updatedBy: est,
        version: 2,
      })
      .returning({ id: changeOrders.id })
      .get().id;
    settleMoney(ctx, id);
    onTimeline(ctx.db, scoop.id, `Change order #${id} opened: finish plan version 2 waits for the customer`, est, at);
    onTimeline(ctx.db, scoop.id, `Change order #${id} sent to the customer`, est, at + HOUR);
  }

  const helmet = ctx.jobs.find((j) => j.customerId !== demoCustomer && j.stage === "in_booth" && j.title.startsWith("Full-face helmet"));
  const helmetQuote = helmet && approvedQuoteOf(ctx.db, helmet.id);
  if (helmet && helmetQuote) {
    const at = ctx.now - 3 * 24 * HOUR;
    const id = ctx.db
      .insert(changeOrders)
      .values({
        jobId: helmet.id,
        quoteId: helmetQuote.quoteId,
        kind: "prep",
        status: "approved",
        summary: "Pinholes in the fibreglass of the chin bar showed after stripping: open, fill and seal them before the sealer",
        colourChanged: false,
        lines: [{ kind: "labour", description: "Pinhole repair on the chin bar", hours: 1.5, rateCents: rate }],
        taxPercent: helmetQuote.taxPercent,
        taxedKinds: helmetQuote.taxedKinds,
        taxRounding: helmetQuote.taxRounding,
        depositPercent: helmetQuote.depositPercent,
        sentAt: at + HOUR,
        sentTo: customerOf(ctx, helmet.customerId).email,
        sentBy: est,
        decidedAt: at + 5 * HOUR,
        decidedVia: "link",
        decidedAddress: "203.0.113.24",
        decisionName: customerOf(ctx, helmet.customerId).name,
        createdBy: est,
        createdAt: at,
        updatedAt: at + 5 * HOUR,
        updatedBy: null,
        version: 3,
      })
      .returning({ id: changeOrders.id })
      .get().id;
    settleMoney(ctx, id);
    onTimeline(ctx.db, helmet.id, `Change order #${id} opened: pinholes in the chin bar after stripping`, est, at);
    onTimeline(ctx.db, helmet.id, `Change order #${id} approved by the customer`, null, at + 5 * HOUR, "system");
  }
}

/** Stores the totals the lines give (as the service does on every edit). */
function settleMoney(ctx: SeedContext, id: number) {
  const due = changeDue(ctx.db, id)!;
  const row = ctx.db.select().from(changeOrders).where(eq(changeOrders.id, id)).get()!;
  ctx.db.update(changeOrders).set({ totalCents: due.totalCents, depositCents: due.depositCents }).where(eq(changeOrders.id, row.id)).run();
}

const customerOf = (ctx: SeedContext, id: number) => ctx.db.select({ name: customers.name, email: customers.email }).from(customers).where(eq(customers.id, id)).get()!;
