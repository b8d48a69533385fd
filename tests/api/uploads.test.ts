import { describe, expect, it } from "vitest";
import request from "supertest";
import sharp from "sharp";
import { readFileSync } from "node:fs";
import path from "node:path";
import { cookieFor, makeShop } from "../support/test-app";
import { addPanel, addPhoto, jpegWithExif, swatchPng } from "../support/booth-fixtures";
import { uploads } from "../../server/db/schema";
import { eq } from "drizzle-orm";

/** Reads supertest's binary body into a Buffer. */
const binary = (res: request.Response) => res.body as Buffer;
const asBinary = (r: request.Test) =>
  r.buffer(true).parse((res, cb) => {
    const chunks: Buffer[] = [];
    res.on("data", (c: Buffer) => chunks.push(c));
    res.on("end", () => cb(null, Buffer.concat(chunks)));
  });

describe("POST /api/uploads", () => {
  it("stores a real JPEG with its EXIF removed, makes a WebP thumbnail, and serves both to the job's painter", async () => {
    const s = await makeShop();
    const jpeg = await jpegWithExif();
    // The fixture really carries EXIF before upload (sharp reads it back).
    const before = await sharp(jpeg).metadata();
    expect(before.exif?.length).toBeGreaterThan(0);
    expect(jpeg.includes(Buffer.from("EXIF-PROBE"))).toBe(true);

    const res = await s.as("painter").post("/api/uploads").field("ownerType", "job_item").field("ownerId", String(s.itemA.id)).field("caption", "Before sanding").attach("file", jpeg, "IMG_0001.jpg");
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ ownerType: "job_item", ownerId: s.itemA.id, jobId: s.jobA.id, kind: "photo", mime: "image/jpeg", width: 120, height: 80, caption: "Before sanding", shareable: false, uploadedByName: "Test painter" });
    expect(res.body.url).toBe(`/api/uploads/${res.body.id}`);

    const file = await asBinary(s.as("painter").get(res.body.url));
    expect(file.status).toBe(200);
    expect(file.headers["content-type"]).toBe("image/jpeg");
    const served = binary(file);
    const after = await sharp(served).metadata();
    expect(after.exif).toBeUndefined();
    expect(served.includes(Buffer.from("EXIF-PROBE"))).toBe(false);
    expect(served.includes(Buffer.from("Secret Painter Name"))).toBe(false);
    // And on disk, under a random name.
    const row = s.db.select().from(uploads).where(eq(uploads.id, res.body.id)).get()!;
    expect(row.storedName).toMatch(/^[a-f0-9]{32}\.jpg$/);
    expect(readFileSync(path.join(s.app.deps.uploadsDir, row.storedName)).includes(Buffer.from("EXIF-PROBE"))).toBe(false);

    const thumb = await asBinary(s.as("painter").get(res.body.thumbUrl));
    expect(thumb.headers["content-type"]).toBe("image/webp");
    expect((await sharp(binary(thumb)).metadata()).format).toBe("webp");
  });

  it("refuses text renamed .jpg with a 415 naming the file field", async () => {
    const s = await makeShop();
    const res = await s.as("painter").post("/api/uploads").field("ownerType", "job").field("ownerId", String(s.jobA.id)).attach("file", Buffer.from("this is not a photo, just words in a file"), "holiday.jpg");
    expect(res.status).toBe(415);
    expect(res.body.error).toMatchObject({ code: "unsupported_media_type", fields: { file: expect.any(String) } });
    expect(res.body.error.message).toMatch(/not a JPEG, PNG or WebP photo/);
    expect(s.db.select().from(uploads).all()).toEqual([]);
  });

  it("refuses a file over 15 MB with a 413 that says the limit", async () => {
    const s = await makeShop();
    const big = Buffer.alloc(15 * 1024 * 1024 + 1, 0x41);
    const res = await s.as("painter").post("/api/uploads").field("ownerType", "job").field("ownerId", String(s.jobA.id)).attach("file", big, "huge.jpg");
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe("payload_too_large");
    expect(res.body.error.message).toMatch(/photos are limited to 15 MB/);
  });

  it("refuses HEIC with a message that says it cannot be read here and how to send JPEG", async () => {
    const s = await makeShop();
    // An ISO-BMFF 'ftyp' box with the 'heic' brand: what file-type recognises as HEIC.
    const heic = Buffer.concat([Buffer.from([0, 0, 0, 0x18]), Buffer.from("ftypheic"), Buffer.from([0, 0, 0, 0]), Buffer.from("mif1heic"), Buffer.alloc(64)]);
    const res = await s.as("painter").post("/api/uploads").field("ownerType", "job").field("ownerId", String(s.jobA.id)).attach("file", heic, "IMG_1234.HEIC");
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/HEIC photos cannot be read here/);
  });

  it("names bad fields, refuses customers, and hides jobs outside a painter's reach as 404", async () => {
    const s = await makeShop();
    const png = await swatchPng();
    const noFile = await s.as("owner").post("/api/uploads").send({ ownerType: "job", ownerId: s.jobA.id });
    expect(noFile.status).toBe(400);
    expect(noFile.body.error.fields).toHaveProperty("file");
    const badType = await s.as("owner").post("/api/uploads").field("ownerType", "invoice").field("ownerId", "x").attach("file", png, "a.png");
    expect(badType.status).toBe(400);
    expect(Object.keys(badType.body.error.fields).sort()).toEqual(["ownerId", "ownerType"]);
    expect((await s.as("customer").post("/api/uploads").field("ownerType", "job").field("ownerId", String(s.jobA.id)).attach("file", png, "a.png")).status).toBe(403);
    expect((await s.as("painter").post("/api/uploads").field("ownerType", "job").field("ownerId", String(s.jobB.id)).attach("file", png, "a.png")).status).toBe(404);
    expect((await s.as("painter").post("/api/uploads").field("ownerType", "job_item").field("ownerId", "999").attach("file", png, "a.png")).status).toBe(404);
  });
});

