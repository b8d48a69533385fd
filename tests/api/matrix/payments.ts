import { all, customerOnly, office, ownerOnly, type MatrixRows } from "./rows";
import { approvedQuote, payDeposit, withPayments } from "../../support/quotes";
import type { Shop } from "../../support/test-app";

async function paid(s: Shop) {
  const si = await withPayments(s);
  const q = await approvedQuote(s);
  await payDeposit(s, si, q.id);
}

export const rows: MatrixRows = {
  "POST /api/payments/checkout": {
    prepare: async (s) => {
      await withPayments(s);
      await approvedQuote(s);
    },
    path: () => "/api/payments/checkout",
    body: () => ({ quoteId: 1 }),
    expect: customerOnly(201),
  },
  // No valid signature from anyone: 400, nothing recorded (who calls does not matter; the signature does).
  "POST /api/payments/webhook": { prepare: (s) => withPayments(s), path: () => "/api/payments/webhook", body: () => ({ id: "evt_fake", type: "checkout.session.completed" }), expect: all(400) },
  "GET /api/payments": { path: () => "/api/payments", expect: office(200) },
  "POST /api/payments/:id/refund": { prepare: paid, path: () => "/api/payments/1/refund", body: () => ({ amountCents: 500 }), expect: ownerOnly(202) },
  // The payment above matches its quote, so it is not flagged: the owner gets 409 "nothing to accept".
  "POST /api/payments/:id/accept": { prepare: paid, path: () => "/api/payments/1/accept", body: () => ({}), expect: ownerOnly(409) },
};
