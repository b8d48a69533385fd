/**
 * Child process: the baseline. A bare Express app whose handlers run, through better-sqlite3 statements prepared
 * once, exactly the SQL the real route ran for one request (session lookup included, with the session id taken
 * from the request's cookie), and res.json() the rows; a write's statements run in one transaction.
 * BENCH_BASELINE=<json file>, PORT, BENCH_DB.
 */
import Database from "better-sqlite3";
import express from "express";
import { readFileSync } from "node:fs";
import type { TracedStatement } from "./sql-trace";

/**
 * What a write request changes in the captured statements: the job, layer and plan version of a coat; the sheet and
 * its lines of a recorded batch. The baseline swaps the captured ids for the request's, as the app works on the
 * record it is sent, so neither piles every write onto one record.
 */
export type Vary = { kind: "coat"; jobId: number; layerId: number; versionId: number } | { kind: "record"; sheetId: number; lineIds: number[] };
export type BaselineRoute = { path: string; method: "GET" | "POST"; sessionId: string; statements: TracedStatement[]; vary?: Vary };

const routes = JSON.parse(readFileSync(process.env.BENCH_BASELINE!, "utf8")) as BaselineRoute[];
const db = new Database(process.env.BENCH_DB!);
db.pragma("journal_mode = WAL");
db.pragma("foreign_keys = ON");
db.pragma("busy_timeout = 5000");

const app = express();
// The app's API answers are no-store and carry no ETag; the baseline skips hashing its bodies too, so both do the same work.
app.set("etag", false);
const versionOfLayer = db.prepare("select version_id from plan_layers where id = ?").pluck();
const linesOfSheet = db.prepare("select id from mix_sheet_lines where mix_sheet_id = ? order by position, id").pluck();

/** Captured id → the request's, for a write (an empty map for a read). */
function swaps(vary: Vary | undefined, req: express.Request): Map<unknown, unknown> {
  if (!vary) return new Map();
  if (vary.kind === "coat") {
    const { jobId, layerId } = req.body as { jobId: number; layerId: number };
    return new Map<unknown, unknown>([
      [vary.jobId, jobId],
      [vary.layerId, layerId],
      [vary.versionId, versionOfLayer.get(layerId)],
    ]);
  }
  const sheetId = Number(req.params.id);
  const lines = linesOfSheet.all(sheetId) as number[];
  return new Map<unknown, unknown>([[vary.sheetId, sheetId], ...vary.lineIds.map((id, i) => [id, lines[i] ?? id] as [unknown, unknown])]);
}

for (const route of routes) {
  const steps = route.statements.map((s) => ({ stmt: db.prepare(s.sql), method: s.method === "get" ? "get" : s.method === "run" ? "run" : "all", params: s.params }));
  const replay = (sessionId: string, swap: Map<unknown, unknown>) =>
    steps.map(({ stmt, method, params }) => {
      const bound = params.map((p) => (p === route.sessionId ? sessionId : swap.has(p) ? swap.get(p) : p));
      return method === "get" ? stmt.get(...bound) : method === "run" ? stmt.run(...bound).changes : stmt.all(...bound);
    });
  // A write runs its statements in one transaction, as plain better-sqlite3 would.
  const inTransaction = db.transaction(replay);
  const handler: express.RequestHandler = (req, res) => {
    const sessionId = /(?:^|;\s*)cw_session=([^;]+)/.exec(req.headers.cookie ?? "")?.[1];
    if (!sessionId) {
      res.status(401).json({ error: "signed out" });
      return;
    }
    const results = route.method === "POST" ? inTransaction(sessionId, swaps(route.vary, req)) : replay(sessionId, new Map());
    const session = results[0];
    if (session == null || (Array.isArray(session) && session.length === 0)) {
      res.status(401).json({ error: "no session" });
      return;
    }
    res.status(route.method === "POST" ? 201 : 200).json(results);
  };
  if (route.method === "GET") app.get(route.path, handler);
  else app.post(route.vary?.kind === "record" ? "/api/mix-sheets/:id/record" : route.path, express.json(), handler);
}
const port = Number(process.env.PORT);
app.listen(port, "127.0.0.1", () => console.log(`baseline listening on ${port}`));
process.once("SIGTERM", () => {
  db.close();
  process.exit(0);
});