describe("who sees a file", () => {
  it("customers see only photos of their own jobs that the staff marked shareable; staff can toggle it", async () => {
    const s = await makeShop();
    const privatePhoto = await addPhoto(s, { ownerType: "job", ownerId: s.jobA.id, jobId: s.jobA.id });
    const otherJob = await addPhoto(s, { ownerType: "job", ownerId: s.jobB.id, jobId: s.jobB.id }, { shareable: true });
    expect((await s.as("customer").get(`/api/uploads/${privatePhoto.id}`)).status).toBe(404);
    expect((await s.as("customer").get(`/api/uploads?jobId=${s.jobA.id}`)).body).toEqual([]);
    expect((await s.as("customer").get(`/api/uploads/${otherJob.id}`)).status).toBe(404);
    expect((await s.as("customer").get(`/api/uploads?jobId=${s.jobB.id}`)).status).toBe(404);

    const share = await s.as("painter").patch(`/api/uploads/${privatePhoto.id}`).send({ shareable: true, version: privatePhoto.version });
    expect(share.status).toBe(200);
    expect(share.body.shareable).toBe(true);
    expect((await s.as("customer").get(`/api/uploads/${privatePhoto.id}`)).status).toBe(200);
    expect((await s.as("customer").get(`/api/uploads/${privatePhoto.id}/thumb`)).status).toBe(200);
    expect((await s.as("customer").get(`/api/uploads?jobId=${s.jobA.id}`)).body.map((u: { id: number }) => u.id)).toEqual([privatePhoto.id]);

    await s.as("owner").patch(`/api/uploads/${privatePhoto.id}`).send({ shareable: false, version: share.body.version });
    expect((await s.as("customer").get(`/api/uploads/${privatePhoto.id}`)).status).toBe(404);
  });

  it("painters see files of their assigned jobs only; test-panel photos are the whole staff's library", async () => {
    const s = await makeShop();
    const jobBPhoto = await addPhoto(s, { ownerType: "job", ownerId: s.jobB.id, jobId: s.jobB.id });
    expect((await s.as("painter").get(`/api/uploads/${jobBPhoto.id}`)).status).toBe(404);
    expect((await s.as("painter").get(`/api/uploads?jobId=${s.jobB.id}`)).status).toBe(404);
    expect((await s.as("estimator").get(`/api/uploads/${jobBPhoto.id}`)).status).toBe(200);
    const panel = addPanel(s, { jobId: s.jobB.id });
    const panelPhoto = await addPhoto(s, { ownerType: "panel", ownerId: panel.id, jobId: s.jobB.id });
    expect((await s.as("painter").get(`/api/uploads/${panelPhoto.id}`)).status).toBe(200);
    expect((await s.as("painter").get(`/api/uploads?ownerType=panel&ownerId=${panel.id}`)).body).toHaveLength(1);
    expect((await s.as("customer").get(`/api/uploads/${panelPhoto.id}`)).status).toBe(404);
  });

  it("painters remove only their own uploads; the office removes any, and the stored file goes too", async () => {
    const s = await makeShop();
    const byOwner = await addPhoto(s, { ownerType: "job", ownerId: s.jobA.id, jobId: s.jobA.id }, { by: s.owner.id });
    const res = await s.as("painter").delete(`/api/uploads/${byOwner.id}`);
    expect(res.status).toBe(403);
    const p2 = await cookieFor(s, s.painter2.id);
    expect((await request(s.app).delete(`/api/uploads/${byOwner.id}`).set("Cookie", p2)).status).toBe(404);
    expect((await s.as("estimator").delete(`/api/uploads/${byOwner.id}`)).status).toBe(204);
    expect((await s.as("owner").get(`/api/uploads/${byOwner.id}`)).status).toBe(404);
    expect(() => readFileSync(path.join(s.app.deps.uploadsDir, byOwner.storedName))).toThrow();
  });

  it("list needs a job or an owner, and rejects nonsense ids with a 400", async () => {
    const s = await makeShop();
    expect((await s.as("owner").get("/api/uploads")).status).toBe(400);
    expect((await s.as("owner").get("/api/uploads/abc")).status).toBe(400);
    expect((await s.as("owner").get("/api/uploads/999999")).status).toBe(404);
    const bad = await s.as("owner").patch("/api/uploads/1").send({ shareable: "yes please" });
    expect(bad.status).toBe(400);
  });
});

describe("malformed multipart", () => {
  it("an upload without a multipart boundary is a 400 naming the file field, not a server error", async () => {
    const s = await makeShop();
    const res = await s.as("owner").post("/api/uploads").set("Content-Type", "multipart/form-data").send("--x\r\nnot really\r\n");
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: "bad_request", fields: { file: expect.stringMatching(/Boundary not found/) } });
    // A body cut off inside the file part.
    const cut = await s.as("owner").post("/api/uploads").set("Content-Type", "multipart/form-data; boundary=zz").send('--zz\r\nContent-Disposition: form-data; name="file"; filename="a.png"\r\n\r\n\x89PNG');
    expect(cut.status).toBe(400);
    expect(cut.body.error).toMatchObject({ code: "bad_request", message: expect.stringMatching(/could not be read/) });
  });
});
