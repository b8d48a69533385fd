import Database from "better-sqlite3";
import { appendFileSync } from "node:fs";

export type TracedStatement = { sql: string; method: "all" | "get" | "run" | "iterate"; params: unknown[] };

/**
 * Bench only: every statement the process runs through better-sqlite3 is appended to `file` as one JSON line
 * (its SQL, how it was run, its parameters). Installed before the app opens the database; never in the product.
 */
export function traceSql(file: string) {
  const prepare = Database.prototype.prepare;
  Database.prototype.prepare = function (this: Database.Database, source: string) {
    const stmt = prepare.call(this, source) as Database.Statement;
    for (const method of ["all", "get", "run", "iterate"] as const) {
      const original = stmt[method] as (...args: unknown[]) => unknown;
      Object.defineProperty(stmt, method, {
        value(this: Database.Statement, ...params: unknown[]) {
          appendFileSync(file, `${JSON.stringify({ sql: source, method, params } satisfies TracedStatement)}\n`);
          return original.apply(this, params);
        },
      });
    }
    return stmt;
  } as typeof prepare;
}
