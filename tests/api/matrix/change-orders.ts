import { customerOnly, office, staff, type MatrixRows } from "./rows";
import { readyForBooth } from "../../support/booth-fixtures";
import { approvedQuote, withPayments } from "../../support/quotes";
import { jobWithPlanChange, sentChange } from "../../support/change-orders";
import type { Shop } from "../../support/test-app";

/** Change order 1 sent to customer A and approved by them, with payments set up for its extra deposit. */
async function approvedChange(s: Shop) {
  await withPayments(s);
  await sentChange(s);
  const ok = await s.as("customer").post("/api/portal/change-orders/1/approve").send({ name: "Avery Stone" });
  if (ok.status !== 200) throw new Error(`approve change: ${ok.status} ${JSON.stringify(ok.body)}`);
}

export const rows: MatrixRows = {
  "GET /api/jobs/:id/change-orders": { path: (s) => `/api/jobs/${s.jobA.id}/change-orders`, prepare: jobWithPlanChange, expect: staff(200) },
  "POST /api/jobs/:id/change-orders": {
    path: (s) => `/api/jobs/${s.jobA.id}/change-orders`,
    prepare: async (s) => {
      readyForBooth(s);
      await approvedQuote(s);
    },
    body: () => ({ kind: "prep", summary: "Rust under the badge after stripping", lines: [{ kind: "labour", description: "Rust repair", hours: 1.5, rateCents: 9500 }] }),
    expect: office(201),
  },
  "GET /api/change-orders/:id": { path: () => "/api/change-orders/1", prepare: jobWithPlanChange, expect: staff(200) },
  "PATCH /api/change-orders/:id": { path: () => "/api/change-orders/1", prepare: jobWithPlanChange, body: () => ({ summary: "Candy cobalt instead of garnet", version: 1 }), expect: office(200) },
  "POST /api/change-orders/:id/send": { path: () => "/api/change-orders/1/send", prepare: jobWithPlanChange, body: () => ({}), expect: office(200) },
  "GET /api/portal/jobs/:id/change-orders": { path: (s) => `/api/portal/jobs/${s.jobA.id}/change-orders`, prepare: sentChange, expect: customerOnly(200) },
  "GET /api/portal/change-orders/:id": { path: () => "/api/portal/change-orders/1", prepare: sentChange, expect: customerOnly(200) },
  "POST /api/portal/change-orders/:id/approve": { path: () => "/api/portal/change-orders/1/approve", prepare: sentChange, body: () => ({ name: "Avery Stone" }), expect: customerOnly(200) },
  "POST /api/portal/change-orders/:id/decline": { path: () => "/api/portal/change-orders/1/decline", prepare: sentChange, body: () => ({ reason: "Keep the garnet" }), expect: customerOnly(200) },
  "POST /api/portal/change-orders/:id/checkout": { path: () => "/api/portal/change-orders/1/checkout", prepare: approvedChange, body: () => ({}), expect: customerOnly(201) },
};
