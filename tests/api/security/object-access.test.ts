import { beforeAll, describe, expect, it } from "vitest";
import { signQuoteLink } from "../../../server/modules/portal/portal-link";
import { makeDemoShop, type DemoShop } from "../../support/demo-shop";
import type { RouteInfo } from "../../../server/http/route-list";
import { fillPath, idPools, paramSets, type IdPools } from "./id-pools";

/**
 * Object-level access on the full demo shop: the demo customer (and a holder of a link to one of that
 * customer's quotes) changes every id in every route — path, query and body — to another customer's record.
 * Nothing may come back: 401/403/404 for a record route, and no other customer's name, e-mail or job title
 * anywhere in any answer.
 */
let s: DemoShop;
let routes: RouteInfo[];
let own: IdPools;
let foreign: IdPools;
let ownCustomerId: number;
let markers: string[];
let linkToken: string;

beforeAll(async () => {
  s = await makeDemoShop();
  routes = s.app.routes;
  ownCustomerId = s.accounts.customer.customerId!;
  const jobIds = (sql: string) => s.rows<{ id: number }>(sql, ownCustomerId).map((r) => r.id);
  own = idPools(s, jobIds("select id from jobs where customer_id = ? order by id"));
  foreign = idPools(s, jobIds("select id from jobs where customer_id != ? order by id"));
  const ownTitles = new Set(s.rows<{ title: string }>("select title from jobs where customer_id = ?", ownCustomerId).map((r) => r.title));
  markers = [
    ...s.rows<{ name: string; email: string | null }>("select name, email from customers where id != ?", ownCustomerId).flatMap((c) => [c.name, c.email ?? ""]),
    ...s.rows<{ title: string }>("select title from jobs where customer_id != ?", ownCustomerId).map((r) => r.title).filter((t) => !ownTitles.has(t)),
  ].filter((m, i, all) => m.length >= 6 && all.indexOf(m) === i);
  const ownQuote = own.single.quotes![0]!;
  linkToken = signQuoteLink(s.app.deps.appSecret, Number(ownQuote), Date.now() + 86_400_000);
}, 60_000);

/** Sign-in/out and password routes take no record id; signing out mid-sweep would also end the session. */
const sweepable = (r: RouteInfo) => !r.path.startsWith("/api/auth/");
const ownJobs = () => own.single.jobs!.map(Number);

/** Every id-like field a body or query string might carry, all pointing at another customer's records. */
function foreignIds(): Record<string, string | number> {
  const first = (k: string) => foreign.single[k]![0]!;
  return {
    jobId: first("jobs"),
    customerId: first("customers"),
    quoteId: first("quotes"),
    planId: first("plans"),
    mixSheetId: first("mix-sheets"),
    itemId: foreign.nested.items![0]!.child,
    ownerType: "job",
    ownerId: first("jobs"),
    search: markers[0]!,
  };
}

/** A body the route would accept from its rightful owner, so a refusal comes from the access check. */
function bodyFor(r: RouteInfo): object {
  if (r.path.endsWith("/approve")) return { name: "Tobias Wren" };
  if (r.path.endsWith("/decline")) return { reason: "Changed my mind" };
  return foreignIds();
}

const leaked = (text: string) => markers.filter((m) => text.includes(m));

type Viewer = { label: string; who: "customer" | "anonymous"; headers: Record<string, string> };
const viewers = (): Viewer[] => [
  { label: "customer account", who: "customer", headers: {} },
  { label: "quote link", who: "anonymous", headers: { "x-portal-token": linkToken } },
];

/** Makes each call as the viewer; returns every one that was not refused (401/403/404) or that leaked another customer's data. */
async function refusals(v: Viewer, calls: [string, string, object?][]): Promise<string[]> {
  const failures: string[] = [];
  for (const [method, url, body] of calls) {
    let req = s.call(v.who, method, url, v.headers);
    if (body) req = req.send(body);
    const res = await req;
    if (![401, 403, 404].includes(res.status)) failures.push(`${v.label}: ${method} ${url} → ${res.status}`);
    const l = leaked(res.text ?? "");
    if (l.length) failures.push(`${v.label}: ${method} ${url} leaked ${l.join(", ")}`);
  }
  return failures;
}

