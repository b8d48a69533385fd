import { desc, eq } from "drizzle-orm";
import { planVersions, plans } from "../../server/db/schema";
import { documentOf, loadPlanVersion } from "../../server/modules/plans/plans.service";
import { readyForBooth } from "./booth-fixtures";
import { approvedQuote } from "./quotes";
import type { Shop } from "./test-app";
import type { PlanDocument } from "../../shared/schemas/plan.schema";

/** Saves job A's plan through the API with one change made to its latest version's document. */
export async function changePlan(s: Shop, planId: number, change: (doc: PlanDocument) => void) {
  const plan = s.db.select().from(plans).where(eq(plans.id, planId)).get()!;
  const latest = s.db.select().from(planVersions).where(eq(planVersions.planId, planId)).orderBy(desc(planVersions.version)).limit(1).get()!;
  const doc = documentOf(plan.name, plan.description, loadPlanVersion(s.app.deps, latest.id));
  change(doc);
  const res = await s.as("estimator").put(`/api/plans/${planId}`).send({ ...doc, version: plan.version });
  if (res.status !== 200) throw new Error(`save plan: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as { latest: { id: number; version: number } };
}

/** The candy layer (position 1 of the booth fixtures' plan) renamed: a colour change. */
export const newCandy = (doc: PlanDocument) => {
  doc.layers[1]!.name = "Candy cobalt";
};

/** Job A approved by its customer, with a booth-ready plan (v1); then the plan changed to v2: a draft change order. */
export async function jobWithPlanChange(s: Shop) {
  const booth = readyForBooth(s);
  const quote = await approvedQuote(s);
  const saved = await changePlan(s, booth.plan.id, newCandy);
  const list = await s.as("estimator").get(`/api/jobs/${s.jobA.id}/change-orders`);
  const change = list.body.items[0] as { id: number; version: number };
  return { booth, quote, saved, change };
}

/** A price line for a change order: 2 h of extra work at $95. */
export const EXTRA_LINES = [{ kind: "labour" as const, description: "Strip and respray the candy", hours: 2, rateCents: 9500 }];

/** The change order priced and sent to customer A. */
export async function sentChange(s: Shop) {
  const setup = await jobWithPlanChange(s);
  const priced = await s.as("estimator").patch(`/api/change-orders/${setup.change.id}`).send({ lines: EXTRA_LINES, version: setup.change.version });
  if (priced.status !== 200) throw new Error(`price change: ${priced.status} ${JSON.stringify(priced.body)}`);
  const sent = await s.as("estimator").post(`/api/change-orders/${setup.change.id}/send`).send({});
  if (sent.status !== 200) throw new Error(`send change: ${sent.status} ${JSON.stringify(sent.body)}`);
  return { ...setup, change: sent.body as { id: number; version: number } };
}
