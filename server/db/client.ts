import Database from "better-sqlite3";
import { drizzle, type BetterSQLite3Database } from "drizzle-orm/better-sqlite3";
import { migrate } from "drizzle-orm/better-sqlite3/migrator";
import { fileURLToPath } from "node:url";
import * as schema from "./schema";

export type Db = BetterSQLite3Database<typeof schema> & { $client: Database.Database };

/** The database or a transaction on it: what a helper that reads and writes inside someone's transaction takes. */
export type Tx = Pick<Db, "select" | "insert" | "update" | "delete">;

export const MIGRATIONS_FOLDER = fileURLToPath(new URL("../../drizzle", import.meta.url));

/** Opens (or creates) the SQLite file with WAL and foreign keys on. Pass ":memory:" for a throwaway db, or a
 * serialized database (a Buffer) to start an in-memory copy of it. */
export function openDb(file: string | Buffer): Db {
  const sqlite = new Database(file);
  sqlite.pragma("journal_mode = WAL");
  sqlite.pragma("foreign_keys = ON");
  sqlite.pragma("synchronous = NORMAL");
  sqlite.pragma("busy_timeout = 5000");
  reuseStatements(sqlite);
  return drizzle({ client: sqlite, schema }) as Db;
}

/**
 * Drizzle asks better-sqlite3 to prepare every query it runs, and compiling the SQL again each time costs about as
 * much as running a small query. Keep the compiled statements (the most recently used STATEMENT_CACHE of them) and
 * hand them back in their default mode (objects, not raw rows or plucked values).
 */
const STATEMENT_CACHE = 500;
function reuseStatements(sqlite: Database.Database) {
  const cache = new Map<string, Database.Statement>();
  const prepare = sqlite.prepare.bind(sqlite);
  sqlite.prepare = ((source: string) => {
    let stmt = cache.get(source);
    if (stmt && !stmt.busy) {
      cache.delete(source);
      if (stmt.reader) stmt.raw(false).pluck(false).expand(false);
    } else {
      stmt = stepWritesToTheEnd(prepare(source));
      if (cache.size >= STATEMENT_CACHE) cache.delete(cache.keys().next().value!);
    }
    cache.set(source, stmt);
    return stmt;
  }) as typeof sqlite.prepare;
}

/**
 * An INSERT/UPDATE/DELETE … RETURNING read with `.get()` hands back its first row before the statement has finished,
 * and outside a transaction the commit happens when the statement is reset, where better-sqlite3 drops any error: on
 * a full disk `.get()` returned a new id for a row that was never stored. Such a statement's `.get()` here steps it to
 * the end (`.all()`), so a failed commit throws (SQLITE_FULL) like every other write.
 */
function stepWritesToTheEnd(stmt: Database.Statement): Database.Statement {
  if (stmt.reader && !stmt.readonly) {
    const all = stmt.all.bind(stmt);
    stmt.get = ((...args: unknown[]) => all(...args)[0]) as Database.Statement["get"];
  }
  return stmt;
}

export function migrateDb(db: Db, migrationsFolder = MIGRATIONS_FOLDER): void {
  migrate(db, { migrationsFolder });
}
