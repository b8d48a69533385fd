import { index, integer, primaryKey, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { users } from "./core";
import { createdAt } from "./columns";

/**
 * Requests sent with an `Idempotency-Key` header (the tablet's offline queue), one row per key and user. A repeat of
 * a stored key gets the first answer back, from whichever device it comes. `status` is null while the first request
 * is still being handled; only successful answers are kept (a refused request may be sent again with its key).
 */
export const idempotencyKeys = sqliteTable(
  "idempotency_keys",
  {
    key: text("key").notNull(),
    userId: text("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    method: text("method").notNull(),
    path: text("path").notNull(),
    /** sha256 of the method, path and body (the uploaded file's bytes for a photo). */
    fingerprint: text("fingerprint").notNull(),
    status: integer("status"),
    /** The first answer's JSON body. */
    response: text("response"),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.key, t.userId] }), index("idempotency_keys_created_idx").on(t.createdAt)],
);
