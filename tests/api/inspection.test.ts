import { describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { editAt, makeShop, type Shop } from "../support/test-app";
import { jpegWithExif } from "../support/booth-fixtures";
import { draftQuote, sentQuote } from "../support/quotes";
import { inspectionItems, inspections, jobItems, uploads } from "../../server/db/schema";
import { M2_PER_FT2, suggestItemPrep } from "../../shared/domain/intake";

/** The helmet shell (steel, 0.6 m²): factory finish that softens, minor rust and dents, visor snaps to take off. */
const helmet = (s: Shop) => ({
  itemId: s.itemA.id,
  existingFinish: "factory_finish",
  dents: "minor",
  rust: "minor",
  hardwareToRemove: "Visor snaps",
  solventTest: "softens",
  note: "INTERNAL: customer dropped it twice",
});

const path = (s: Shop) => `/api/jobs/${s.jobA.id}/inspection`;

describe("intake inspection", () => {
  it("reads as an empty inspection (version 0) before one is saved", async () => {
    const s = await makeShop();
    const res = await s.as("estimator").get(path(s));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ jobId: s.jobA.id, version: 0, exists: false, suggestion: null, inspectedAt: null, quote: null });
    expect(res.body.items).toEqual([expect.objectContaining({ itemId: s.itemA.id, itemName: "Helmet shell", inspection: null, suggestion: null })]);
  });

  it("saves the checklist at version 0, then suggests prep hours and a prep line priced by the quote totals", async () => {
    const s = await makeShop();
    const res = await s.as("estimator").put(path(s)).send({ version: 0, customerSummary: "Sound shell; a little rust by the vent.", notes: "INTERNAL: check the vent holes", items: [helmet(s)] });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ version: 1, exists: true, inspectedByName: "Test estimator", notes: "INTERNAL: check the vent holes" });
    const item = res.body.items[0];
    expect(item.inspection).toMatchObject({ existingFinish: "factory_finish", dents: "minor", rust: "minor", pinholes: "none", solventTest: "softens", hardwareToRemove: "Visor snaps" });
    // Common-practice rules (shared/domain/intake.ts) on 0.6 m²: scuff/clean/mask 1 h/m² = 0.6, barrier sealer 0.5 h/m² = 0.3,
    // minor rust 1 h/m² = 0.6, minor dents 0.5 h, hardware 0.5 h → 2.5 h.
    expect(item.suggestion.hours).toBe(2.5);
    expect(item.suggestion.reasons.map((r: { hours: number }) => r.hours)).toEqual([0.6, 0.3, 0.6, 0.5, 0.5]);
    // Default labour rate $85.00/h (DEFAULT_SETTINGS): 2.5 h × 8500 ¢ = 21 250 ¢.
    expect(res.body.suggestion).toMatchObject({ hours: 2.5, amountCents: 21250, line: { kind: "labour", hours: 2.5, rateCents: 8500 } });
    expect(res.body.suggestion.line.description).toBe("Prep found at intake inspection (Helmet shell: dents (minor), rust (minor), hardware to remove: Visor snaps)");
  });

  it("works in the measured area and its unit (ft² to m² by 0.3048² exactly, NIST SP 811)", () => {
    const base = { name: "Hood", existingFinish: "factory_finish", solventTest: "unaffected", hardwareToRemove: null, dents: "none", cracks: "none", pinholes: "none", stressCracks: "none", rust: "none", earlierRepairs: "none" } as const;
    expect(M2_PER_FT2).toBe(0.09290304);
    // 30 ft² = 2.787 m² → 2.787 h of scuffing, rounded up to the quarter: 3 h.
    expect(suggestItemPrep({ ...base, area: 30, areaUnit: "ft2" }).hours).toBe(3);
    // Powder coat comes off whatever the solvent says: 1 + 2.5 h/m² on 1 m² = 3.5 h.
    expect(suggestItemPrep({ ...base, area: 1, areaUnit: "m2", existingFinish: "powder_coat" }).hours).toBe(3.5);
  });

  it("a measured area replaces the item's own in the suggestion", async () => {
    const s = await makeShop();
    const res = await s.as("estimator").put(path(s)).send({ version: 0, items: [{ itemId: s.itemA.id, existingFinish: "primer", solventTest: "unaffected", measuredArea: "2", areaUnit: "m2" }] });
    expect(res.status).toBe(200);
    expect(res.body.items[0].inspection).toMatchObject({ measuredArea: 2, measuredAreaUnit: "m2" });
    expect(res.body.suggestion.hours).toBe(2);
  });

  it("an edit must send the version it read: a stale one is a 409 with the inspection as it is now", async () => {
    const s = await makeShop();
    expect((await s.as("estimator").put(path(s)).send({ version: 0, items: [helmet(s)] })).status).toBe(200);
    const again = await s.as("owner").put(path(s)).send({ version: 0, items: [{ ...helmet(s), rust: "major" }] });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("version_conflict");
    expect(again.body.error.current).toMatchObject({ version: 1, items: [{ inspection: { rust: "minor" } }] });
    const ok = await editAt(s, "owner", path(s), { items: [{ ...helmet(s), rust: "major" }] }, { method: "put" });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ version: 2, items: [{ inspection: { rust: "major" } }] });
    expect(s.db.select().from(inspectionItems).all()).toHaveLength(1);
    const missing = await s.as("owner").put(path(s)).send({ items: [helmet(s)] });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields).toHaveProperty("version");
  });

  it("bad input is a 400 naming the field, and nothing is saved", async () => {
    const s = await makeShop();
    const cases: [object, string][] = [
      [{ version: 0, items: [{ ...helmet(s), pinholes: "minor" }] }, "items.0.pinholes"],
      [{ version: 0, items: [{ ...helmet(s), itemId: s.itemB.id }] }, "items.0.itemId"],
      [{ version: 0, items: [{ ...helmet(s), rust: "lots" }] }, "items.0.rust"],
      [{ version: 0, items: [{ ...helmet(s), solventTest: undefined }] }, "items.0.solventTest"],
      [{ version: 0, items: [{ ...helmet(s), measuredArea: 3 }] }, "items.0.areaUnit"],
      [{ version: 0, items: [{ ...helmet(s), measuredArea: "-1", areaUnit: "m2" }] }, "items.0.measuredArea"],
      [{ version: 0, items: [helmet(s), helmet(s)] }, "items"],
    ];
    for (const [body, field] of cases) {
      const res = await s.as("estimator").put(path(s)).send(body);
      expect({ field, status: res.status }).toEqual({ field, status: 400 });
      expect(Object.keys(res.body.error.fields)).toContain(field);
    }
    expect(s.db.select().from(inspections).all()).toEqual([]);
  });

  it("pinholes and stress cracks are recorded on a fibreglass item", async () => {
    const s = await makeShop();
    const scoop = s.db.insert(jobItems).values({ jobId: s.jobA.id, name: "Hood scoop", substrate: "fiberglass", surfaceArea: 0.4, areaUnit: "m2" }).returning().get();
    const res = await s.as("estimator").put(path(s)).send({ version: 0, items: [{ itemId: scoop.id, existingFinish: "old_custom_finish", pinholes: "major", stressCracks: "minor", solventTest: "lifts" }] });
    expect(res.status).toBe(200);
    // 0.4 m²: base 0.4, strip 2.5 × 0.4 = 1, pinholes major 1.5 × 0.4 = 0.6, stress cracks minor 1 h → 3.0 h.
    expect(res.body.items.find((i: { itemId: number }) => i.itemId === scoop.id).suggestion.hours).toBe(3);
  });

  it("photos with notes go through the checked upload path; the customer sees shared ones with the quote, and no notes or hours", async () => {
    const s = await makeShop();
    const saved = await s.as("estimator").put(path(s)).send({ version: 0, customerSummary: "Sound shell; a little rust by the vent.", notes: "INTERNAL: check the vent holes", items: [helmet(s)] });
    const ownerId = saved.body.items[0].inspection.id;
    const fake = await s.as("estimator").post("/api/uploads").field("ownerType", "inspection_item").field("ownerId", String(ownerId)).attach("file", Buffer.from("not a photo"), "rust.jpg");
    expect(fake.status).toBe(415);
    const jpeg = await jpegWithExif();
    const shown = await s.as("estimator").post("/api/uploads").field("ownerType", "inspection_item").field("ownerId", String(ownerId)).field("caption", "Rust by the vent").field("shareable", "true").attach("file", jpeg, "rust.jpg");
    expect(shown.status).toBe(201);
    expect(shown.body).toMatchObject({ ownerType: "inspection_item", jobId: s.jobA.id, shareable: true, caption: "Rust by the vent" });
    const hidden = await s.as("estimator").post("/api/uploads").field("ownerType", "inspection_item").field("ownerId", String(ownerId)).field("caption", "INTERNAL crack photo").attach("file", jpeg, "crack.jpg");
    expect(hidden.status).toBe(201);
    const office = await s.as("estimator").get(path(s));
    expect(office.body.items[0].inspection.photos.map((p: { caption: string }) => p.caption)).toEqual(["Rust by the vent", "INTERNAL crack photo"]);
    // Another job's inspected item cannot take a photo from a painter who is not on it.
    const painterB = await s.as("painter").post("/api/uploads").field("ownerType", "inspection_item").field("ownerId", "999").attach("file", jpeg, "x.jpg");
    expect(painterB.status).toBe(404);

    const q = await sentQuote(s);
    const portal = await s.as("customer").get(`/api/portal/quotes/${q.id}`);
    expect(portal.status).toBe(200);
    expect(portal.body.inspection).toMatchObject({
      summary: "Sound shell; a little rust by the vent.",
      items: [{ name: "Helmet shell", existingFinish: "Factory finish", solventTest: "Softens: seal it first", findings: ["dents (minor)", "rust (minor)", "hardware to remove: Visor snaps"] }],
    });
    expect(portal.body.inspection.items[0].photos).toEqual([expect.objectContaining({ id: shown.body.id, caption: "Rust by the vent" })]);
    expect(portal.text).not.toMatch(/INTERNAL|hours|rateCents/);
    const photo = await s.as("customer").get(portal.body.inspection.items[0].photos[0].url);
    expect(photo.status).toBe(200);
    expect((await s.as("customer").get(`/api/uploads/${hidden.body.id}`)).status).toBe(404);
  });

  it("adds the suggested prep line to the job's quote once (again replaces it), with the quote's edit version", async () => {
    const s = await makeShop();
    await s.as("estimator").put(path(s)).send({ version: 0, items: [helmet(s)] });
    const q = await draftQuote(s);
    const before = await s.as("estimator").get(path(s));
    expect(before.body.quote).toMatchObject({ id: q.id, editVersion: q.editVersion, hasPrepLine: false });
    const added = await s.as("estimator").post(`${path(s)}/prep-line`).send({ quoteId: q.id, editVersion: q.editVersion });
    expect(added.status).toBe(200);
    const prep = added.body.current.lines.filter((l: { description: string }) => l.description.startsWith("Prep found at intake inspection"));
    expect(prep).toEqual([expect.objectContaining({ kind: "labour", hours: 2.5, rateCents: 8500 })]);
    // The quote's own totals: the sample lines' labour (10 h × $95 = $950) plus 2.5 h × $85 = $212.50.
    expect(added.body.current.totals.labourCents).toBe(95000 + 21250);
    expect(added.body.current.lines[1]).toMatchObject({ kind: "labour", hours: 2.5 });

    const stale = await s.as("estimator").post(`${path(s)}/prep-line`).send({ quoteId: q.id, editVersion: q.editVersion });
    expect(stale.status).toBe(409);
    await editAt(s, "estimator", path(s), { items: [{ ...helmet(s), rust: "major" }] }, { method: "put" });
    const again = await s.as("estimator").post(`${path(s)}/prep-line`).send({ quoteId: q.id, editVersion: added.body.editVersion });
    expect(again.status).toBe(200);
    const lines = again.body.current.lines.filter((l: { description: string }) => l.description.startsWith("Prep found"));
    // Major rust is 3 h/m² instead of 1: 2.5 + 1.2 = 3.7 → 3.75 h.
    expect(lines).toEqual([expect.objectContaining({ hours: 3.75 })]);
    expect((await s.as("estimator").get(path(s))).body.quote.hasPrepLine).toBe(true);
  });

  it("refuses a quote of another job, and a prep line before anything is inspected", async () => {
    const s = await makeShop();
    const other = await draftQuote(s, s.jobB.id);
    await s.as("estimator").put(path(s)).send({ version: 0, items: [helmet(s)] });
    const wrong = await s.as("estimator").post(`${path(s)}/prep-line`).send({ quoteId: other.id, editVersion: other.editVersion });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toHaveProperty("quoteId");
    const empty = await s.as("estimator").post(`/api/jobs/${s.jobB.id}/inspection/prep-line`).send({ quoteId: other.id, editVersion: other.editVersion });
    expect(empty.status).toBe(409);
    expect(s.db.select().from(uploads).where(eq(uploads.ownerType, "inspection_item")).all()).toEqual([]);
  });
});

