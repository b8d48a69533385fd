import { describe, expect, it } from "vitest";
import { makeShop, editAt } from "../support/test-app";
import type { RouteInfo } from "../../server/http/route-list";

describe("audit trail", () => {
  it("lists audited changes newest first with filters by kind, user and date, paged on the server", async () => {
    const s = await makeShop();
    await editAt(s, "owner", "/api/settings", { labourRateCents: 9100 });
    await editAt(s, "owner", `/api/users/${s.painter.id}`, { name: "Pat Painter" });
    await editAt(s, "owner", `/api/users/${s.estimator.id}`, { role: "painter" });
    const all = await s.as("owner").get("/api/audit?pageSize=2");
    expect(all.status).toBe(200);
    expect(all.body.total).toBe(3);
    expect(all.body.items).toHaveLength(2);
    expect(all.body.items[0]).toMatchObject({ kind: "user", action: "role_changed", userName: "Test owner" });
    const users = await s.as("owner").get("/api/audit?kind=user");
    expect(users.body.total).toBe(2);
    const money = await s.as("owner").get("/api/audit?kind=money");
    expect(money.body.items[0]).toMatchObject({ entity: "settings", before: { labourRateCents: 8500 }, after: { labourRateCents: 9100 } });
    const today = new Date().toISOString().slice(0, 10);
    expect((await s.as("owner").get(`/api/audit?from=2000-01-01&to=2000-12-31`)).body.total).toBe(0);
    expect((await s.as("owner").get(`/api/audit?userId=${s.owner.id}&from=${today}`)).body.total).toBeGreaterThanOrEqual(1);
  });

  it("has no route that changes or deletes an entry", async () => {
    const s = await makeShop();
    await editAt(s, "owner", "/api/settings", { taxPercent: 5 });
    const routes: RouteInfo[] = s.app.routes;
    const methods = routes.filter((r) => r.path.startsWith("/api/audit")).map((r) => r.method);
    expect(methods).toEqual(["GET"]);
    for (const m of ["put", "patch", "delete", "post"] as const) {
      const res = await s.as("owner")[m]("/api/audit/1").send({ action: "nothing" });
      expect(res.status).toBe(404);
    }
    expect((await s.as("owner").get("/api/audit")).body.items[0].after).toEqual({ taxPercent: 5 });
  });

  it("rejects bad filters naming the parameter", async () => {
    const s = await makeShop();
    const res = await s.as("owner").get("/api/audit?kind=coffee&from=yesterday");
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["from", "kind"]);
  });
});
