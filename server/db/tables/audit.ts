import { index, integer, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { users } from "./core";

/**
 * Append-only record of changes to money, finish plans, users and roles, and settings.
 * No route updates or deletes these rows.
 */
export const auditLog = sqliteTable(
  "audit_log",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    at: integer("at").notNull(),
    userId: text("user_id").references(() => users.id, { onDelete: "set null" }),
    userName: text("user_name"),
    address: text("address"),
    /** Area of the change: money, plan, user, settings. */
    kind: text("kind").notNull(),
    /** What was changed, e.g. "quote", "payment", "user", "settings", "plan". */
    entity: text("entity").notNull(),
    entityId: text("entity_id"),
    /** Verb: created, updated, deleted, sent, refunded, role_changed … */
    action: text("action").notNull(),
    before: text("before", { mode: "json" }),
    after: text("after", { mode: "json" }),
  },
  (t) => [index("audit_at_idx").on(t.at), index("audit_kind_at_idx").on(t.kind, t.at), index("audit_user_idx").on(t.userId, t.at)],
);