describe("a customer cannot reach another customer's records", () => {
  it("has records of every kind on other customers' jobs to aim at", () => {
    for (const k of ["jobs", "customers", "quotes", "payments", "plans", "mix-sheets", "uploads", "prep-records", "panels", "coat-logs", "inspections", "panel-sign-offs", "change-orders"])
      expect({ k, found: foreign.single[k]!.length > 0 }).toEqual({ k, found: true });
    for (const k of ["items", "versions", "quoteVersions"]) expect(foreign.nested[k]!.length).toBeGreaterThan(0);
    expect(markers.length).toBeGreaterThan(10);
  });

  for (const viewer of [0, 1]) {
    it(`changing an id in the path gives 401/403/404 and no foreign data, for every route (${["customer account", "quote link"][viewer]})`, async () => {
      const v = viewers()[viewer]!;
      const failures: string[] = [];
      let calls = 0;
      for (const r of routes.filter((x) => sweepable(x) && x.path.includes(":"))) {
        for (const p of paramSets(r.path, foreign, own)) {
          const url = fillPath(r.path, p);
          let req = s.call(v.who, r.method, url, v.headers);
          if (r.method !== "GET" && r.method !== "DELETE") req = req.send(bodyFor(r));
          const res = await req;
          calls++;
          const text = res.text ?? "";
          if (![401, 403, 404].includes(res.status)) failures.push(`${r.method} ${url} → ${res.status}`);
          const l = leaked(text);
          if (l.length) failures.push(`${r.method} ${url} leaked ${l.join(", ")}`);
        }
      }
      expect(failures).toEqual([]);
      expect(calls).toBeGreaterThan(100);
    });

    it(`putting another customer's ids in the query string or body returns none of their data (${["customer account", "quote link"][viewer]})`, async () => {
      const v = viewers()[viewer]!;
      const failures: string[] = [];
      const ids = foreignIds();
      const qs = new URLSearchParams(Object.entries(ids).map(([k, x]) => [k, String(x)])).toString();
      for (const r of routes.filter((x) => sweepable(x) && !x.path.includes(":"))) {
        let req = s.call(v.who, r.method, r.method === "GET" ? `${r.path}?${qs}` : r.path, v.headers);
        if (r.method !== "GET" && r.method !== "DELETE") req = req.send(ids);
        const res = await req;
        if (res.status >= 500) failures.push(`${r.method} ${r.path} → ${res.status}`);
        if (res.status < 300 && r.method !== "GET" && r.path !== "/api/payments/webhook") failures.push(`${r.method} ${r.path} accepted a write → ${res.status}`);
        const l = leaked(res.text ?? "");
        if (l.length) failures.push(`${r.method} ${r.path} leaked ${l.join(", ")}`);
      }
      expect(failures).toEqual([]);
    });
  }

  it("the same calls with the customer's own ids do succeed (so the refusals above are the access check)", async () => {
    const shareable = s.rows<{ id: number }>(`select id from uploads where shareable = 1 and job_id in (${own.single.jobs!.join(",")})`).map((r) => r.id);
    expect(shareable.length).toBeGreaterThan(0);
    const gets = ["/api/jobs/:id", "/api/jobs/:id/items", "/api/jobs/:id/items/:itemId", "/api/jobs/:id/colour", "/api/portal/quotes/:id", "/api/portal/quotes/:id/pdf", "/api/portal/jobs/:id"];
    const statuses: string[] = [];
    for (const path of gets) for (const p of paramSets(path, own)) statuses.push(`${fillPath(path, p)} → ${(await s.call("customer", "GET", fillPath(path, p))).status}`);
    for (const id of shareable) statuses.push(`/api/uploads/${id} → ${(await s.call("customer", "GET", `/api/uploads/${id}`)).status}`);
    const link = await s.call("anonymous", "GET", `/api/portal/quotes/${own.single.quotes![0]}`, { "x-portal-token": linkToken });
    statuses.push(`link /api/portal/quotes/${own.single.quotes![0]} → ${link.status}`);
    expect(statuses.length).toBeGreaterThan(gets.length);
    expect(statuses.filter((x) => !x.endsWith("→ 200"))).toEqual([]);
  });

  it("inspections and panel sign-offs: another customer's are out of reach, by account and by link", async () => {
    const foreignJobs = s.rows<{ job_id: number }>(`select job_id from inspections where job_id in (${foreign.single.jobs!.join(",")})`).map((r) => r.job_id);
    const waiting = s.rows<{ panel_id: number; job_id: number }>(`select panel_id, job_id from panel_sign_offs where status = 'waiting' and job_id in (${foreign.single.jobs!.join(",")})`);
    const photos = s.rows<{ id: number }>(`select id from uploads where owner_type = 'inspection_item' and job_id in (${foreign.single.jobs!.join(",")})`).map((r) => r.id);
    // Records the rightful customer could act on, so a refusal is the access check.
    expect(foreignJobs.length).toBeGreaterThan(0);
    expect(waiting.length).toBeGreaterThan(0);
    expect(photos.length).toBeGreaterThan(0);
    const failures: string[] = [];
    for (const v of viewers()) {
      const calls: [string, string, object?][] = [
        ...foreignJobs.flatMap((id): [string, string, object?][] => [
          ["GET", `/api/jobs/${id}/inspection`],
          ["PUT", `/api/jobs/${id}/inspection`, { version: 1, items: [] }],
          ["GET", `/api/portal/jobs/${id}/colour`],
        ]),
        ...waiting.flatMap((w): [string, string, object?][] => [
          ["POST", `/api/portal/panels/${w.panel_id}/approve`, { name: "Tobias Wren" }],
          ["GET", `/api/portal/jobs/${w.job_id}/colour`],
        ]),
        ...photos.flatMap((id): [string, string, object?][] => [
          ["GET", `/api/uploads/${id}`],
          ["GET", `/api/portal/photos/${id}`],
        ]),
      ];
      failures.push(...(await refusals(v, calls)));
    }
    expect(failures).toEqual([]);
    expect(s.rows<{ n: number }>(`select count(*) as n from panel_sign_offs where status = 'waiting' and job_id in (${foreign.single.jobs!.join(",")})`)[0]!.n).toBe(waiting.length);
  });

  it("the customer's own inspection and colour sign-off do come through", async () => {
    const own = s.rows<{ job_id: number }>(`select job_id from inspections where job_id in (${ownJobs().join(",")})`).map((r) => r.job_id);
    expect(own.length).toBeGreaterThan(0);
    const quote = s.rows<{ id: number }>(`select id from quotes where job_id = ?`, own[0]!)[0]!;
    const res = await s.call("customer", "GET", `/api/portal/quotes/${quote.id}`);
    expect(res.status).toBe(200);
    expect(res.body.inspection.items[0].findings.length).toBeGreaterThan(0);
    expect(res.body.inspection.items[0].photos).toHaveLength(1);
    expect(res.text).not.toContain("shop only");
    const colour = await s.call("customer", "GET", `/api/portal/jobs/${own[0]}/colour`);
    expect(colour.status).toBe(200);
    expect(colour.body.answered).toEqual([expect.objectContaining({ status: "approved", decisionName: "Tobias Wren", decidedAddress: null })]);
  });

  it("change orders: another customer's are out of reach by account and by link; the customer's own come through", async () => {
    const theirs = s.rows<{ id: number; job_id: number }>(`select id, job_id from change_orders where status != 'draft' and job_id in (${foreign.single.jobs!.join(",")})`);
    const mine = s.rows<{ id: number; job_id: number; status: string }>(`select id, job_id, status from change_orders where job_id in (${ownJobs().join(",")})`);
    // Records the rightful customer could act on, so a refusal is the access check.
    expect(theirs.length).toBeGreaterThan(0);
    expect(mine.map((c) => c.status)).toContain("sent");
    const statusesOf = () => s.rows<{ status: string }>(`select status from change_orders where id in (${theirs.map((c) => c.id).join(",")}) order by id`).map((r) => r.status);
    const before = statusesOf();
    const failures: string[] = [];
    for (const v of viewers()) {
      for (const c of theirs) {
        const calls: [string, string, object?][] = [
          ["GET", `/api/portal/change-orders/${c.id}`],
          ["GET", `/api/portal/jobs/${c.job_id}/change-orders`],
          ["POST", `/api/portal/change-orders/${c.id}/approve`, { name: "Tobias Wren" }],
          ["POST", `/api/portal/change-orders/${c.id}/decline`, { reason: "No" }],
          ["POST", `/api/portal/change-orders/${c.id}/checkout`, {}],
          ["GET", `/api/change-orders/${c.id}`],
          ["GET", `/api/jobs/${c.job_id}/change-orders`],
        ];
        failures.push(...(await refusals(v, calls)));
      }
    }
    expect(failures).toEqual([]);
    // Nothing was answered for them.
    expect(statusesOf()).toEqual(before);
    for (const c of mine.filter((x) => x.status !== "draft")) {
      const res = await s.call("customer", "GET", `/api/portal/change-orders/${c.id}`);
      expect(res.status).toBe(200);
      expect(res.body.decidedAddress).toBeNull();
      const list = await s.call("customer", "GET", `/api/portal/jobs/${c.job_id}/change-orders`);
      expect(list.body.items.map((x: { id: number }) => x.id)).toContain(c.id);
    }
  });

  it("lists the customer reads contain only their own jobs", async () => {
    const ownJobs = new Set(own.single.jobs!.map(Number));
    for (const url of ["/api/jobs?pageSize=100", `/api/jobs?pageSize=100&customerId=${foreign.single.customers![0]}`, "/api/portal/jobs", "/api/portal/quotes"]) {
      const res = await s.call("customer", "GET", url);
      expect(res.status).toBe(200);
      const list = (res.body.items ?? res.body) as { id?: number; jobId?: number }[];
      for (const row of list) expect({ url, job: ownJobs.has(Number(row.jobId ?? row.id)) }).toEqual({ url, job: true });
    }
  });
});