describe("a prep line on a job without a quote", () => {
  it("starts a draft quote with the line on it; once the job has a quote, the quote must be named", async () => {
    const s = await makeShop();
    await s.as("estimator").put(`/api/jobs/${s.inquiryA.id}/inspection`).send({ version: 0, items: [] });
    const nothing = await s.as("estimator").post(`/api/jobs/${s.inquiryA.id}/inspection/prep-line`).send({});
    expect(nothing.status).toBe(409);
    const item = s.db.insert(jobItems).values({ jobId: s.inquiryA.id, name: "Roof", substrate: "plastic", surfaceArea: 1, areaUnit: "m2" }).returning().get();
    await editAt(s, "estimator", `/api/jobs/${s.inquiryA.id}/inspection`, { items: [{ itemId: item.id, existingFinish: "factory_finish", solventTest: "unaffected" }] }, { method: "put" });
    const started = await s.as("estimator").post(`/api/jobs/${s.inquiryA.id}/inspection/prep-line`).send({});
    expect(started.status).toBe(200);
    expect(started.body).toMatchObject({ jobId: s.inquiryA.id, status: "draft" });
    // 1 m² of scuff, clean and mask at 1 h/m² (common practice) = 1 h.
    expect(started.body.current.lines.filter((l: { description: string }) => l.description.startsWith("Prep found"))).toEqual([expect.objectContaining({ hours: 1 })]);
    const named = await s.as("estimator").post(`/api/jobs/${s.inquiryA.id}/inspection/prep-line`).send({});
    expect(named.status).toBe(400);
    expect(named.body.error.fields).toHaveProperty("quoteId");
    const half = await s.as("estimator").post(`/api/jobs/${s.inquiryA.id}/inspection/prep-line`).send({ quoteId: started.body.id });
    expect(half.status).toBe(400);
    expect(half.body.error.fields).toHaveProperty("editVersion");
  });
});

describe("measured area from a form", () => {
  it("a unit without an area is ignored (the item's own area counts); an area without a unit is refused", async () => {
    const s = await makeShop();
    const ok = await s.as("estimator").put(path(s)).send({ version: 0, items: [{ itemId: s.itemA.id, existingFinish: "primer", solventTest: "not_done", measuredArea: "", areaUnit: "ft2" }] });
    expect(ok.status).toBe(200);
    expect(ok.body.items[0].inspection).toMatchObject({ measuredArea: null, measuredAreaUnit: null });
    // The helmet's own 0.6 m² at 1 h/m² (common practice) → 0.6 h, up to the quarter: 0.75 h.
    expect(ok.body.suggestion.hours).toBe(0.75);
  });
});
