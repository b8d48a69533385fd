import { index, integer, real, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { jobs, users } from "./core";
import { createdAt, updatedAt, editVersion } from "./columns";
import { STORED_QUOTE_STATUSES } from "../../../shared/schemas/quote.schema";
import { MESSAGE_KINDS } from "../../../shared/schemas/message.schema";
import type { QuoteLine, TaxableKind } from "../../../shared/quote/index";

/** A quote for a job. Its content lives in versions; only the latest version may be a draft. */
export const quotes = sqliteTable(
  "quotes",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    jobId: integer("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "cascade" }),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ...editVersion(),
  },
  (t) => [index("quotes_job_idx").on(t.jobId), index("quotes_updated_idx").on(t.updatedAt)],
);

/**
 * One version of a quote. A draft is edited in place; once sent it never changes again (apart from its
 * status: viewed, approved, declined), and a change makes the next version. Money columns are integer cents,
 * computed by shared/quote computeQuoteTotals and stored for lists and reports.
 */
export const quoteVersions = sqliteTable(
  "quote_versions",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    quoteId: integer("quote_id")
      .notNull()
      .references(() => quotes.id, { onDelete: "cascade" }),
    version: integer("version").notNull(),
    status: text("status", { enum: STORED_QUOTE_STATUSES }).notNull().default("draft"),
    lines: text("lines", { mode: "json" }).$type<QuoteLine[]>().notNull(),
    taxPercent: real("tax_percent").notNull(),
    taxedKinds: text("taxed_kinds", { mode: "json" }).$type<TaxableKind[]>().notNull(),
    taxRounding: text("tax_rounding", { enum: ["invoice", "line"] }).notNull().default("invoice"),
    depositPercent: real("deposit_percent").notNull(),
    /** Calendar date (YYYY-MM-DD); after it the quote reads as expired. */
    validUntil: text("valid_until").notNull(),
    intro: text("intro"),
    terms: text("terms"),
    /** The finish in plain words, for the customer. */
    finishText: text("finish_text"),
    subtotalCents: integer("subtotal_cents").notNull().default(0),
    taxCents: integer("tax_cents").notNull().default(0),
    totalCents: integer("total_cents").notNull().default(0),
    depositCents: integer("deposit_cents").notNull().default(0),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    sentAt: integer("sent_at"),
    sentBy: text("sent_by").references(() => users.id, { onDelete: "set null" }),
    sentTo: text("sent_to"),
    viewedAt: integer("viewed_at"),
    decidedAt: integer("decided_at"),
    decidedVia: text("decided_via", { enum: ["account", "link"] }),
    decidedBy: text("decided_by").references(() => users.id, { onDelete: "set null" }),
    decidedAddress: text("decided_address"),
    decisionName: text("decision_name"),
    decisionNote: text("decision_note"),
    /** Set when a later version is sent in its place. */
    supersededAt: integer("superseded_at"),
  },
  (t) => [uniqueIndex("quote_versions_quote_version_idx").on(t.quoteId, t.version), index("quote_versions_status_idx").on(t.status)],
);

/** Every e-mail sent (or attempted) about a job: quotes, deposit receipts, ready-for-pickup notices. Append-only. */
export const jobMessages = sqliteTable(
  "job_messages",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    jobId: integer("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "cascade" }),
    quoteVersionId: integer("quote_version_id").references(() => quoteVersions.id, { onDelete: "set null" }),
    kind: text("kind", { enum: MESSAGE_KINDS }).notNull(),
    to: text("to").notNull(),
    subject: text("subject").notNull(),
    status: text("status", { enum: ["sent", "failed"] }).notNull(),
    error: text("error"),
    attachments: text("attachments", { mode: "json" }).$type<string[]>().notNull(),
    providerMessageId: text("provider_message_id"),
    sentBy: text("sent_by").references(() => users.id, { onDelete: "set null" }),
    at: integer("at").notNull(),
  },
  (t) => [index("job_messages_job_idx").on(t.jobId, t.at)],
);
