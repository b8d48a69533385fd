import { describe, expect, it } from "vitest";
import request from "supertest";
import { cookieFor, makeShop, editAt } from "../support/test-app";
import { addPhoto } from "../support/booth-fixtures";
import { jobItems } from "../../server/db/schema";

describe("prep records", () => {
  it("takes a grit written the painter's way (P320) as well as the bare number, and names the field when it is not a grit", async () => {
    const s = await makeShop();
    const res = await s.as("painter").post("/api/prep-records").send({ itemId: s.itemA.id, scuffMedium: "scuff_pad", scuffGrit: "P320" });
    expect(res.status).toBe(201);
    expect(res.body.scuffGrit).toBe(320);
    const bad = await s.as("painter").post("/api/prep-records").send({ itemId: s.itemB.id, scuffGrit: "Pfine" });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toContain("scuffGrit");
  });

  it("a painter records the steps, sees what is missing, signs off; then it is locked", async () => {
    const s = await makeShop();
    const start = await s.as("painter").post("/api/prep-records").send({ itemId: s.itemA.id, scuffMedium: "scuff_pad", scuffGrit: "600" });
    expect(start.status).toBe(201);
    expect(start.body).toMatchObject({ itemName: "Helmet shell", substrate: "steel", scuffGrit: 600, status: "in_progress", preparedByName: "Test painter", needsAdhesionPromoter: false });
    // Steel needs scuff, clean and tack (no adhesion promoter): two still to do.
    expect(start.body.missingSteps).toEqual(["clean", "tack"]);

    const early = await s.as("painter").post(`/api/prep-records/${start.body.id}/sign-off`);
    expect(early.status).toBe(409);
    expect(early.body.error.message).toBe("Not ready to sign off: still to record cleaned, tack cloth");
    expect(Object.keys(early.body.error.fields).sort()).toEqual(["cleaner", "tackCloth"]);

    const done = await editAt(s, "painter", `/api/prep-records/${start.body.id}`, { cleaner: "Wax and grease remover", tackCloth: true, notes: "Two passes of cleaner" });
    expect(done.body.missingSteps).toEqual([]);
    const signed = await s.as("painter").post(`/api/prep-records/${start.body.id}/sign-off`);
    expect(signed.status).toBe(200);
    expect(signed.body).toMatchObject({ status: "signed_off", signedOffByName: "Test painter", signedOffAt: expect.any(String) });

    const locked = await editAt(s, "painter", `/api/prep-records/${start.body.id}`, { scuffGrit: 800 });
    expect(locked.status).toBe(409);
    const job = await s.as("painter").get(`/api/prep-records?jobId=${s.jobA.id}`);
    expect(job.body).toMatchObject({ jobId: s.jobA.id, allSignedOff: true, items: [{ itemId: s.itemA.id, status: "signed_off" }] });
  });

  it("bare plastic needs the adhesion promoter before sign-off (shared/domain/substrates needsAdhesionPromoter)", async () => {
    const s = await makeShop();
    const item = s.db.insert(jobItems).values({ jobId: s.jobA.id, name: "Visor trim", substrate: "plastic", surfaceArea: 0.05, areaUnit: "m2" }).returning().get();
    const rec = await s.as("painter").post("/api/prep-records").send({ itemId: item.id, scuffMedium: "hand_sanding", scuffGrit: 400, cleaner: "Plastic cleaner", tackCloth: true });
    expect(rec.body).toMatchObject({ needsAdhesionPromoter: true, missingSteps: ["adhesionPromoter"] });
    expect((await s.as("painter").post(`/api/prep-records/${rec.body.id}/sign-off`)).status).toBe(409);
    await editAt(s, "painter", `/api/prep-records/${rec.body.id}`, { adhesionPromoter: true, adhesionPromoterProduct: "Shop AP-2" });
    expect((await s.as("painter").post(`/api/prep-records/${rec.body.id}/sign-off`)).status).toBe(200);
    const job = await s.as("owner").get(`/api/prep-records?jobId=${s.jobA.id}`);
    expect(job.body.allSignedOff).toBe(false); // the helmet shell has no record yet
    expect(job.body.items.map((i: { status: string }) => i.status)).toEqual(["none", "signed_off"]);
  });

  it("only the office reopens a sign-off, with a reason kept on the record", async () => {
    const s = await makeShop();
    const rec = await s.as("painter").post("/api/prep-records").send({ itemId: s.itemA.id, scuffMedium: "da_sanding", cleaner: "Solvent wipe", tackCloth: true });
    await s.as("painter").post(`/api/prep-records/${rec.body.id}/sign-off`);
    expect((await s.as("painter").post(`/api/prep-records/${rec.body.id}/reopen`).send({ reason: "x" })).status).toBe(403);
    const noReason = await s.as("owner").post(`/api/prep-records/${rec.body.id}/reopen`).send({});
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields).toHaveProperty("reason");
    const reopened = await s.as("owner").post(`/api/prep-records/${rec.body.id}/reopen`).send({ reason: "Fish-eyes found; clean again" });
    expect(reopened.body).toMatchObject({ status: "in_progress", signedOffAt: null });
    expect(reopened.body.reopenedNote).toMatch(/reopened by Test owner: Fish-eyes found; clean again/);
    expect((await s.as("owner").post(`/api/prep-records/${rec.body.id}/reopen`).send({ reason: "again" })).status).toBe(409);
  });

  it("one record per item; painters reach only their jobs; customers never; bad input names the field", async () => {
    const s = await makeShop();
    await s.as("painter").post("/api/prep-records").send({ itemId: s.itemA.id });
    expect((await s.as("painter").post("/api/prep-records").send({ itemId: s.itemA.id })).status).toBe(409);
    const p2 = await cookieFor(s, s.painter2.id);
    expect((await request(s.app).get(`/api/prep-records?jobId=${s.jobA.id}`).set("Cookie", p2)).status).toBe(404);
    expect((await request(s.app).get("/api/prep-records/1").set("Cookie", p2)).status).toBe(404);
    expect((await s.as("painter").post("/api/prep-records").send({ itemId: s.itemB.id })).status).toBe(400);
    expect((await s.as("customer").get(`/api/prep-records?jobId=${s.jobA.id}`)).status).toBe(403);
    const bad = await s.as("owner").post("/api/prep-records").send({ itemId: s.itemB.id, scuffMedium: "sandblaster", scuffGrit: 12.5, tackCloth: "yes" });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(["scuffGrit", "scuffMedium", "tackCloth"]);
  });

  it("shows the record's photos", async () => {
    const s = await makeShop();
    const rec = await s.as("painter").post("/api/prep-records").send({ itemId: s.itemA.id });
    const photo = await addPhoto(s, { ownerType: "prep_record", ownerId: rec.body.id, jobId: s.jobA.id });
    const got = await s.as("painter").get(`/api/prep-records/${rec.body.id}`);
    expect(got.body.photos).toEqual([expect.objectContaining({ id: photo.id, thumbUrl: `/api/uploads/${photo.id}/thumb` })]);
  });
});
