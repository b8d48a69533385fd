import { describe, expect, it } from "vitest";
import request from "supertest";
import { eq } from "drizzle-orm";
import { cookieFor, makeShop, type Shop } from "../support/test-app";
import { addMixedSheet, readyForBooth, swatchPng } from "../support/booth-fixtures";
import { coatLogs, idempotencyKeys, prepRecords, uploads } from "../../server/db/schema";
import type { BoothDto } from "../../shared/schemas/booth.schema";

const MIN = 60_000;
/** Later than the test shop's records (they carry the real clock). */
const T0 = Date.parse("2035-06-01T09:00:00Z");
const KEY = "6f1c2a4e-0b7d-4c1e-9a55-3d2f8e7b1c90";

async function clockShop() {
  const clock = { now: T0 };
  const s = await makeShop({ now: () => clock.now });
  return { s, clock };
}

const coat = (s: Shop, body: object, key: string | null = KEY, cookie = s.cookies.painter) => {
  const r = request(s.app).post("/api/coat-logs").set("Cookie", cookie);
  return (key == null ? r : r.set("Idempotency-Key", key)).send({ jobId: s.jobA.id, boothTemp: 21, tempUnit: "C", humidityPct: 50, ...body });
};
const firstCoat = (plan: ReturnType<typeof readyForBooth>) => ({ layerId: plan.layers[0]!.id, coatNumber: 1 });
const coatRows = (s: Shop) => s.db.select().from(coatLogs).where(eq(coatLogs.jobId, s.jobA.id)).all();

describe("Idempotency-Key on coat logs", () => {
  it("the same key twice stores one coat and gives the first answer again, from another tablet too", async () => {
    const { s, clock } = await clockShop();
    const plan = readyForBooth(s);
    const first = await coat(s, firstCoat(plan));
    expect(first.status).toBe(201);
    expect(first.headers["idempotent-replayed"]).toBeUndefined();

    clock.now += 5 * MIN;
    const again = await coat(s, firstCoat(plan));
    expect(again.status).toBe(201);
    expect(again.headers["idempotent-replayed"]).toBe("true");
    // The first answer, word for word (serverNow included), not a new booth card.
    expect(again.body).toEqual(first.body);

    // The painter's second tablet (its own session) sends the same queued entry: still one coat.
    const otherTablet = await cookieFor(s, s.painter.id);
    const third = await coat(s, firstCoat(plan), KEY, otherTablet);
    expect(third.status).toBe(201);
    expect(third.body).toEqual(first.body);
    expect(coatRows(s)).toHaveLength(1);
  });

  it("the same key with a different body is refused with 422 naming the header, and nothing is stored", async () => {
    const { s } = await clockShop();
    const plan = readyForBooth(s);
    expect((await coat(s, firstCoat(plan))).status).toBe(201);
    const changed = await coat(s, { ...firstCoat(plan), humidityPct: 61 });
    expect(changed.status).toBe(422);
    expect(changed.body.error.code).toBe("idempotency_key_reused");
    expect(changed.body.error.fields).toEqual({ "Idempotency-Key": "Already used for a different request" });
    // The same key on another route is a different request too.
    const elsewhere = await request(s.app).post(`/api/coat-logs/${coatRows(s)[0]!.id}/corrections`).set("Cookie", s.cookies.painter).set("Idempotency-Key", KEY).send({ reason: "Typo", humidityPct: 55 });
    expect(elsewhere.status).toBe(422);
    expect(coatRows(s)).toHaveLength(1);
  });

  it("keys belong to their user: the owner's request under the painter's key is handled as its own", async () => {
    const { s } = await clockShop();
    const plan = readyForBooth(s);
    expect((await coat(s, firstCoat(plan))).status).toBe(201);
    // Not the painter's stored answer: the owner's own request, refused because coat 1 is already logged.
    const owner = await coat(s, firstCoat(plan), KEY, s.cookies.owner);
    expect(owner.status).toBe(409);
    expect(owner.body.error.message).toMatch(/next coat is coat 2 of 2/);
    expect(coatRows(s)).toHaveLength(1);
  });

  it("a refused entry keeps no answer: the same key is accepted once the reason is fixed", async () => {
    const { s } = await clockShop();
    const plan = readyForBooth(s);
    s.db.update(prepRecords).set({ signedOffAt: null, signedOffBy: null }).run();
    const refused = await coat(s, firstCoat(plan));
    expect(refused.status).toBe(409);
    expect(refused.body.error.fields).toHaveProperty("prepOverrideReason");
    expect(s.db.select().from(idempotencyKeys).all()).toEqual([]);
    s.db.update(prepRecords).set({ signedOffAt: Date.now(), signedOffBy: s.painter.id }).run();
    expect((await coat(s, firstCoat(plan))).status).toBe(201);
    expect(coatRows(s)).toHaveLength(1);
  });

  it("a key that is not a plain token is a 400 naming the header", async () => {
    const { s } = await clockShop();
    const plan = readyForBooth(s);
    const res = await coat(s, firstCoat(plan), "short");
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("Idempotency-Key");
    expect(coatRows(s)).toHaveLength(0);
  });

  it("without the header nothing changes: two taps of the same coat are one coat and a 409", async () => {
    const { s } = await clockShop();
    const plan = readyForBooth(s);
    expect((await coat(s, firstCoat(plan), null)).status).toBe(201);
    expect((await coat(s, firstCoat(plan), null)).status).toBe(409);
    expect(coatRows(s)).toHaveLength(1);
  });
});

