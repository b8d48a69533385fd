import { describe, expect, it } from "vitest";
import { makeShop, type Shop } from "../support/test-app";
import type { RouteInfo } from "../../server/http/route-list";

/**
 * Every API route × every role plus anonymous, with the status each must get.
 * The list of routes is read from the app's routers, so a new route without a row here fails the test.
 */
type Who = "anonymous" | "owner" | "estimator" | "painter" | "customer";
type Case = {
  path: (s: Shop) => string;
  body?: (s: Shop) => object;
  expect: Record<Who, number>;
};

const all = (status: number): Record<Who, number> => ({ anonymous: status, owner: status, estimator: status, painter: status, customer: status });
const signedIn = (status: number) => ({ anonymous: 401, owner: status, estimator: status, painter: status, customer: status });
const staff = (status: number) => ({ anonymous: 401, owner: status, estimator: status, painter: status, customer: 403 });
const office = (status: number) => ({ anonymous: 401, owner: status, estimator: status, painter: 403, customer: 403 });
const ownerOnly = (status: number) => ({ anonymous: 401, owner: status, estimator: 403, painter: 403, customer: 403 });

const newJob = (s: Shop) => ({ customerId: s.customerA.id, title: "Hood scoop in candy red" });
const newItem = () => ({ name: "Mirror cap", substrate: "carbon_fiber", surfaceArea: 0.1, areaUnit: "m2" });

export const MATRIX: Record<string, Case> = {
  "GET /api/health": { path: () => "/api/health", expect: all(200) },
  "POST /api/auth/sign-in": {
    path: () => "/api/auth/sign-in",
    body: () => ({ email: "nobody@shop.test", password: "wrong-password" }),
    expect: all(401),
  },
  "POST /api/auth/sign-out": { path: () => "/api/auth/sign-out", expect: all(204) },
  "GET /api/auth/me": { path: () => "/api/auth/me", expect: signedIn(200) },
  "POST /api/auth/password-reset": { path: () => "/api/auth/password-reset", body: () => ({ email: "nobody@shop.test" }), expect: all(202) },
  "POST /api/auth/password-reset/confirm": {
    path: () => "/api/auth/password-reset/confirm",
    body: () => ({ token: "x".repeat(43), password: "a-long-new-password" }),
    expect: all(400),
  },
  "POST /api/auth/password": {
    path: () => "/api/auth/password",
    body: () => ({ currentPassword: "not-the-password", newPassword: "a-long-new-password" }),
    expect: signedIn(400),
  },
  "GET /api/users": { path: () => "/api/users", expect: ownerOnly(200) },
  "POST /api/users": {
    path: () => "/api/users",
    body: () => ({ email: "new.painter@shop.test", name: "New Painter", role: "painter", password: "a-long-password" }),
    expect: ownerOnly(201),
  },
  "GET /api/users/:id": { path: (s) => `/api/users/${s.painter.id}`, expect: ownerOnly(200) },
  "PATCH /api/users/:id": { path: (s) => `/api/users/${s.painter.id}`, body: () => ({ name: "Renamed" }), expect: ownerOnly(200) },
  "GET /api/painters": { path: () => "/api/painters", expect: office(200) },
  "GET /api/customers": { path: () => "/api/customers", expect: office(200) },
  "POST /api/customers": { path: () => "/api/customers", body: () => ({ name: "Drew Kettle" }), expect: office(201) },
  "GET /api/customers/:id": { path: (s) => `/api/customers/${s.customerA.id}`, expect: office(200) },
  "PATCH /api/customers/:id": { path: (s) => `/api/customers/${s.customerA.id}`, body: () => ({ phone: "555-0100" }), expect: office(200) },
  "DELETE /api/customers/:id": { path: (s) => `/api/customers/${s.spareCustomer.id}`, expect: office(204) },
  "GET /api/jobs": { path: () => "/api/jobs", expect: signedIn(200) },
  "GET /api/jobs/board": { path: () => "/api/jobs/board", expect: staff(200) },
  "POST /api/jobs": { path: () => "/api/jobs", body: newJob, expect: office(201) },
  "GET /api/jobs/:id": { path: (s) => `/api/jobs/${s.jobA.id}`, expect: signedIn(200) },
  "PATCH /api/jobs/:id": { path: (s) => `/api/jobs/${s.jobA.id}`, body: () => ({ title: "Helmet in candy teal, gold leaf" }), expect: office(200) },
  "DELETE /api/jobs/:id": { path: (s) => `/api/jobs/${s.inquiryA.id}`, expect: office(204) },
  "POST /api/jobs/:id/stage": { path: (s) => `/api/jobs/${s.jobA.id}/stage`, body: () => ({ stage: "in_booth" }), expect: staff(200) },
  "GET /api/jobs/:id/items": { path: (s) => `/api/jobs/${s.jobA.id}/items`, expect: signedIn(200) },
  "POST /api/jobs/:id/items": { path: (s) => `/api/jobs/${s.jobA.id}/items`, body: newItem, expect: office(201) },
  "GET /api/jobs/:id/items/:itemId": { path: (s) => `/api/jobs/${s.jobA.id}/items/${s.itemA.id}`, expect: signedIn(200) },
  "PATCH /api/jobs/:id/items/:itemId": {
    path: (s) => `/api/jobs/${s.jobA.id}/items/${s.itemA.id}`,
    body: () => ({ surfaceArea: 0.4 }),
    expect: office(200),
  },
  "DELETE /api/jobs/:id/items/:itemId": { path: (s) => `/api/jobs/${s.jobA.id}/items/${s.itemA.id}`, expect: office(204) },
  "POST /api/mix/compute": {
    path: () => "/api/mix/compute",
    body: () => ({ components: [{ name: "clear", parts: 4 }, { name: "hardener", parts: 1 }], mode: "total", amount: 500, unit: "mL" }),
    expect: staff(200),
  },
  "GET /api/outbox": { path: () => "/api/outbox", expect: ownerOnly(200) },
  "GET /api/outbox/:id/attachments/:index": { path: () => "/api/outbox/none-here/attachments/0", expect: ownerOnly(404) },
};

