import sharp from "sharp";
import { coatLogs, layerComponents, materials, mixSheetLines, mixSheets, planLayers, planVersions, plans, prepRecords, testPanels, uploads } from "../../server/db/schema";
import { storeFile } from "../../server/modules/uploads/storage";
import type { LayerKind } from "../../shared/domain/layers";
import { makeShop, type Shop, type TestApp } from "./test-app";

/** After the test shop's records are made (they carry the real clock), so every test time is later. */
export const T0 = Date.parse("2035-06-01T09:00:00Z");

/** A shop whose clock the test moves (every server time comes from deps.now). */
export async function clockShop() {
  const clock = { now: T0 };
  const s = await makeShop({ now: () => clock.now });
  return { s, clock };
}

/** A small real PNG (a colour swatch) made with sharp. */
export async function swatchPng(rgb: { r: number; g: number; b: number } = { r: 150, g: 20, b: 40 }, size = 64) {
  return sharp({ create: { width: size, height: size, channels: 3, background: rgb } }).png().toBuffer();
}

/** A JPEG carrying EXIF (camera make/model, and an artist tag standing in for GPS-style private data). */
export async function jpegWithExif() {
  return sharp({ create: { width: 120, height: 80, channels: 3, background: { r: 10, g: 90, b: 160 } } })
    .jpeg({ quality: 80 })
    .withExif({ IFD0: { Make: "TestCam", Model: "Booth-9000", Artist: "Secret Painter Name", Copyright: "EXIF-PROBE" } })
    .toBuffer();
}

export type LayerSpec = { kind: LayerKind; name: string; coats: number; flashMinutes: number; minutesPerCoat?: number; dryMinutes: number; hazardous?: boolean };

/** Sealer 2 coats, candy 3 coats, 2K clear 2 coats (isocyanate hardener): the plan most tests spray. */
export const DEFAULT_LAYERS: LayerSpec[] = [
  { kind: "sealer", name: "Grey sealer", coats: 2, flashMinutes: 10, minutesPerCoat: 4, dryMinutes: 30 },
  { kind: "candy", name: "Candy garnet", coats: 3, flashMinutes: 8, minutesPerCoat: 5, dryMinutes: 20 },
  { kind: "clear", name: "2K clear", coats: 2, flashMinutes: 12, minutesPerCoat: 6, dryMinutes: 0, hazardous: true },
];

let seq = 0;

/** A job plan (one version, not frozen) with the given layers, straight into the tables. Materials carry costs on purpose. */
export function addBoothPlan(t: TestApp, jobId: number, layers: LayerSpec[] = DEFAULT_LAYERS) {
  seq++;
  const base = t.db
    .insert(materials)
    .values({ code: `BT-BASE-${seq}`, name: "Test base", category: "clear", purchaseUnit: "L", costCents: 4200, potLifeMinutes: 180, flammable: true })
    .returning()
    .get();
  const hardener = t.db
    .insert(materials)
    .values({ code: `BT-HARD-${seq}`, name: "Test hardener", category: "hardener", purchaseUnit: "L", costCents: 5100, potLifeMinutes: 120, containsIsocyanates: true })
    .returning()
    .get();
  const safe = t.db
    .insert(materials)
    .values({ code: `BT-SAFE-${seq}`, name: "Test waterborne", category: "sealer", purchaseUnit: "L", costCents: 3000 })
    .returning()
    .get();
  const plan = t.db.insert(plans).values({ name: `Booth test plan ${seq}`, jobId }).returning().get();
  const version = t.db.insert(planVersions).values({ planId: plan.id, version: 1 }).returning().get();
  const rows = layers.map((l, i) => {
    const layer = t.db
      .insert(planLayers)
      .values({ versionId: version.id, position: i, kind: l.kind, name: l.name, coats: l.coats, flashMinutes: l.flashMinutes, minutesPerCoat: l.minutesPerCoat ?? 5, dryMinutes: l.dryMinutes, gunTip: "1.3 mm", pressurePsi: 26 })
      .returning()
      .get();
    if (l.hazardous) {
      t.db.insert(layerComponents).values({ layerId: layer.id, position: 0, materialId: base.id, label: "clear", parts: 4 }).run();
      t.db.insert(layerComponents).values({ layerId: layer.id, position: 1, materialId: hardener.id, label: "hardener", parts: 1 }).run();
    } else {
      t.db.insert(layerComponents).values({ layerId: layer.id, position: 0, materialId: safe.id, label: "coat", parts: 1 }).run();
    }
    return layer;
  });
  return { plan, version, layers: rows, materials: { base, hardener, safe } };
}

