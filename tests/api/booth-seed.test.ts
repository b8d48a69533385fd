import { describe, expect, it } from "vitest";
import request from "supertest";
import { count, eq, inArray, isNotNull } from "drizzle-orm";
import { makeApp } from "../support/test-app";
import { DEMO_PASSWORD, seedDemo } from "../../server/db/seed/index";
import { coatLogs, jobItems, jobs, prepRecords, testPanels, uploads } from "../../server/db/schema";
import type { BoothDto } from "../../shared/schemas/booth.schema";
import type { FinishRecordDto } from "../../shared/schemas/finish-record.schema";
import type { PanelDto } from "../../shared/schemas/panel.schema";

describe("demo seed: prep, coats, panels and photos", () => {
  it("signs off prep on every job past prep, logs coats, approves panels and writes servable photos", async () => {
    const t = makeApp({ now: Date.now });
    await seedDemo(t.db, Date.now(), { uploadsDir: t.app.deps.uploadsDir });

    const sprayed = t.db.select().from(jobs).where(inArray(jobs.stage, ["in_booth", "curing", "finishing", "ready", "delivered"])).all();
    expect(sprayed.length).toBeGreaterThan(10);
    for (const job of sprayed) {
      const items = t.db.select({ id: jobItems.id }).from(jobItems).where(eq(jobItems.jobId, job.id)).all();
      const signed = t.db.select({ n: count() }).from(prepRecords).where(eq(prepRecords.jobId, job.id)).all()[0]!.n;
      expect({ job: job.id, signed }).toEqual({ job: job.id, signed: items.length });
    }
    expect(t.db.select({ n: count() }).from(coatLogs).get()!.n).toBeGreaterThan(50);
    expect(t.db.select({ n: count() }).from(testPanels).get()!.n).toBeGreaterThan(30);
    expect(t.db.select({ n: count() }).from(jobs).where(isNotNull(jobs.approvedPanelId)).get()!.n).toBeGreaterThan(3);
    const shared = t.db.select().from(uploads).where(eq(uploads.shareable, true)).all();
    expect(shared.length).toBeGreaterThan(3);

    // The demo painter's jobs at the booth read sensibly.
    const agent = request.agent(t.app);
    await agent.post("/api/auth/sign-in").send({ email: "painter@demo.coatwright.test", password: DEMO_PASSWORD });
    const mine = (await agent.get("/api/jobs?stage=in_booth,curing")).body.items as { id: number; stage: string }[];
    expect(mine.length).toBeGreaterThan(0);
    for (const job of mine) {
      const b = (await agent.get(`/api/jobs/${job.id}/booth`)).body as BoothDto;
      expect(b.plan).not.toBeNull();
      expect(b.prepReady).toBe(true);
      expect(b.next.state).toBe(job.stage === "curing" ? "done" : "spray");
    }
    const panels = await agent.get("/api/panels?pageSize=100");
    expect(panels.body.facets.candies).toEqual(expect.arrayContaining(["Apple red", "Cobalt", "Emerald"]));
    const ladder = await agent.get("/api/panels/ladder?ground=Fine%20silver&candy=Apple%20red");
    const depths = ladder.body.rungs.map((r: { depth: number }) => r.depth) as number[];
    expect(depths).toEqual([...depths].sort((a, b) => a - b));
    const coats = ladder.body.rungs.map((r: { panel: { coats: number } }) => r.panel.coats) as number[];
    expect([...new Set(coats)].sort()).toEqual([2, 3, 4, 5, 6]);
    const photo = panels.body.items.find((p: { photo: unknown }) => p.photo).photo;
    const img = await agent.get(photo.thumbUrl);
    expect(img.status).toBe(200);
    expect(img.headers["content-type"]).toBe("image/webp");
  });

  it("gives the shop a few guns, full finish records on delivered jobs, and approved panels with their set-up and readings per light", async () => {
    const t = makeApp({ now: Date.now });
    await seedDemo(t.db, Date.now(), { uploadsDir: t.app.deps.uploadsDir });
    const owner = request.agent(t.app);
    await owner.post("/api/auth/sign-in").send({ email: "owner@demo.coatwright.test", password: DEMO_PASSWORD });
    expect((await owner.get("/api/guns")).body.length).toBeGreaterThanOrEqual(3);
    const delivered = t.db.select().from(jobs).where(eq(jobs.stage, "delivered")).all();
    expect(delivered.length).toBeGreaterThan(2);
    let withBatches = 0;
    for (const job of delivered) {
      const r = (await owner.get(`/api/jobs/${job.id}/finish-record`)).body as FinishRecordDto;
      const sprayedLayers = r.layers.filter((l) => l.kind !== "prep");
      expect(sprayedLayers.length).toBeGreaterThan(0);
      for (const l of sprayedLayers) {
        expect(l.coats.length, `job ${job.id} ${l.name}`).toBeGreaterThan(0);
        for (const c of l.coats) expect(c.setup.summary, `job ${job.id} ${l.name} coat ${c.coatNumber}`).toMatch(/tip/);
      }
      if (sprayedLayers.some((l) => l.batches.some((b) => b.lines.some((x) => x.lotNumber)))) withBatches++;
    }
    expect(withBatches).toBeGreaterThan(0);
    const approvedIds = t.db.select({ id: jobs.approvedPanelId }).from(jobs).where(isNotNull(jobs.approvedPanelId)).all();
    const approved = (await owner.get(`/api/panels/${approvedIds[0]!.id}`)).body as PanelDto;
    expect(approved.readings.map((r) => r.light).sort()).toEqual(["booth", "warm_indoor"]);
    expect(approved.setup.gunName).toMatch(/Gun 2/);
    expect(approved.photos.map((p) => p.light)).toEqual(["daylight", "warm_indoor"]);
  });
});
