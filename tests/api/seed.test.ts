import { describe, expect, it } from "vitest";
import request from "supertest";
import { count, eq } from "drizzle-orm";
import { makeApp } from "../support/test-app";
import { seedDemo, DEMO_PASSWORD, DEMO_USERS, isEmpty } from "../../server/db/seed/index";
import { jobs, users } from "../../server/db/schema";
import { STAGES } from "../../shared/domain/stages";

describe("demo seed", () => {
  it("fills an empty database with a shop whose board and table are full", async () => {
    const t = makeApp();
    expect(isEmpty(t.db)).toBe(true);
    await seedDemo(t.db);
    expect(isEmpty(t.db)).toBe(false);
    const total = t.db.select({ n: count() }).from(jobs).get()!.n;
    expect(total).toBeGreaterThanOrEqual(40);
    const stages = new Set(t.db.select({ s: jobs.stage }).from(jobs).all().map((r) => r.s));
    expect([...stages].sort()).toEqual([...STAGES].sort());
    const painter = t.db.select().from(users).where(eq(users.email, "painter@demo.coatwright.test")).get()!;
    const mine = t.db.select({ n: count() }).from(jobs).where(eq(jobs.assignedPainterId, painter.id)).get()!.n;
    expect(mine).toBeGreaterThanOrEqual(5);
  });

  it("every demo account signs in with the documented password; the customer sees their own jobs", async () => {
    const t = makeApp();
    await seedDemo(t.db);
    for (const u of DEMO_USERS) {
      const res = await request(t.app).post("/api/auth/sign-in").send({ email: u.email, password: DEMO_PASSWORD });
      expect({ email: u.email, status: res.status, role: res.body.role }).toEqual({ email: u.email, status: 200, role: u.role });
    }
    const agent = request.agent(t.app);
    await agent.post("/api/auth/sign-in").send({ email: "customer@demo.coatwright.test", password: DEMO_PASSWORD });
    const list = await agent.get("/api/jobs");
    expect(list.body.total).toBeGreaterThanOrEqual(1);
    expect(new Set(list.body.items.map((j: { customerName: string }) => j.customerName))).toEqual(new Set(["Tobias Wren"]));
  });
});

describe("serving the built app", () => {
  it("answers / and deep links with the SPA's index.html, and unknown API paths with a JSON 404", async () => {
    const { mkdtempSync, writeFileSync } = await import("node:fs");
    const { tmpdir } = await import("node:os");
    const path = await import("node:path");
    const dir = mkdtempSync(path.join(tmpdir(), "cw-dist-"));
    writeFileSync(path.join(dir, "index.html"), "<!doctype html><title>Coatwright</title><div id=root></div>");
    const t = makeApp({ clientDir: dir });
    for (const url of ["/", "/jobs/5", "/portal"]) {
      const res = await request(t.app).get(url);
      expect({ url, status: res.status, html: res.text.includes("<title>Coatwright</title>") }).toEqual({ url, status: 200, html: true });
    }
    const api = await request(t.app).get("/api/nothing-here");
    expect(api.status).toBe(404);
    expect(api.body.error.code).toBe("not_found");
  });
});
