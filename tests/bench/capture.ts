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

/**
 * Runs the real app once with SQL tracing on, makes one request to each read route, and keeps the statements each
 * request ran: the baseline replays exactly these. Sessions are made here too (they live in the database).
 */
export async function captureSql(env: Record<string, string>, workDir: string, reads: { name: string; url: string; email: string }[]) {
  const traceFile = path.join(workDir, "sql-trace.jsonl");
  writeFileSync(traceFile, "");
  const app = await startChild("tests/bench/servers/app-server.ts", { ...env, BENCH_SQL_TRACE: traceFile });
  try {
    const cookies = new Map<string, string>();
    const routes: (BaselineRoute & { name: string })[] = [];
    for (const r of reads) {
      if (!cookies.has(r.email)) cookies.set(r.email, await signIn(app.url, r.email));
      const cookie = cookies.get(r.email)!;
      await fetch(app.url + r.url, { headers: { cookie } }); // warm: the first request of a process may do one-off work
      const from = statSync(traceFile).size;
      const res = await fetch(app.url + r.url, { headers: { cookie } });
      if (res.status !== 200) throw new Error(`${r.url} answered ${res.status} while capturing SQL`);
      await res.arrayBuffer();
      const statements = readFileSync(traceFile).subarray(from).toString("utf8").trim().split("\n").map((l) => JSON.parse(l) as TracedStatement);
      routes.push({ name: r.name, path: new URL(r.url, app.url).pathname, sessionId: sessionIdOf(cookie), statements });
    }
    return { cookies, routes };
  } finally {
    await app.stop();
  }
}
