import { sql } from "drizzle-orm";
import { integer } from "drizzle-orm/sqlite-core";

/** Times are integer epoch milliseconds; the API sends ISO strings. */
export const createdAt = () => integer("created_at", { mode: "number" }).notNull().default(sql`(unixepoch('subsec') * 1000)`);
export const updatedAt = () => integer("updated_at", { mode: "number" }).notNull().default(sql`(unixepoch('subsec') * 1000)`);
