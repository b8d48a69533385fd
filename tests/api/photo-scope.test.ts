import { describe, expect, it } from "vitest";
import { readdirSync } from "node:fs";
import { eq } from "drizzle-orm";
import { cookieFor, makeShop, type Shop } from "../support/test-app";
import { addPanel, addPhoto, swatchPng } from "../support/booth-fixtures";
import { uploads } from "../../server/db/schema";
import request from "supertest";

/**
 * Photos of a job's test panels and of the job itself follow the job's own scope: a painter not assigned to the job
 * cannot add one, change its caption, share it with the customer or remove it. (A painter once attached a shareable
 * photo to a test panel of another painter's job, and that job's customer saw it in the portal.)
 * Job B belongs to customer B and the second painter; "painter" below is job A's painter.
 */
async function panelOfJobB(s: Shop) {
  return addPanel(s, { jobId: s.jobB.id, createdBy: s.painter2.id });
}
const files = (s: Shop) => {
  try {
    return readdirSync(s.app.deps.uploadsDir).sort();
  } catch {
    return [];
  }
};
const customerB = async (s: Shop) => {
  const cookie = await cookieFor(s, s.customerBUser.id);
  return (url: string) => request(s.app).get(url).set("Cookie", cookie);
};

describe("panel and job photos follow the job's scope", () => {
  it("a painter not on the job cannot attach a photo to one of its test panels, and its customer sees nothing", async () => {
    const s = await makeShop();
    const panel = await panelOfJobB(s);
    const res = await s
      .as("painter")
      .post("/api/uploads")
      .field("ownerType", "panel")
      .field("ownerId", String(panel.id))
      .field("shareable", "true")
      .field("caption", "Look at this")
      .attach("file", await swatchPng(), "swatch.png");
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/painter on that job|office/i);
    expect(s.db.select().from(uploads).all()).toEqual([]);
    expect(files(s)).toEqual([]);
    const portal = await (await customerB(s))(`/api/portal/jobs/${s.jobB.id}`);
    expect(portal.status).toBe(200);
    expect(JSON.stringify(portal.body)).not.toMatch(/Look at this/);
  });

  it("the painter on the job, the office, and anyone for a library panel (no job) may attach", async () => {
    const s = await makeShop();
    const mine = addPanel(s, { jobId: s.jobA.id, createdBy: s.painter.id });
    const library = addPanel(s, { createdBy: s.painter2.id });
    const theirs = await panelOfJobB(s);
    const png = await swatchPng();
    const post = (who: "painter" | "owner" | "estimator", panelId: number) =>
      s.as(who).post("/api/uploads").field("ownerType", "panel").field("ownerId", String(panelId)).attach("file", png, "swatch.png");
    expect((await post("painter", mine.id)).status).toBe(201);
    expect((await post("painter", library.id)).status).toBe(201);
    expect((await post("owner", theirs.id)).status).toBe(201);
    expect((await post("estimator", theirs.id)).status).toBe(201);
  });

  it("a painter not on the job cannot change a panel photo's caption or sharing, nor remove it", async () => {
    const s = await makeShop();
    const panel = await panelOfJobB(s);
    const photo = await addPhoto(s, { ownerType: "panel", ownerId: panel.id, jobId: s.jobB.id }, { by: s.painter2.id });
    for (const body of [{ caption: "Renamed" }, { shareable: true }, { light: "booth" }]) {
      const res = await s.as("painter").patch(`/api/uploads/${photo.id}`).send({ ...body, version: photo.version });
      expect(res.status, JSON.stringify(body)).toBe(403);
    }
    expect((await s.as("painter").delete(`/api/uploads/${photo.id}`)).status).toBe(403);
    const row = s.db.select().from(uploads).where(eq(uploads.id, photo.id)).get()!;
    expect(row).toMatchObject({ caption: null, shareable: false, light: null });
    // The job's own painter may.
    const painter2 = await cookieFor(s, s.painter2.id);
    const ok = await request(s.app).patch(`/api/uploads/${photo.id}`).set("Cookie", painter2).send({ caption: "Third coat", shareable: true, version: photo.version });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ caption: "Third coat", shareable: true });
  });

  it("staff still see the panel library's photos (the panel itself is shared), but cannot change them", async () => {
    const s = await makeShop();
    const panel = await panelOfJobB(s);
    const photo = await addPhoto(s, { ownerType: "panel", ownerId: panel.id, jobId: s.jobB.id }, { by: s.painter2.id });
    expect((await s.as("painter").get(`/api/uploads/${photo.id}/thumb`)).status).toBe(200);
    expect((await s.as("painter").get(`/api/panels/${panel.id}`)).body.photos).toHaveLength(1);
  });

  it("job photos: a painter not on the job reaches none of them (404, as the job itself)", async () => {
    const s = await makeShop();
    const photo = await addPhoto(s, { ownerType: "job", ownerId: s.jobB.id, jobId: s.jobB.id }, { by: s.painter2.id });
    expect((await s.as("painter").post("/api/uploads").field("ownerType", "job").field("ownerId", String(s.jobB.id)).attach("file", await swatchPng(), "a.png")).status).toBe(404);
    expect((await s.as("painter").patch(`/api/uploads/${photo.id}`).send({ shareable: true, version: photo.version })).status).toBe(404);
    expect((await s.as("painter").delete(`/api/uploads/${photo.id}`)).status).toBe(404);
    expect((await s.as("painter").get(`/api/uploads/${photo.id}`)).status).toBe(404);
    expect(s.db.select().from(uploads).where(eq(uploads.id, photo.id)).get()).toMatchObject({ shareable: false });
  });
});
