import { describe, expect, it } from "vitest";
import { makeShop } from "../support/test-app";
import type { RouteInfo } from "../../server/http/route-list";
import { callRow, type MatrixRows, type Who } from "./matrix/rows";
import { keyPaths } from "../support/demo-shop";
import { isMoneyKey, listedNotMoney } from "./security/money-keys";

/**
 * Every API route × every role plus anonymous, with the status each must get. Rows live in
 * tests/api/matrix/<area>.ts; the routes are read from the app's routers, so a new route without a row
 * fails this test.
 */
const files = import.meta.glob<{ rows?: MatrixRows }>("./matrix/*.ts", { eager: true });
const MATRIX: MatrixRows = Object.assign({}, ...Object.values(files).map((m) => m.rows ?? {}));

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
    const routePath = key.split(" ")[1]!;
    it.each(whos)(`${key} as %s`, async (who) => {
      // A fresh shop for each call, so a delete or a stage move cannot change what the next call sees.
      const shop = await makeShop({ demoMode: true, outboxDir: probe.app.deps.dataDir });
      await c.prepare?.(shop);
      const res = await callRow(shop, key, c, who);
      expect({ route: routePath, who, status: res.status }).toEqual({ route: routePath, who, status: c.expect[who] });
      if (res.status >= 400) expect(res.body.error).toMatchObject({ code: expect.any(String), message: expect.any(String) });
      // Whatever a painter's call answers (reads and writes alike), it carries no money field.
      if (who === "painter" && String(res.headers["content-type"]).includes("json")) {
        const money = keyPaths(res.body).filter((k) => isMoneyKey(k.key) && !listedNotMoney(`${routePath} ${k.path}`));
        expect({ route: routePath, money: money.map((k) => k.path) }).toEqual({ route: routePath, money: [] });
      }
    });
  }
});