describe("late entries: the time made (at)", () => {
  it("keeps the spray time from the tablet and the time it arrived", async () => {
    const { s } = await clockShop();
    const plan = readyForBooth(s);
    const madeAt = new Date(T0 - 40 * MIN).toISOString();
    const res = await coat(s, { ...firstCoat(plan), at: madeAt });
    expect(res.status).toBe(201);
    const row = coatRows(s)[0]!;
    expect(row.at).toBe(T0 - 40 * MIN);
    expect(row.createdAt).toBe(T0);
    const dto = (res.body as BoothDto).coatLogs[0]!;
    expect(dto).toMatchObject({ at: madeAt, loggedAt: new Date(T0).toISOString() });
    // Timers run from the spray time: 40 min ago + 10 min flash (the fixture's sealer) is long over.
    expect((res.body as BoothDto).next).toMatchObject({ state: "spray", coat: 2, timer: { kind: "flash", endsAt: new Date(T0 - 30 * MIN).toISOString() } });
  });

  it("refuses a time in the future, before the job, or before the batch, naming at", async () => {
    const { s } = await clockShop();
    const plan = readyForBooth(s);
    const future = await coat(s, { ...firstCoat(plan), at: new Date(T0 + 10 * MIN).toISOString() });
    expect(future.status).toBe(400);
    expect(future.body.error.fields).toEqual({ at: "In the future" });
    const beforeJob = await coat(s, { ...firstCoat(plan), at: new Date(s.jobA.createdAt - MIN).toISOString() }, "key-before-job");
    expect(beforeJob.status).toBe(400);
    expect(beforeJob.body.error.fields).toEqual({ at: "Before the job was created" });
    addMixedSheet(s, s.jobA.id, plan.version.id, plan.layers[0]!.id, T0 - 20 * MIN);
    const beforeBatch = await coat(s, { ...firstCoat(plan), at: new Date(T0 - 30 * MIN).toISOString() }, "key-before-batch");
    expect(beforeBatch.status).toBe(400);
    expect(beforeBatch.body.error.fields).toEqual({ at: "Before its batch was mixed" });
    const notATime = await coat(s, { ...firstCoat(plan), at: "yesterday" }, "key-not-a-time");
    expect(notATime.status).toBe(400);
    expect(notATime.body.error.fields).toHaveProperty("at");
    expect(coatRows(s)).toHaveLength(0);
  });
});

