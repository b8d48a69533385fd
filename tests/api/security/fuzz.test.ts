import fc from "fast-check";
import { mkdirSync, mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import type request from "supertest";
import { makeShop, type Shop } from "../../support/test-app";
import { swatchPng } from "../../support/booth-fixtures";
import type { RouteInfo } from "../../../server/http/route-list";
import type { MatrixCase, MatrixRows, Who } from "../matrix/rows";
import { mutatedBody, oddFile, oddHeaders, pathSegment, queryKeys, queryString, rawJson } from "./fuzz-inputs";

/**
 * Input fuzzing with fast-check over every route of the API (read from the routers): mutated and malformed
 * JSON bodies, query strings, path parameters, headers and multipart uploads, sent by a caller the route
 * lets in (so the input reaches validation and the service). Never a 500, never a stack trace or internal
 * detail in an answer, and every 4xx has the error shape { error: { code, message } }.
 * FUZZ_RUNS sets the runs per input kind and route; FUZZ_SEED replays a failure fast-check reported.
 */
const RUNS = Number(process.env.FUZZ_RUNS ?? 10);
const SEED = process.env.FUZZ_SEED ? Number(process.env.FUZZ_SEED) : undefined;
const files = import.meta.glob<{ rows?: MatrixRows }>("../matrix/*.ts", { eager: true });
const MATRIX: MatrixRows = Object.assign({}, ...Object.values(files).map((m) => m.rows ?? {}));
const KEYS = queryKeys(import.meta.glob<Record<string, unknown>>("../../../shared/schemas/*.schema.ts", { eager: true }));

/** Internals that must never reach a client: stack frames, file paths, driver and runtime error names. */
const INTERNALS = /\n\s+at\s|\bat [\w$.<>]+ \(|node_modules|\/work\/|\/server\/|SqliteError|SQLITE_|TypeError|ReferenceError|ZodError|RangeError/;

type Res = request.Response;
function check(res: Res, what: string) {
  const text = typeof res.text === "string" ? res.text : "";
  const problems: string[] = [];
  if (res.status >= 500) problems.push(`status ${res.status}`);
  if (INTERNALS.test(text)) problems.push(`internal detail in the answer: ${text.slice(0, 300)}`);
  if (res.status >= 400) {
    const e = res.body?.error;
    if (typeof e?.code !== "string" || typeof e?.message !== "string") problems.push(`4xx without the error shape: ${text.slice(0, 200)}`);
  }
  if (problems.length) throw new Error(`${what} → ${res.status}: ${problems.join("; ")}`);
}

/** The caller that gets furthest into a route: the first role the matrix lets through. */
function callerFor(c: MatrixCase): Who {
  const order: Who[] = ["owner", "customer", "estimator", "painter", "anonymous"];
  return order.find((w) => c.expect[w] < 300) ?? "owner";
}

function send(shop: Shop, who: Who, method: string, url: string) {
  const m = method.toLowerCase() as "get" | "post" | "patch" | "put" | "delete";
  return shop.as(who)[m](url);
}

const assertProp = <T>(arb: fc.Arbitrary<T>, run: (v: T) => Promise<void>) =>
  fc.assert(fc.asyncProperty(arb, run), { numRuns: RUNS, seed: SEED, endOnFailure: true });

describe("fuzzing every route with hostile input", async () => {
  const probe = await makeShop();
  const routes: RouteInfo[] = probe.app.routes;
  const png = await swatchPng();

  it("covers every route the routers list", () => {
    expect(routes.filter((r) => !MATRIX[`${r.method} ${r.path}`])).toEqual([]);
    expect(KEYS.length).toBeGreaterThan(15);
  });

  it("the app shell and static files answer hostile paths and query strings without a 5xx or internals", async () => {
    const clientDir = mkdtempSync(path.join(tmpdir(), "cw-shell-"));
    mkdirSync(path.join(clientDir, "assets"));
    writeFileSync(path.join(clientDir, "index.html"), "<!doctype html><title>Coatwright</title>");
    writeFileSync(path.join(clientDir, "assets", "app.js"), "export {}");
    const shop = await makeShop({ clientDir });
    await assertProp(fc.tuple(fc.constantFrom("", "assets/", "jobs/", "api/"), pathSegment, queryString(KEYS)), async ([dir, seg, qs]) => {
      const res = await shop.as("anonymous").get(`/${dir}${seg}?${qs}`);
      expect(res.status).toBeLessThan(500);
      expect(typeof res.text === "string" && INTERNALS.test(res.text)).toBe(false);
    });
  });

  for (const r of routes) {
    const key = `${r.method} ${r.path}`;
    it(key, async () => {
      const c = MATRIX[key]!;
      const who = callerFor(c);
      // One fresh shop per route; runs may change it (a delete, a stage move): still never a 500.
      const shop = await makeShop({ demoMode: true, outboxDir: probe.app.deps.dataDir });
      await c.prepare?.(shop);
      const url = c.path(shop);
      const valid = c.body?.(shop);
      const join = (u: string, qs: string) => `${u}${u.includes("?") ? "&" : "?"}${qs}`;
      const writes = r.method !== "GET";
      // A 401 would mean the input never got past the guard. (Sign-in and password answer 401 for a wrong
      // password, and the portal for a bad link token, which the query fuzzing sends on purpose.)
      let reachedGuardOnly = 0;
      const own401 = /^\/api\/(auth|portal)\/|^\/api\/payments\/checkout$/.test(r.path);
      const checkIn = (res: Res, what: string) => {
        if (res.status === 401 && !own401) reachedGuardOnly++;
        check(res, what);
      };

      await assertProp(queryString(KEYS), async (qs) => checkIn(await send(shop, who, r.method, join(url, qs)), `${key} ?${qs}`));

      if (r.path.includes(":")) {
        const routeSegs = r.path.split("/");
        const urlSegs = url.split("?")[0]!.split("/");
        const slots = routeSegs.map((s, i) => (s.startsWith(":") ? i : -1)).filter((i) => i >= 0);
        await assertProp(fc.tuple(fc.nat(), pathSegment), async ([n, seg]) => {
          const segs = [...urlSegs];
          segs[slots[n % slots.length]!] = seg;
          checkIn(await send(shop, who, r.method, segs.join("/")), `${key} as ${segs.join("/")}`);
        });
      }

      if (writes) {
        await assertProp(mutatedBody(valid ?? {}), async (b) => {
          const text = JSON.stringify(b) ?? "null";
          checkIn(await send(shop, who, r.method, url).set("Content-Type", "application/json").send(text), `${key} body ${text.slice(0, 200)}`);
        });
        await assertProp(rawJson, async (text) => {
          checkIn(await send(shop, who, r.method, url).set("Content-Type", "application/json").send(text), `${key} raw ${text.slice(0, 120)}`);
        });
        await assertProp(oddFile(png), async (f) => {
          let req = send(shop, who, r.method, url);
          for (const [k, v] of Object.entries(f.fields)) req = req.field(k, v);
          checkIn(await req.attach(f.field, f.data, f.filename), `${key} multipart ${f.field}=${f.filename} ${JSON.stringify(f.fields)}`);
        });
      }

      // The caller was let in, so the hostile input reached validation and the service, not just the guard.
      expect({ key, statuses: reachedGuardOnly }).toEqual({ key, statuses: 0 });

      await assertProp(oddHeaders, async (h) => {
        let req = send(shop, who, r.method, url);
        for (const [k, v] of Object.entries(h)) req = req.set(k, k === "cookie" && who !== "anonymous" ? `${shop.cookies[who as keyof Shop["cookies"]]}; ${v}` : v);
        if (writes) req = req.send(JSON.stringify(valid ?? {}));
        check(await req, `${key} headers ${JSON.stringify(h)}`);
      });
    }, 30_000 + RUNS * 2_000);
  }
});
