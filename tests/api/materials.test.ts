import { describe, expect, it } from "vitest";
import { existsSync, readdirSync } from "node:fs";
import { auditLog } from "../../server/db/schema";
import { makeShop, editAt } from "../support/test-app";
import { finishFixtures, keysOf, MONEY_KEY, TINY_PDF } from "../support/finish-fixtures";
import { centsPerMl, mlToPurchaseUnit, purchaseUnitToMl } from "../../shared/domain/material-units";
import { MAX_DOCUMENT_BYTES } from "../../server/modules/uploads/storage";

const sealer = { code: "s9-b11", name: "Urethane sealer, grey", category: "sealer", purchaseUnit: "quart", costCents: 5400, volumeSolidsPct: 48, vocGPerL: 240, densityGPerMl: 1.3 };

describe("materials catalogue", () => {
  it("the office adds a material (code upper-cased) and painters read it without any cost field; customers get 403", async () => {
    const s = await makeShop();
    const created = await s.as("estimator").post("/api/materials").send(sealer);
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ code: "S9-B11", name: "Urethane sealer, grey", costCents: 5400, stockOnHand: 0, lowStock: false, cautions: [] });

    const painter = await s.as("painter").get(`/api/materials/${created.body.id}`);
    expect(painter.status).toBe(200);
    expect(painter.body.name).toBe("Urethane sealer, grey");
    expect(keysOf(painter.body).filter((k) => MONEY_KEY.test(k))).toEqual([]);
    const list = await s.as("painter").get("/api/materials");
    expect(list.body).toHaveLength(1);
    expect(keysOf(list.body).filter((k) => MONEY_KEY.test(k))).toEqual([]);
    expect((await s.as("customer").get("/api/materials")).status).toBe(403);
    expect((await s.as("painter").post("/api/materials").send({ ...sealer, code: "X-1" })).status).toBe(403);
  });

  it("rejects bad input with a 400 naming each field, and a second material with the same code with a 409", async () => {
    const s = await makeShop();
    const bad = await s.as("owner").post("/api/materials").send({ code: "bad code!", name: "", category: "paint", purchaseUnit: "bucket", costCents: 12.5, volumeSolidsPct: 140, densityGPerMl: "heavy" });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(["category", "code", "costCents", "densityGPerMl", "name", "purchaseUnit", "volumeSolidsPct"]);
    const huge = await s.as("owner").post("/api/materials").send({ ...sealer, costCents: 1e15, potLifeMinutes: 1e9 });
    expect(Object.keys(huge.body.error.fields).sort()).toEqual(["costCents", "potLifeMinutes"]);
    expect((await s.as("owner").post("/api/materials").send(sealer)).status).toBe(201);
    const dup = await s.as("owner").post("/api/materials").send({ ...sealer, name: "Other" });
    expect(dup.status).toBe(409);
    expect(dup.body.error.fields).toHaveProperty("code");
    expect((await s.as("owner").get("/api/materials/not-a-number")).status).toBe(400);
    expect((await s.as("owner").get("/api/materials/99999")).status).toBe(404);
    expect((await s.as("owner").get("/api/materials?category=paint")).status).toBe(400);
  });

  it("a cost change is audited as money with before and after", async () => {
    const s = await makeShop();
    const id = (await s.as("owner").post("/api/materials").send(sealer)).body.id;
    const res = await editAt(s, "estimator", `/api/materials/${id}`, { costCents: 5900, notes: "Price rise in spring" });
    expect(res.status).toBe(200);
    const entry = s.db.select().from(auditLog).all().find((a) => a.action === "cost_changed")!;
    expect(entry).toMatchObject({ kind: "money", entity: "material", entityId: String(id), userId: s.estimator.id });
    // The stock number and name are kept on both sides so the trail names the material in words.
    expect(entry.before).toEqual({ code: "S9-B11", name: "Urethane sealer, grey", costCents: 5400 });
    expect(entry.after).toEqual({ code: "S9-B11", name: "Urethane sealer, grey", costCents: 5900 });
  });

  it("shows hazard cautions from the flags and lists low stock", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    expect(f.hardener.cautions.map((c) => c.id)).toEqual(["isocyanates", "defer"]);
    expect(f.reducer.cautions.map((c) => c.id)).toEqual(["flammable", "defer"]);
    // Clear: 2 qt on hand, level 1 qt → fine. Take it down to 0.75 qt.
    let low = await s.as("painter").get("/api/materials/low-stock");
    expect(low.body.map((m: { code: string }) => m.code)).toEqual([]);
    await editAt(s, "owner", `/api/materials/${f.clear.id}/lots/${f.clearLot.id}`, { quantityOnHand: 0.75 }, { read: `/api/materials/${f.clear.id}`, pick: (b) => (b.lots as { id: number; version: number }[]).find((l) => l.id === f.clearLot.id)! });
    low = await s.as("painter").get("/api/materials/low-stock");
    expect(low.body.map((m: { code: string }) => m.code)).toEqual(["S9-B04"]);
    expect(low.body[0]).toMatchObject({ stockOnHand: 0.75, lowStock: true });
    expect(low.body[0]).not.toHaveProperty("costCents");
  });

  it("a material in a plan cannot be deleted (409) but can be retired; an unused one is deleted", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    const inUse = await s.as("owner").delete(`/api/materials/${f.clear.id}`);
    expect(inUse.status).toBe(409);
    await editAt(s, "owner", `/api/materials/${f.clear.id}`, { active: false });
    const codes = (await s.as("owner").get("/api/materials")).body.map((m: { code: string }) => m.code);
    expect(codes).not.toContain("S9-B04");
    expect((await s.as("owner").get("/api/materials?includeInactive=true")).body.map((m: { code: string }) => m.code)).toContain("S9-B04");
    expect((await s.as("owner").delete(`/api/materials/${f.spare.id}`)).status).toBe(204);
    expect((await s.as("owner").get(`/api/materials/${f.spare.id}`)).status).toBe(404);
  });
});

