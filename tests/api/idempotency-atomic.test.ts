import { describe, expect, it } from "vitest";
import request from "supertest";
import { readdirSync } from "node:fs";
import { eq, sql } from "drizzle-orm";
import { makeShop, type Shop } from "../support/test-app";
import { readyForBooth, swatchPng } from "../support/booth-fixtures";
import { coatLogs, idempotencyKeys, prepRecords, uploads } from "../../server/db/schema";

/**
 * The answer stored under an Idempotency-Key is written in the same transaction as the record itself. A failure
 * while storing the answer (standing in for the process dying between the two writes) must take the record with it:
 * otherwise the record stays without its key, and the tablet's replay of the entry writes it a second time.
 */
const KEY = "0d9b7c1e-5a2f-4e8b-b6c4-7f3a1d2e9c58";

/** Every write of an answer under a key fails, as if the process died at that moment. */
const breakAnswers = (s: Shop) =>
  s.db.run(sql`CREATE TRIGGER answer_fails BEFORE UPDATE OF status ON idempotency_keys BEGIN SELECT RAISE(ABORT, 'simulated crash'); END`);
const mendAnswers = (s: Shop) => s.db.run(sql`DROP TRIGGER answer_fails`);

const coatRows = (s: Shop) => s.db.select().from(coatLogs).where(eq(coatLogs.jobId, s.jobA.id)).all();

describe("an Idempotency-Key's answer commits with its record", () => {
  it("a coat whose answer cannot be stored is not stored either; the replay then logs it once", async () => {
    const s = await makeShop();
    const plan = readyForBooth(s);
    const send = () =>
      request(s.app)
        .post("/api/coat-logs")
        .set("Cookie", s.cookies.painter)
        .set("Idempotency-Key", KEY)
        .send({ jobId: s.jobA.id, layerId: plan.layers[0]!.id, coatNumber: 1, boothTemp: 21, tempUnit: "C", humidityPct: 50 });
    breakAnswers(s);
    const crashed = await send();
    expect(crashed.status).toBe(500);
    // No coat without its key, and the key is free for the replay.
    expect(coatRows(s)).toHaveLength(0);
    expect(s.db.select().from(idempotencyKeys).all()).toEqual([]);

    mendAnswers(s);
    const replay = await send();
    expect(replay.status).toBe(201);
    expect(coatRows(s)).toHaveLength(1);
    const again = await send();
    expect([again.status, again.headers["idempotent-replayed"]]).toEqual([201, "true"]);
    expect(again.body).toEqual(replay.body);
    expect(coatRows(s)).toHaveLength(1);
  });

  it("a correction whose answer cannot be stored is not stored either, so the replay makes one correction, not two", async () => {
    const s = await makeShop();
    const plan = readyForBooth(s);
    const coat = await s.as("painter").post("/api/coat-logs").send({ jobId: s.jobA.id, layerId: plan.layers[0]!.id, coatNumber: 1, boothTemp: 21, tempUnit: "C", humidityPct: 50 });
    expect(coat.status).toBe(201);
    const id = coatRows(s)[0]!.id;
    const send = () => request(s.app).post(`/api/coat-logs/${id}/corrections`).set("Cookie", s.cookies.painter).set("Idempotency-Key", KEY).send({ reason: "Read the gauge wrong", humidityPct: 55 });
    breakAnswers(s);
    expect((await send()).status).toBe(500);
    expect(coatRows(s).filter((c) => c.correctsId === id)).toHaveLength(0);
    mendAnswers(s);
    expect((await send()).status).toBe(201);
    expect((await send()).headers["idempotent-replayed"]).toBe("true");
    expect(coatRows(s).filter((c) => c.correctsId === id)).toHaveLength(1);
  });

  it("a photo whose answer cannot be stored leaves no row and no file; the replay stores one photo", async () => {
    const s = await makeShop();
    const png = await swatchPng();
    const send = () =>
      request(s.app).post("/api/uploads").set("Cookie", s.cookies.painter).set("Idempotency-Key", KEY).field("ownerType", "job").field("ownerId", String(s.jobA.id)).attach("file", png, "booth.png");
    const files = () => readdirSync(s.app.deps.uploadsDir).filter((f) => /^[a-f0-9]{32}/.test(f));
    breakAnswers(s);
    expect((await send()).status).toBe(500);
    expect(s.db.select().from(uploads).all()).toHaveLength(0);
    expect(files()).toEqual([]);
    mendAnswers(s);
    const first = await send();
    const again = await send();
    expect([first.status, again.status]).toEqual([201, 201]);
    expect(again.body).toEqual(first.body);
    expect(s.db.select().from(uploads).all()).toHaveLength(1);
  });

  it("a prep sign-off whose answer cannot be stored is not stored either; the replay signs off once", async () => {
    const s = await makeShop();
    const rec = await s.as("painter").post("/api/prep-records").send({ itemId: s.itemA.id, scuffMedium: "scuff_pad", scuffGrit: 600, cleaner: "Wax and grease remover", tackCloth: true });
    expect(rec.status).toBe(201);
    const send = () => request(s.app).post(`/api/prep-records/${rec.body.id}/sign-off`).set("Cookie", s.cookies.painter).set("Idempotency-Key", KEY).send({});
    const signedOff = () => s.db.select().from(prepRecords).where(eq(prepRecords.id, rec.body.id)).get()!.signedOffAt;
    breakAnswers(s);
    expect((await send()).status).toBe(500);
    expect(signedOff()).toBeNull();
    mendAnswers(s);
    const first = await send();
    // Before the fix the sign-off stayed without its key, and this replay was a 409 "already signed off".
    expect(first.status).toBe(200);
    expect(signedOff()).not.toBeNull();
    expect((await send()).body).toEqual(first.body);
  });
});
