import { index, integer, real, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { CHANGE_ORDER_KINDS, CHANGE_ORDER_STATUSES } from "../../../shared/domain/change-orders";
import type { QuoteLine, TaxableKind } from "../../../shared/quote/index";
import { jobs, users } from "./core";
import { planVersions } from "./plans";
import { quotes } from "./quotes";
import { createdAt, editVersion, updatedAt } from "./columns";

/**
 * A change to a job after the customer approved its quote. The price difference is a list of quote lines with the
 * tax and deposit terms of the approved quote (`quoteId`); a plan change points at the version the job was on
 * (`fromVersionId`) and the new one (`toVersionId`). Once sent it is not edited; the customer approves or declines it.
 */
export const changeOrders = sqliteTable(
  "change_orders",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    jobId: integer("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "cascade" }),
    quoteId: integer("quote_id")
      .notNull()
      .references(() => quotes.id, { onDelete: "restrict" }),
    kind: text("kind", { enum: CHANGE_ORDER_KINDS }).notNull(),
    status: text("status", { enum: CHANGE_ORDER_STATUSES }).notNull().default("draft"),
    summary: text("summary").notNull(),
    colourChanged: integer("colour_changed", { mode: "boolean" }).notNull().default(false),
    fromVersionId: integer("from_version_id").references(() => planVersions.id, { onDelete: "restrict" }),
    toVersionId: integer("to_version_id").references(() => planVersions.id, { onDelete: "restrict" }),
    lines: text("lines", { mode: "json" }).$type<QuoteLine[]>().notNull(),
    taxPercent: real("tax_percent").notNull(),
    taxedKinds: text("taxed_kinds", { mode: "json" }).$type<TaxableKind[]>().notNull(),
    taxRounding: text("tax_rounding", { enum: ["invoice", "line"] }).notNull().default("invoice"),
    depositPercent: real("deposit_percent").notNull(),
    totalCents: integer("total_cents").notNull().default(0),
    depositCents: integer("deposit_cents").notNull().default(0),
    sentAt: integer("sent_at"),
    sentTo: text("sent_to"),
    sentBy: text("sent_by").references(() => users.id, { onDelete: "set null" }),
    decidedAt: integer("decided_at"),
    decidedVia: text("decided_via", { enum: ["account", "link"] }),
    decidedBy: text("decided_by").references(() => users.id, { onDelete: "set null" }),
    decidedAddress: text("decided_address"),
    decisionName: text("decision_name"),
    decisionNote: text("decision_note"),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ...editVersion(),
  },
  (t) => [index("change_orders_job_idx").on(t.jobId, t.status)],
);