describe("Idempotency-Key on corrections, prep sign-offs and booth photos", () => {
  it("a correction sent twice is one correction", async () => {
    const { s } = await clockShop();
    const plan = readyForBooth(s);
    await coat(s, firstCoat(plan), null);
    const id = coatRows(s)[0]!.id;
    const send = () => request(s.app).post(`/api/coat-logs/${id}/corrections`).set("Cookie", s.cookies.painter).set("Idempotency-Key", "fix-humidity-1").send({ reason: "Read the gauge wrong", humidityPct: 55 });
    const a = await send();
    const b = await send();
    expect([a.status, b.status]).toEqual([201, 201]);
    expect(b.body).toEqual(a.body);
    expect(coatRows(s).filter((c) => c.correctsId === id)).toHaveLength(1);
  });

  it("a sign-off sent twice is one sign-off, at the time it was made", async () => {
    const { s } = await clockShop();
    const rec = await s.as("painter").post("/api/prep-records").send({ itemId: s.itemA.id, scuffMedium: "scuff_pad", scuffGrit: 600, cleaner: "Wax and grease remover", tackCloth: true });
    expect(rec.status).toBe(201);
    const at = new Date(T0 - 15 * MIN).toISOString();
    const send = () => request(s.app).post(`/api/prep-records/${rec.body.id}/sign-off`).set("Cookie", s.cookies.painter).set("Idempotency-Key", "sign-off-0001").send({ at });
    const a = await send();
    const b = await send();
    // Without the key, the second would be a 409 "already signed off".
    expect([a.status, b.status]).toEqual([200, 200]);
    expect(b.body).toEqual(a.body);
    expect(a.body.signedOffAt).toBe(at);
    const row = s.db.select().from(prepRecords).where(eq(prepRecords.id, rec.body.id)).get()!;
    expect([row.signedOffAt, row.updatedAt]).toEqual([T0 - 15 * MIN, T0]);
  });

  it("a photo sent twice is one photo with the same answer; another photo or other fields under the same key is a 422", async () => {
    const { s, clock } = await clockShop();
    const png = await swatchPng();
    const takenAt = new Date(T0 - 25 * MIN).toISOString();
    const send = (file: Buffer, caption = "Booth photo") =>
      request(s.app)
        .post("/api/uploads")
        .set("Cookie", s.cookies.painter)
        .set("Idempotency-Key", "photo-key-01")
        .field("ownerType", "job")
        .field("ownerId", String(s.jobA.id))
        .field("caption", caption)
        .field("at", takenAt)
        .attach("file", file, "booth.png");
    const a = await send(png);
    clock.now += 5 * MIN;
    const b = await send(png);
    expect([a.status, b.status]).toEqual([201, 201]);
    expect(b.headers["idempotent-replayed"]).toBe("true");
    expect(b.body).toEqual(a.body);
    // The time it was taken on the tablet, and the time it arrived (the first send).
    expect(a.body).toMatchObject({ takenAt, createdAt: new Date(T0).toISOString() });
    const other = await send(await swatchPng({ r: 10, g: 200, b: 10 }));
    expect(other.status).toBe(422);
    expect(other.body.error.fields).toEqual({ "Idempotency-Key": "Already used for a different request" });
    const otherCaption = await send(png, "Another caption");
    expect(otherCaption.status).toBe(422);
    expect(otherCaption.body.error.code).toBe("idempotency_key_reused");
    const rows = s.db.select().from(uploads).all();
    expect(rows).toHaveLength(1);
    expect(rows[0]!.takenAt).toBe(T0 - 25 * MIN);
  });

  it("a photo's time taken is refused in the future or before the job, naming at", async () => {
    const { s } = await clockShop();
    const png = await swatchPng();
    const send = (at: string) =>
      request(s.app).post("/api/uploads").set("Cookie", s.cookies.painter).field("ownerType", "job").field("ownerId", String(s.jobA.id)).field("at", at).attach("file", png, "booth.png");
    const future = await send(new Date(T0 + 10 * MIN).toISOString());
    expect(future.status).toBe(400);
    expect(future.body.error.fields).toEqual({ at: "In the future" });
    const beforeJob = await send(new Date(s.jobA.createdAt - MIN).toISOString());
    expect(beforeJob.status).toBe(400);
    expect(beforeJob.body.error.fields).toEqual({ at: "Before the job was created" });
    expect(s.db.select().from(uploads).all()).toHaveLength(0);
  });
});
