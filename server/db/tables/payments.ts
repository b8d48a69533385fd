import { index, integer, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { jobs, users } from "./core";
import { quoteVersions, quotes } from "./quotes";
import { changeOrders } from "./change-orders";
import { createdAt } from "./columns";

/**
 * Checkout sessions the product opened with the payment provider (not payments: those come only from webhooks).
 * At most one per quote is open: opening a new one expires the earlier one at the provider first.
 */
export const checkoutSessions = sqliteTable(
  "checkout_sessions",
  {
    id: text("id").primaryKey(),
    quoteId: integer("quote_id")
      .notNull()
      .references(() => quotes.id, { onDelete: "cascade" }),
    quoteVersionId: integer("quote_version_id")
      .notNull()
      .references(() => quoteVersions.id, { onDelete: "cascade" }),
    jobId: integer("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "cascade" }),
    amountCents: integer("amount_cents").notNull(),
    /** Set when the checkout is for a change order's extra deposit (the quote is the approved one it amends). */
    changeOrderId: integer("change_order_id").references(() => changeOrders.id, { onDelete: "restrict" }),
    currency: text("currency").notNull(),
    url: text("url").notNull(),
    /** The signed-in customer who started it, or null for a quote-link visitor. */
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    via: text("via", { enum: ["account", "link"] }).notNull(),
    /** open until paid (complete) or ended (expired: by a newer checkout for the quote, or by the provider). */
    status: text("status", { enum: ["open", "complete", "expired"] }).notNull().default("open"),
    closedAt: integer("closed_at"),
    createdAt: createdAt(),
  },
  (t) => [index("checkout_sessions_quote_idx").on(t.quoteId, t.status)],
);

/** A deposit received, recorded only from a verified provider webhook; one row per checkout session. */
export const payments = sqliteTable(
  "payments",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    jobId: integer("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "restrict" }),
    quoteId: integer("quote_id")
      .notNull()
      .references(() => quotes.id, { onDelete: "restrict" }),
    quoteVersionId: integer("quote_version_id")
      .notNull()
      .references(() => quoteVersions.id, { onDelete: "restrict" }),
    /** Set when the payment is a change order's extra deposit. */
    changeOrderId: integer("change_order_id").references(() => changeOrders.id, { onDelete: "restrict" }),
    sessionId: text("session_id").notNull(),
    paymentIntentId: text("payment_intent_id").notNull(),
    eventId: text("event_id").notNull(),
    amountCents: integer("amount_cents").notNull(),
    expectedCents: integer("expected_cents").notNull(),
    currency: text("currency").notNull(),
    refundedCents: integer("refunded_cents").notNull().default(0),
    flagged: integer("flagged", { mode: "boolean" }).notNull().default(false),
    flagReason: text("flag_reason"),
    reviewedAt: integer("reviewed_at"),
    reviewedBy: text("reviewed_by").references(() => users.id, { onDelete: "set null" }),
    paidAt: integer("paid_at").notNull(),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("payments_session_idx").on(t.sessionId),
    uniqueIndex("payments_intent_idx").on(t.paymentIntentId),
    uniqueIndex("payments_event_idx").on(t.eventId),
    index("payments_job_idx").on(t.jobId),
    index("payments_quote_idx").on(t.quoteId),
    // Dashboard: deposits by month.
    index("payments_paid_at_idx").on(t.paidAt),
  ],
);

/** A refund, recorded only from a verified provider webhook; unique on the provider's refund id. */
export const refunds = sqliteTable(
  "refunds",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    paymentId: integer("payment_id")
      .notNull()
      .references(() => payments.id, { onDelete: "restrict" }),
    providerRefundId: text("provider_refund_id").notNull(),
    eventId: text("event_id").notNull(),
    amountCents: integer("amount_cents").notNull(),
    reason: text("reason"),
    requestedBy: text("requested_by").references(() => users.id, { onDelete: "set null" }),
    at: integer("at").notNull(),
  },
  (t) => [uniqueIndex("refunds_provider_idx").on(t.providerRefundId), index("refunds_payment_idx").on(t.paymentId)],
);

/** Every provider webhook event applied, by its id: the same event delivered again is acknowledged and skipped. */
export const webhookEvents = sqliteTable("webhook_events", {
  id: text("id").primaryKey(),
  type: text("type").notNull(),
  outcome: text("outcome").notNull(),
  receivedAt: integer("received_at").notNull(),
});
