import { readFileSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import type { BaselineRoute } from "./servers/baseline-server";
import { startChild } from "./servers/processes";
import type { TracedStatement } from "./servers/sql-trace";

export const DEMO_PASSWORD = "paintshop-demo";

/** Signs in through the API; returns the Cookie header value. */
export async function signIn(baseUrl: string, email: string): Promise<string> {
  const res = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  if (!res.ok) throw new Error(`sign-in as ${email} failed: ${res.status}`);
  return res.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
}

export const sessionIdOf = (cookie: string) => /cw_session=([^;]+)/.exec(cookie)![1]!;

/** A route to capture: GETs are warmed with the same request; a write names its own warm-up (another coat, another sheet). */
export type CaptureRoute = {
  name: string;
  url: string;
  email: string;
  method?: "GET" | "POST";
  body?: unknown;
  warm?: { url: string; body?: unknown };
};

/** Statements that belong to a transaction's frame, not to the work (the baseline wraps writes in its own transaction). */
const FRAME = /^\s*(savepoint|release|rollback|begin|commit)\b/i;

/**
 * Runs the real app once with SQL tracing on, makes one request to each route, and keeps the statements each
 * request ran: the baseline replays exactly these. Sessions are made here too (they live in the database).
 */
export async function captureSql(env: Record<string, string>, workDir: string, routes: CaptureRoute[]) {
  const traceFile = path.join(workDir, "sql-trace.jsonl");
  writeFileSync(traceFile, "");
  const app = await startChild("tests/bench/servers/app-server.ts", { ...env, BENCH_SQL_TRACE: traceFile });
  try {
    const cookies = new Map<string, string>();
    const captured: (BaselineRoute & { name: string })[] = [];
    for (const r of routes) {
      if (!cookies.has(r.email)) cookies.set(r.email, await signIn(app.url, r.email));
      const cookie = cookies.get(r.email)!;
      const method = r.method ?? "GET";
      const send = (url: string, body: unknown) =>
        fetch(app.url + url, { method, headers: { cookie, ...(body === undefined ? {} : { "content-type": "application/json" }) }, body: body === undefined ? undefined : JSON.stringify(body) });
      // Warm: the first request of a process may do one-off work (a write warms with a request of its own).
      const warm = r.warm ?? (method === "GET" ? { url: r.url } : null);
      if (warm) await (await send(warm.url, warm.body)).arrayBuffer();
      const from = statSync(traceFile).size;
      const res = await send(r.url, r.body);
      if (res.status >= 300) throw new Error(`${method} ${r.url} answered ${res.status} while capturing SQL: ${await res.text()}`);
      await res.arrayBuffer();
      const statements = readFileSync(traceFile)
        .subarray(from)
        .toString("utf8")
        .trim()
        .split("\n")
        .map((l) => JSON.parse(l) as TracedStatement)
        .filter((st) => !FRAME.test(st.sql));
      captured.push({ name: r.name, method, path: new URL(r.url, app.url).pathname, sessionId: sessionIdOf(cookie), statements });
    }
    return { cookies, routes: captured };
  } finally {
    await app.stop();
  }
}