describe("lots", () => {
  it("adds, corrects and removes lots; refuses an expiry before receipt and a lot of another material", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    const added = await s.as("owner").post(`/api/materials/${f.clear.id}/lots`).send({ lotNumber: "CL-B2", quantityOnHand: "3", receivedOn: "2026-11-02", expiresOn: "" });
    expect(added.status).toBe(201);
    expect(added.body).toMatchObject({ lotNumber: "CL-B2", quantityOnHand: 3, expiresOn: null, expired: false });
    const detail = await s.as("painter").get(`/api/materials/${f.clear.id}`);
    expect(detail.body.stockOnHand).toBe(5);
    expect(detail.body.lots.map((l: { lotNumber: string }) => l.lotNumber)).toEqual(["CL-A1", "CL-B2"]);

    const backwards = await s.as("owner").post(`/api/materials/${f.clear.id}/lots`).send({ lotNumber: "X", quantityOnHand: 1, receivedOn: "2026-05-01", expiresOn: "2026-04-01" });
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.fields).toHaveProperty("expiresOn");
    expect((await s.as("owner").post(`/api/materials/${f.clear.id}/lots`).send({ lotNumber: "X", quantityOnHand: -1 })).status).toBe(400);
    expect((await s.as("owner").patch(`/api/materials/${f.hardener.id}/lots/${f.clearLot.id}`).send({ quantityOnHand: 1, version: 1 })).status).toBe(404);
    expect((await s.as("painter").patch(`/api/materials/${f.clear.id}/lots/${f.clearLot.id}`).send({ quantityOnHand: 9, version: 1 })).status).toBe(403);
    expect((await s.as("owner").delete(`/api/materials/${f.clear.id}/lots/${added.body.id}`)).status).toBe(204);
    expect((await s.as("owner").get(`/api/materials/${f.clear.id}/lots`)).body).toHaveLength(1);
  });

  it("marks an expired lot", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    const old = await s.as("owner").post(`/api/materials/${f.clear.id}/lots`).send({ lotNumber: "CL-OLD", quantityOnHand: 1, receivedOn: "2020-01-01", expiresOn: "2021-01-01" });
    expect(old.body.expired).toBe(true);
  });
});

