import { integer, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { users } from "./core";

/** The shop's settings: a single row (id = 1). Values are JSON validated by shared/schemas/settings.schema.ts. */
export const shopSettings = sqliteTable("shop_settings", {
  id: integer("id").primaryKey(),
  data: text("data", { mode: "json" }).notNull(),
  updatedAt: integer("updated_at").notNull(),
  /** Goes up with every save; a save must name the version it read (see editVersion in columns.ts). */
  version: integer("version").notNull().default(1),
  updatedBy: text("updated_by").references(() => users.id, { onDelete: "set null" }),
});
