import Database from "better-sqlite3";
import type { TracedStatement } from "./servers/sql-trace";

/** Tables that grow with the shop: a query that scans one of them whole costs more every year. */
export const GROWING_TABLES = [
  "jobs",
  "job_items",
  "job_stage_events",
  "customers",
  "plans",
  "plan_versions",
  "plan_layers",
  "layer_components",
  "prep_records",
  "coat_logs",
  "mix_sheets",
  "mix_sheet_lines",
  "uploads",
  "audit_log",
  "quotes",
  "quote_versions",
  "payments",
  "sessions",
  "test_panels",
];

export type QueryPlan = { route: string; sql: string; plan: string[]; fullScans: string[] };

/**
 * SQLite's EXPLAIN QUERY PLAN for every statement a route ran (as captured), with the full scans of growing tables
 * picked out: "SCAN <table>" without an index. A scan of a small table (settings, users) is fine and not flagged.
 */
export function queryPlans(dbFile: string, routes: { name: string; statements: TracedStatement[] }[]): QueryPlan[] {
  const db = new Database(dbFile, { readonly: true });
  try {
    const out: QueryPlan[] = [];
    for (const route of routes) {
      const seen = new Set<string>();
      for (const st of route.statements) {
        if (seen.has(st.sql)) continue;
        seen.add(st.sql);
        const rows = db.prepare(`EXPLAIN QUERY PLAN ${st.sql}`).all(...(st.params as unknown[])) as { detail: string }[];
        const plan = rows.map((r) => r.detail);
        const fullScans = plan.filter((d) => {
          const m = /^SCAN (\w+)(?: AS \w+)?$/.exec(d.trim());
          return m != null && GROWING_TABLES.includes(m[1]!);
        });
        out.push({ route: route.name, sql: st.sql.replace(/\s+/g, " ").slice(0, 400), plan, fullScans });
      }
    }
    return out;
  } finally {
    db.close();
  }
}