describe("role matrix", async () => {
  const probe = await makeShop();
  const routes: RouteInfo[] = probe.app.routes;

  it("lists the API's routes from its routers and every route has a guard", () => {
    expect(routes.length).toBeGreaterThan(20);
    const unguarded = routes.filter((r) => r.access === null).map((r) => `${r.method} ${r.path}`);
    expect(unguarded).toEqual([]);
  });

  it("has a row for every route, and no row for a route that does not exist", () => {
    const keys = routes.map((r) => `${r.method} ${r.path}`);
    expect(keys.filter((k) => !MATRIX[k])).toEqual([]);
    expect(Object.keys(MATRIX).filter((k) => !keys.includes(k))).toEqual([]);
  });

  const whos: Who[] = ["anonymous", "owner", "estimator", "painter", "customer"];
  for (const [key, c] of Object.entries(MATRIX)) {
    const [method, routePath] = key.split(" ") as [string, string];
    it.each(whos)(`${key} as %s`, async (who) => {
      // A fresh shop for each call, so a delete or a stage move cannot change what the next call sees.
      const shop = await makeShop({ demoMode: true, outboxDir: probe.app.deps.dataDir });
      const m = method.toLowerCase() as "get" | "post" | "patch" | "delete";
      let req = shop.as(who)[m](c.path(shop));
      if (c.body) req = req.send(c.body(shop));
      const res = await req;
      expect({ route: routePath, who, status: res.status }).toEqual({ route: routePath, who, status: c.expect[who] });
      if (res.status >= 400) expect(res.body.error).toMatchObject({ code: expect.any(String), message: expect.any(String) });
    });
  }
});
