import { sql, type SQL, type SQLWrapper } from "drizzle-orm";

/**
 * `column` holds `text` as typed, case-insensitive (SQLite LIKE): "%" and "_" in the text are letters to find,
 * not wildcards, so a search for "50%" or "a_b" finds exactly that.
 */
export function contains(column: SQLWrapper, text: string): SQL {
  const escaped = text.replace(/[\\%_]/g, (c) => `\\${c}`);
  return sql`${column} like ${`%${escaped}%`} escape '\\'`;
}
