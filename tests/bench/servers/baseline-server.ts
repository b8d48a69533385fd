/**
 * Child process: the baseline. A bare Express app whose handlers run, through better-sqlite3 statements prepared
 * once, exactly the SQL the real route ran for one request (session lookup included, with the session id taken
 * from the request's cookie), and res.json() the rows. BENCH_BASELINE=<json file>, PORT, BENCH_DB.
 */
import Database from "better-sqlite3";
import express from "express";
import { readFileSync } from "node:fs";
import type { TracedStatement } from "./sql-trace";

export type BaselineRoute = { path: string; sessionId: string; statements: TracedStatement[] };

const routes = JSON.parse(readFileSync(process.env.BENCH_BASELINE!, "utf8")) as BaselineRoute[];
const db = new Database(process.env.BENCH_DB!);
db.pragma("journal_mode = WAL");
db.pragma("foreign_keys = ON");
db.pragma("busy_timeout = 5000");

const app = express();
// The app's API answers are no-store and carry no ETag; the baseline skips hashing its bodies too, so both do the same work.
app.set("etag", false);
for (const route of routes) {
  const steps = route.statements.map((s) => ({ stmt: db.prepare(s.sql), method: s.method === "get" ? "get" : s.method === "run" ? "run" : "all", params: s.params }));
  app.get(route.path, (req, res) => {
    const sessionId = /(?:^|;\s*)cw_session=([^;]+)/.exec(req.headers.cookie ?? "")?.[1];
    if (!sessionId) {
      res.status(401).json({ error: "signed out" });
      return;
    }
    const results = steps.map(({ stmt, method, params }) => {
      const bound = params.map((p) => (p === route.sessionId ? sessionId : p));
      return method === "get" ? stmt.get(...bound) : method === "run" ? stmt.run(...bound).changes : stmt.all(...bound);
    });
    const session = results[0];
    if (session == null || (Array.isArray(session) && session.length === 0)) {
      res.status(401).json({ error: "no session" });
      return;
    }
    res.json(results);
  });
}
const port = Number(process.env.PORT);
app.listen(port, "127.0.0.1", () => console.log(`baseline listening on ${port}`));
process.once("SIGTERM", () => {
  db.close();
  process.exit(0);
});