/** A batch recorded as mixed for a layer, with a line carrying a cost (which the booth must never show). */
export function addMixedSheet(t: TestApp, jobId: number, versionId: number, layerId: number, mixedAt: number, potLifeMinutes = 120) {
  const sheet = t.db
    .insert(mixSheets)
    .values({ jobId, planVersionId: versionId, layerId, status: "mixed", mode: "total", amount: 300, unit: "mL", totalMl: 300, potLifeMinutes, mixedAt })
    .returning()
    .get();
  const m = t.db.select().from(materials).limit(1).get()!;
  t.db.insert(mixSheetLines).values({ mixSheetId: sheet.id, position: 0, materialId: m.id, label: "clear", plannedMl: 300, actualMl: 301, lotNumber: "LOT-T1", costCents: 1234 }).run();
  return sheet;
}

/** A complete, signed-off prep record for an item (steel: no adhesion promoter needed). */
export function signOffPrep(t: TestApp, jobId: number, itemId: number, by: string, at = Date.now()) {
  return t.db
    .insert(prepRecords)
    .values({ jobId, itemId, substrate: "steel", scuffMedium: "scuff_pad", scuffGrit: 600, cleaner: "Wax and grease remover", tackCloth: true, preparedBy: by, preparedAt: at, signedOffBy: by, signedOffAt: at })
    .returning()
    .get();
}

/** Job A with a plan and signed-off prep: ready for the first coat. */
export function readyForBooth(s: Shop) {
  const plan = addBoothPlan(s, s.jobA.id);
  signOffPrep(s, s.jobA.id, s.itemA.id, s.painter.id);
  return plan;
}

/** A coat straight into the table (for setting up history). */
export function addCoat(t: TestApp, jobId: number, versionId: number, layerId: number, coatNumber: number, at: number, painterId: string) {
  return t.db.insert(coatLogs).values({ jobId, planVersionId: versionId, layerId, coatNumber, at, painterId, boothTemp: 21, tempUnit: "C", humidityPct: 50, createdAt: at }).returning().get();
}

export function addPanel(t: TestApp, values: Partial<typeof testPanels.$inferInsert> = {}) {
  return t.db
    .insert(testPanels)
    .values({ groundName: "Fine silver", candyName: "Candy garnet", letDownClear: 6, letDownToner: 1, coats: 4, ...values })
    .returning()
    .get();
}

/** A stored photo row for an owner, through the real storage (content check, EXIF strip, thumbnail). */
export async function addPhoto(t: TestApp, owner: { ownerType: "job" | "job_item" | "prep_record" | "coat_log" | "panel"; ownerId: number; jobId: number | null }, extra: { shareable?: boolean; by?: string | null } = {}) {
  const buffer = await swatchPng();
  const stored = await storeFile(t.app.deps.uploadsDir, { buffer, size: buffer.length, originalname: "swatch.png" } as Express.Multer.File, "photo");
  return t.db
    .insert(uploads)
    .values({ ...owner, kind: "photo", ...stored, shareable: extra.shareable ?? false, uploadedBy: extra.by ?? null, createdAt: Date.now() })
    .returning()
    .get();
}
