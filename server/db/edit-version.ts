import { and, eq, sql, type SQL } from "drizzle-orm";
import type { SQLiteColumn, SQLiteTable, SQLiteUpdateSetSource } from "drizzle-orm/sqlite-core";
import type { Db } from "./client";
import { users } from "./schema";
import { versionConflict } from "../http/http-error";

type Versioned = { version: SQLiteColumn };

/**
 * The two parts of an edit under optimistic concurrency, for `UPDATE … SET …, version = version + 1 WHERE id = ? AND
 * version = ?`: the SET additions and the WHERE condition. The update changes no row when someone saved first; the
 * caller then throws `staleEdit`. Both run in the same statement, so two saves at one moment cannot both win.
 */
export function nextVersion(table: Versioned, actorId: string | null) {
  return { version: sql`${table.version} + 1`, updatedBy: actorId };
}
export const atVersion = (table: Versioned, version: number): SQL => eq(table.version, version);

/** The 409 for an edit that lost: the record as it is now (from `current`), and who saved it when. */
export function staleEdit(db: Pick<Db, "select">, what: string, current: unknown, last: { updatedBy: string | null; updatedAt: number | null }) {
  const name = last.updatedBy ? (db.select({ name: users.name }).from(users).where(eq(users.id, last.updatedBy)).get()?.name ?? null) : null;
  return versionConflict(what, current, name, last.updatedAt);
}

type VersionedTable = SQLiteTable & { id: SQLiteColumn; version: SQLiteColumn; updatedBy: SQLiteColumn; updatedAt: SQLiteColumn };

/**
 * One edit of one record under optimistic concurrency: the changes, `version + 1` and who made it, only if the
 * record is still at `version`. When it is not, nothing is written and a 409 carries `current()` (the record as it
 * is now, as its screen shows it) and who saved it when. Call inside the edit's transaction when there is one.
 */
export function updateAtVersion<T extends VersionedTable>(
  db: Pick<Db, "update" | "select">,
  table: T,
  edit: { id: number | string; version: number; actorId: string | null; what: string },
  set: Record<string, unknown>,
  current: () => unknown,
) {
  const done = db
    .update(table)
    .set({ ...set, ...nextVersion(table, edit.actorId) } as SQLiteUpdateSetSource<T>)
    .where(and(eq(table.id, edit.id), atVersion(table, edit.version)))
    .run();
  if (done.changes === 1) return;
  const last = db.select({ updatedBy: table.updatedBy, updatedAt: table.updatedAt }).from(table as SQLiteTable).where(eq(table.id, edit.id)).get() as
    | { updatedBy: string | null; updatedAt: number | null }
    | undefined;
  throw staleEdit(db, edit.what, current(), last ?? { updatedBy: null, updatedAt: null });
}