describe("data sheets", () => {
  it("the office uploads a PDF safety data sheet; staff list and download it; customers cannot", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    const up = await s.as("owner").post(`/api/materials/${f.clear.id}/files`).field("kind", "sds").attach("file", TINY_PDF, "clear SDS.pdf");
    expect(up.status).toBe(201);
    expect(up.body).toMatchObject({ kind: "sds", mime: "application/pdf", originalName: "clear SDS.pdf", size: TINY_PDF.length });
    expect(readdirSync(s.app.deps.uploadsDir).length).toBe(1);

    const list = await s.as("painter").get(`/api/materials/${f.clear.id}/files`);
    expect(list.body.map((x: { kind: string }) => x.kind)).toEqual(["sds"]);
    const dl = await s.as("painter").get(`/api/materials/${f.clear.id}/files/${up.body.id}`).buffer(true);
    expect(dl.status).toBe(200);
    expect(dl.headers["content-type"]).toBe("application/pdf");
    expect(Buffer.compare(dl.body as Buffer, TINY_PDF)).toBe(0);
    expect((await s.as("customer").get(`/api/materials/${f.clear.id}/files/${up.body.id}`)).status).toBe(403);
    expect((await s.as("anonymous").get(`/api/materials/${f.clear.id}/files/${up.body.id}`)).status).toBe(401);
    // A file id of another material reads as not found.
    expect((await s.as("owner").get(`/api/materials/${f.hardener.id}/files/${up.body.id}`)).status).toBe(404);

    expect((await s.as("owner").delete(`/api/materials/${f.clear.id}/files/${up.body.id}`)).status).toBe(204);
    expect(readdirSync(s.app.deps.uploadsDir).length).toBe(0);
  });

  it("checks the content, not the name: a text file called .pdf is refused (415), as is a missing kind (400)", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    const fake = await s.as("owner").post(`/api/materials/${f.clear.id}/files`).field("kind", "tds").attach("file", Buffer.from("just some text, honest"), "sheet.pdf");
    expect(fake.status).toBe(415);
    const noKind = await s.as("owner").post(`/api/materials/${f.clear.id}/files`).attach("file", TINY_PDF, "sheet.pdf");
    expect(noKind.status).toBe(400);
    expect(noKind.body.error.fields).toHaveProperty("kind");
    const noFile = await s.as("owner").post(`/api/materials/${f.clear.id}/files`).field("kind", "tds");
    expect(noFile.status).toBe(400);
    expect(existsSync(s.app.deps.uploadsDir) ? readdirSync(s.app.deps.uploadsDir).length : 0).toBe(0);
  });

  it("refuses a file over the size limit with a 413", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    const big = Buffer.concat([TINY_PDF, Buffer.alloc(MAX_DOCUMENT_BYTES + 1)]);
    const res = await s.as("owner").post(`/api/materials/${f.clear.id}/files`).field("kind", "tds").attach("file", big, "big.pdf");
    expect(res.status).toBe(413);
  });
});

describe("purchase-unit conversions", () => {
  it("converts mixed millilitres into each purchase unit (NIST Handbook 44: 1 gal = 231 in³ = 3785.411784 mL; 1 lb = 453.59237 g)", () => {
    // US quart = gallon / 4 = 946.352946 mL (NIST HB 44 App. C, exact).
    expect(mlToPurchaseUnit(250, "quart", null)).toBeCloseTo(250 / 946.352946, 12);
    // US pint = 473.176473 mL; US fluid ounce = 29.5735295625 mL (same source).
    expect(mlToPurchaseUnit(62.5, "pint", null)).toBeCloseTo(62.5 / 473.176473, 12);
    expect(purchaseUnitToMl(1, "floz", null)).toBeCloseTo(29.5735295625, 10);
    // By weight through the density: 100 mL at 1.2 g/mL = 120 g = 0.12 kg = 120/453.59237 lb.
    expect(mlToPurchaseUnit(100, "kg", 1.2)).toBeCloseTo(0.12, 12);
    expect(mlToPurchaseUnit(100, "lb", 1.2)).toBeCloseTo(120 / 453.59237, 12);
    expect(() => mlToPurchaseUnit(100, "kg", null)).toThrow(/no density/);
    // $95.00 a quart → 9500 / 946.352946 cents per mL (references.md §7 RTS material cost case).
    expect(centsPerMl(9500, "quart", null)).toBeCloseTo(9500 / 946.352946, 12);
    expect(centsPerMl(1000, "kg", null)).toBeNull();
  });
});
