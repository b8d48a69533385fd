import { describe, expect, it } from "vitest";
import { makeShop } from "../support/test-app";
import { finishFixtures, keysOf, MONEY_KEY } from "../support/finish-fixtures";

/** Anything a client can send gets a 4xx with the error body, never a 500. */
describe("odd input to materials, plans and mix sheets", () => {
  it("answers garbage with 4xx errors", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    const garbage: unknown[] = [null, [], "text", 12, { a: 1 }, { layers: "x" }, { lines: [{ lineId: "x" }] }, { amount: -1 }, { amount: 1e308 }, { name: "x".repeat(10_000) }];
    const calls: [string, string][] = [
      ["post", "/api/materials"],
      ["patch", `/api/materials/${f.clear.id}`],
      ["post", `/api/materials/${f.clear.id}/lots`],
      ["patch", `/api/materials/${f.clear.id}/lots/${f.clearLot.id}`],
      ["post", "/api/plans"],
      ["put", `/api/plans/${f.template.id}`],
      ["post", `/api/plans/${f.jobPlan.id}/copy-as-template`],
      ["post", `/api/jobs/${s.jobB.id}/plan`],
      ["post", "/api/mix-sheets"],
      ["post", `/api/mix-sheets/${f.sheet.id}/record`],
      ["post", `/api/mix-sheets/${f.sheet.id}/void`],
    ];
    for (const [method, url] of calls) {
      for (const body of garbage) {
        const res = await (s.as("owner") as Record<string, (u: string) => import("supertest").Test>)[method]!(url).set("Content-Type", "application/json").send(JSON.stringify(body));
        expect({ method, url, body, status: res.status < 500 }).toEqual({ method, url, body, status: true });
        if (res.status >= 400) expect(res.body.error?.code).toEqual(expect.any(String));
      }
    }
    for (const url of ["/api/materials/0", "/api/materials/-1", "/api/materials/1.5", "/api/materials/99999999999999999999", "/api/plans/abc/versions/1", `/api/plans/${f.template.id}/versions/x`, "/api/mix-sheets/%20", "/api/materials?category=1", "/api/plans?kind=job&kind=template", "/api/mix-sheets?limit=100000"]) {
      const res = await s.as("owner").get(url);
      expect({ url, ok: res.status >= 400 && res.status < 500 }).toEqual({ url, ok: true });
    }
  });
});

describe("painter responses carry no money", () => {
  it("every materials, plans and mix-sheet read and write a painter can make is free of cost fields", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    const p = s.as("painter");
    const made = await p.post("/api/mix-sheets").send({ jobId: s.jobA.id, layerId: f.layer.id, mode: "total", amount: 100, unit: "mL" });
    const responses = [
      made,
      await p.get("/api/materials"),
      await p.get("/api/materials/low-stock"),
      await p.get(`/api/materials/${f.clear.id}`),
      await p.get(`/api/materials/${f.clear.id}/lots`),
      await p.get("/api/plans"),
      await p.get("/api/plans?kind=job"),
      await p.get(`/api/plans/${f.template.id}`),
      await p.get(`/api/plans/${f.jobPlan.id}/versions`),
      await p.get(`/api/plans/${f.jobPlan.id}/versions/${f.jobPlan.latest.id}`),
      await p.get(`/api/jobs/${s.jobA.id}/plan`),
      await p.get("/api/mix-sheets"),
      await p.get(`/api/mix-sheets/${f.sheet.id}`),
      await p.post(`/api/mix-sheets/${f.sheet.id}/record`).send({ lines: [] }),
      await p.post(`/api/mix-sheets/${made.body.id}/void`).send({ reason: "Test" }),
    ];
    responses.forEach((res, i) => {
      expect({ call: i, status: res.status < 300, money: keysOf(res.body).filter((k) => MONEY_KEY.test(k)) }).toEqual({ call: i, status: true, money: [] });
    });
  });
});
