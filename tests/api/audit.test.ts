import { describe, expect, it } from "vitest";
import { makeShop, editAt } from "../support/test-app";
import { finishFixtures } from "../support/finish-fixtures";
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

  it("records a plan's layers in words, with each material's stock number and name and proper plurals", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    const layer = {
      kind: "clear",
      name: "Gloss clear",
      coats: 1,
      flashMinutes: 10,
      dryMinutes: 60,
      components: [
        { materialId: f.clear.id, label: "clear", parts: 4 },
        { materialId: f.hardener.id, label: "hardener", parts: 1 },
        { materialId: f.reducer.id, label: "reducer", percent: 10, percentOf: ["clear"] },
      ],
    };
    const res = await s.as("estimator").post("/api/plans").send({ name: "Words", layers: [layer] });
    expect(res.status).toBe(201);
    const entry = (await s.as("owner").get("/api/audit?kind=plan")).body.items.find((e: { entityId: string }) => e.entityId === String(res.body.id));
    expect(entry.after.layers).toEqual([
      'Clear "Gloss clear", 1 coat: clear S9-B04 Test urethane clear 4 parts, hardener S9-B07 Test hardener 1 part, reducer S9-B10 Test reducer, medium 10 % of S9-B04 Test urethane clear',
    ]);
    // No row numbers standing in for materials, no "1 parts".
    expect(JSON.stringify(entry.after)).not.toMatch(/#\d|\b1 parts\b/);
  });

  it("keeps a material's stock number and name on a cost change, so the trail names it", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    expect((await editAt(s, "owner", `/api/materials/${f.clear.id}`, { costCents: 10500 })).status).toBe(200);
    const entry = (await s.as("owner").get("/api/audit?kind=money")).body.items.find((e: { action: string }) => e.action === "cost_changed");
    expect(entry.before).toEqual({ code: "S9-B04", name: "Test urethane clear", costCents: 9500 });
    expect(entry.after).toEqual({ code: "S9-B04", name: "Test urethane clear", costCents: 10500 });
  });
});
