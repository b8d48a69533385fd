import { integer, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { createdAt, updatedAt, editVersion } from "./columns";

/** The shop's spray guns, named as the shop knows them; coat logs and test panels say which one was used. */
export const guns = sqliteTable("guns", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  name: text("name").notNull(),
  description: text("description"),
  active: integer("active", { mode: "boolean" }).notNull().default(true),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
  ...editVersion(),
});
