import { and, asc, desc, eq } from "drizzle-orm";
import sharp from "sharp";
import { converter } from "culori";
import { coatLogs, guns, jobItems, jobs, jobStageEvents, materials, mixSheets, panelReadings, planVersions, prepRecords, testPanels, uploads } from "../schema";
import { storeFile } from "../../modules/uploads/storage";
import { freezePlanVersion, jobPlanRow, loadPlanVersion } from "../../modules/plans/plans.service";
import { needsAdhesionPromoter } from "../../../shared/domain/substrates";
import { coatCount } from "../../../shared/domain/booth";
import type { Stage } from "../../../shared/domain/stages";
import type { LayerKind } from "../../../shared/domain/layers";
import type { PanelLight, SpraySetup } from "../../../shared/domain/spray-setup";
import type { SeedContext } from "./core";

/*
 * Demo prep records, coat logs, test panels and photos. Everything is invented: the L*a*b* readings come from a
 * simple made-up model (ground colour seen through n coats of dye, twice), not from any meter or maker.
 */

const MIN = 60_000;
const HOUR = 60 * MIN;
const SPRAYED: Stage[] = ["in_booth", "curing", "finishing", "ready", "delivered"];

type Rgb = [number, number, number];
/** Invented linear-RGB reflectance of each ground, and absorbance per coat of each candy at 6:1. */
const GROUNDS: { name: string; code: string; rgb: Rgb }[] = [
  { name: "Fine silver", code: "S3-B10", rgb: [0.62, 0.63, 0.66] },
  { name: "Bright gold", code: "S3-B11", rgb: [0.66, 0.5, 0.2] },
  { name: "Bright white", code: "S3-B01", rgb: [0.82, 0.82, 0.8] },
  { name: "Jet black", code: "S3-B02", rgb: [0.035, 0.035, 0.04] },
];
const CANDIES: { name: string; code: string; absorb: Rgb }[] = [
  { name: "Apple red", code: "S4-B01", absorb: [0.012, 0.2, 0.13] },
  { name: "Cobalt", code: "S4-B02", absorb: [0.19, 0.09, 0.012] },
  { name: "Tangerine", code: "S4-B03", absorb: [0.008, 0.06, 0.21] },
  { name: "Emerald", code: "S4-B04", absorb: [0.17, 0.015, 0.11] },
  { name: "Root beer", code: "S4-B06", absorb: [0.06, 0.11, 0.16] },
  { name: "Violet", code: "S4-B05", absorb: [0.07, 0.2, 0.03] },
];

const toLab = converter("lab65");
const toRgb = converter("rgb");

/** Colour of `coats` coats of candy at clear:toner over a ground: T = 10^(−2·A·n·f/f₆) per channel (light crosses twice). */
function panelColour(ground: Rgb, absorb: Rgb, coats: number, clear: number, toner: number) {
  const strength = (toner / (clear + toner)) / (1 / 7);
  const lin = ground.map((g, i) => g * 10 ** (-2 * absorb[i]! * coats * strength)) as Rgb;
  const lab = toLab({ mode: "lrgb", r: lin[0], g: lin[1], b: lin[2] });
  return { L: lab.l, a: lab.a, b: lab.b };
}

/** sRGB 0–255 for a Lab reading (for the swatch photo). */
export function swatchRgb(lab: { L: number; a: number; b: number }) {
  const c = toRgb({ mode: "lab65", l: lab.L, a: lab.a, b: lab.b });
  const ch = (v: number) => Math.max(0, Math.min(255, Math.round(v * 255)));
  return { r: ch(c.r), g: ch(c.g), b: ch(c.b) };
}

const round2 = (n: number) => Math.round(n * 100) / 100;

async function photo(ctx: SeedContext, rgb: { r: number; g: number; b: number }, name: string, ribbon = false) {
  if (!ctx.uploadsDir) return null;
  // A panel swatch: the colour with a lighter band, as a sprayed panel catches the light.
  const size = 160;
  const band = Buffer.from(
    `<svg width="${size}" height="${size}"><defs><linearGradient id="g" x1="0" y1="0" x2="1" y2="1"><stop offset="0" stop-color="#fff" stop-opacity="0.35"/><stop offset="0.45" stop-color="#fff" stop-opacity="0"/><stop offset="1" stop-color="#000" stop-opacity="0.25"/></linearGradient></defs><rect width="${size}" height="${size}" fill="url(#g)"/>${ribbon ? `<rect y="${size - 22}" width="${size}" height="22" fill="#000" fill-opacity="0.35"/>` : ""}</svg>`,
  );
  const buffer = await sharp({ create: { width: size, height: size, channels: 3, background: rgb } })
    .composite([{ input: band }])
    .jpeg({ quality: 82 })
    .toBuffer();
  return storeFile(ctx.uploadsDir, { buffer, size: buffer.length, originalname: name } as Express.Multer.File, "photo");
}

export async function addPhoto(
  ctx: SeedContext,
  owner: { ownerType: "job" | "prep_record" | "panel" | "inspection_item"; ownerId: number; jobId: number | null },
  rgb: { r: number; g: number; b: number },
  name: string,
  extra: { caption?: string; shareable?: boolean; by?: string | null; at: number; light?: PanelLight },
) {
  const stored = await photo(ctx, rgb, name, owner.ownerType === "job");
  if (!stored) return;
  ctx.db
    .insert(uploads)
    .values({ ...owner, kind: "photo", ...stored, caption: extra.caption ?? null, shareable: extra.shareable ?? false, light: extra.light ?? null, uploadedBy: extra.by ?? null, createdAt: extra.at })
    .run();
}

/** The shop's guns (invented names, described the way a painter would). */
const GUNS = [
  { name: "Gun 1 (primer and sealer)", description: "HVLP, 1.8 mm tip" },
  { name: "Gun 2 (ground and candy)", description: "HVLP, 1.3 mm tip, kept clean for colour" },
  { name: "Gun 3 (clear)", description: "Reduced-pressure, 1.3 mm tip, clear only" },
  { name: "Touch-up gun", description: "HVLP mini, 0.8 mm tip, for small parts and repairs" },
];

/** A typical set-up per layer kind (common practice for HVLP guns: about 25–30 psi at the inlet, 6–8 in from the part). */
function setupFor(kind: LayerKind, gunIds: number[], metric: boolean): SpraySetup {
  const base = { pressureUnit: metric ? ("bar" as const) : ("psi" as const), distanceUnit: metric ? ("cm" as const) : ("in" as const) };
  const psi = (p: number) => (metric ? Math.round((p / 14.5038) * 10) / 10 : p);
  const len = (inches: number) => (metric ? Math.round(inches * 2.54) : inches);
  switch (kind) {
    case "sealer":
    case "prep":
      return { ...base, gunId: gunIds[0]!, tipMm: 1.8, inletPressure: psi(26), distance: len(6), fanWidth: len(10), overlapPct: 50 };
    case "clear":
      return { ...base, gunId: gunIds[2]!, tipMm: 1.3, inletPressure: psi(29), distance: len(6), fanWidth: len(10), overlapPct: 50 };
    case "candy":
      return { ...base, gunId: gunIds[1]!, tipMm: 1.3, inletPressure: psi(24), distance: len(7), fanWidth: len(8), overlapPct: 75 };
    default:
      return { ...base, gunId: gunIds[1]!, tipMm: 1.3, inletPressure: psi(28), distance: len(6), fanWidth: len(9), overlapPct: 50 };
  }
}

/** Codes of the ground and toner in a job's latest plan version, and its candy coats (what the demo panels follow). */
function planRecipe(ctx: SeedContext, jobId: number): { groundCode?: string; tonerCode?: string; candyCoats?: number; candyLayerId?: number } {
  const plan = jobPlanRow(ctx.db, jobId);
  if (!plan) return {};
  const latest = ctx.db.select({ id: planVersions.id }).from(planVersions).where(eq(planVersions.planId, plan.id)).orderBy(desc(planVersions.version)).limit(1).get();
  if (!latest) return {};
  const layers = loadPlanVersion({ db: ctx.db }, latest.id).layers;
  const ground = layers.find((l) => l.kind === "ground_coat")?.components.find((c) => c.category === "ground_coat");
  const candyLayer = layers.find((l) => l.kind === "candy");
  const toner = candyLayer?.components.find((c) => c.category === "toner");
  return { groundCode: ground?.materialCode, tonerCode: toner?.materialCode, candyCoats: candyLayer ? coatCount(candyLayer.coats) : undefined, candyLayerId: candyLayer?.id };
}

function stageAt(ctx: SeedContext, jobId: number, stage: Stage) {
  return ctx.db
    .select({ at: jobStageEvents.at })
    .from(jobStageEvents)
    .where(and(eq(jobStageEvents.jobId, jobId), eq(jobStageEvents.toStage, stage)))
    .orderBy(asc(jobStageEvents.at))
    .get()?.at;
}

type PanelSeed = {
  ground: (typeof GROUNDS)[number];
  candy: (typeof CANDIES)[number];
  clear: number;
  coats: number;
  lab: { L: number; a: number; b: number } | null;
  at: number;
  jobId?: number | null;
  notes?: string | null;
  by: string;
  setup?: SpraySetup;
  planLayerId?: number | null;
  mixSheetId?: number | null;
  conditions?: { boothTemp: number; tempUnit: "C" | "F"; humidityPct: number };
};

/** One test panel row, linked to the catalogue's ground and toner where the codes exist. */
function insertPanel(ctx: SeedContext, p: PanelSeed): number {
  const materialId = (code: string) => ctx.db.select({ id: materials.id }).from(materials).where(eq(materials.code, code)).get()?.id ?? null;
  return ctx.db
    .insert(testPanels)
    .values({
      groundName: p.ground.name,
      groundMaterialId: materialId(p.ground.code),
      candyName: p.candy.name,
      candyMaterialId: materialId(p.candy.code),
      letDownClear: p.clear,
      letDownToner: 1,
      coats: p.coats,
      jobId: p.jobId ?? null,
      labL: p.lab?.L ?? null,
      labA: p.lab?.a ?? null,
      labB: p.lab?.b ?? null,
      sprayedOn: new Date(p.at).toISOString().slice(0, 10),
      notes: p.notes ?? null,
      ...p.setup,
      planLayerId: p.planLayerId ?? null,
      mixSheetId: p.mixSheetId ?? null,
      ...p.conditions,
      createdBy: p.by,
      createdAt: p.at,
      updatedAt: p.at,
    })
    .returning({ id: testPanels.id })
    .get().id;
}

export async function seedBooth(ctx: SeedContext) {
  const jobsInOrder = [...ctx.jobs].sort((a, b) => a.createdAt - b.createdAt);
  const gunIds = GUNS.map((g) => ctx.db.insert(guns).values({ ...g, createdAt: ctx.now - 400 * 86_400_000, updatedAt: ctx.now - 400 * 86_400_000 }).returning({ id: guns.id }).get()!.id);

  // ---- Prep records: signed off on every job that reached the booth; part-done on jobs in prep.
  let prepIndex = 0;
  for (const job of jobsInOrder) {
    const sprayed = SPRAYED.includes(job.stage);
    if (!sprayed && job.stage !== "in_prep") continue;
    const by = job.painterId ?? ctx.userIds.painter;
    const boothAt = stageAt(ctx, job.id, "in_booth");
    const prepAt = stageAt(ctx, job.id, "in_prep") ?? job.createdAt;
    const items = ctx.db.select().from(jobItems).where(eq(jobItems.jobId, job.id)).orderBy(asc(jobItems.id)).all();
    for (const [i, item] of items.entries()) {
      const plastic = needsAdhesionPromoter(item.substrate);
      const at = sprayed ? (boothAt ?? ctx.now) - 3 * HOUR + i * 10 * MIN : Math.min(ctx.now - HOUR, prepAt + 2 * HOUR + i * 20 * MIN);
      // Jobs in prep: the first item finished and signed off on every other job, the rest part-done.
      const complete = sprayed || (prepIndex % 2 === 0 && i === 0);
      const record = ctx.db
        .insert(prepRecords)
        .values({
          jobId: job.id,
          itemId: item.id,
          substrate: item.substrate,
          scuffMedium: item.substrate === "existing_finish" ? "scuff_pad" : i % 2 ? "hand_sanding" : "da_sanding",
          scuffGrit: item.substrate === "existing_finish" ? 800 : 400 + (i % 3) * 100,
          cleaner: complete || i === 0 ? "Wax and grease remover (S1-B01), then waterborne final wipe" : null,
          tackCloth: complete,
          adhesionPromoter: plastic && complete,
          adhesionPromoterProduct: plastic && complete ? "Plastic adhesion promoter, clear (S1-B04)" : null,
          notes: i === 0 && prepIndex % 3 === 0 ? "Feathered two chips on the edge before the final scuff." : null,
          preparedBy: by,
          preparedAt: at,
          signedOffBy: complete ? by : null,
          signedOffAt: complete ? at + 5 * MIN : null,
          createdAt: at - HOUR,
          updatedAt: at,
        })
        .returning({ id: prepRecords.id })
        .get();
      if (i === 0 && prepIndex % 2 === 0) {
        await addPhoto(ctx, { ownerType: "prep_record", ownerId: record.id, jobId: job.id }, { r: 170, g: 168, b: 160 }, "prep.jpg", { caption: "Scuffed and cleaned, ready to tack", by, at });
      }
    }
    prepIndex++;
  }

  // ---- Coat logs: every layer of jobs past the booth; jobs in the booth stop before the clear (one mid-candy).
  let boothIndex = 0;
  const conditions = [
    { t: 21, u: "C" as const, h: 48 },
    { t: 70, u: "F" as const, h: 52 },
    { t: 22.5, u: "C" as const, h: 44 },
    { t: 68, u: "F" as const, h: 57 },
  ];
  for (const job of jobsInOrder) {
    if (!SPRAYED.includes(job.stage)) continue;
    const row = ctx.db.select().from(jobs).where(eq(jobs.id, job.id)).get()!;
    let versionId = row.sprayedPlanVersionId;
    if (versionId == null) {
      const plan = jobPlanRow(ctx.db, job.id);
      if (!plan) continue;
      versionId = ctx.db.select({ id: planVersions.id }).from(planVersions).where(eq(planVersions.planId, plan.id)).orderBy(desc(planVersions.version)).limit(1).get()?.id ?? null;
      if (versionId == null) continue;
    }
    const version = loadPlanVersion({ db: ctx.db }, versionId);
    const layers = version.layers.filter((l) => l.kind !== "prep");
    const painter = job.painterId ?? ctx.userIds.painter;
    const boothAt = stageAt(ctx, job.id, "in_booth") ?? ctx.now - 2 * HOUR;
    const cond = conditions[boothIndex % conditions.length]!;
    const inBooth = job.stage === "in_booth";
    const midCandy = inBooth && boothIndex % 2 === 0;
    let t = boothAt + 15 * MIN;
    let first: number | null = null;
    let lastCoatId: number | null = null;
    for (const [li, layer] of layers.entries()) {
      if (inBooth && li === layers.length - 1) break;
      const sheet = ctx.db
        .select()
        .from(mixSheets)
        .where(and(eq(mixSheets.jobId, job.id), eq(mixSheets.layerId, layer.id), eq(mixSheets.status, "mixed")))
        .orderBy(desc(mixSheets.mixedAt))
        .get();
      if (sheet?.mixedAt) t = Math.max(t, sheet.mixedAt + 5 * MIN);
      const total = coatCount(layer.coats);
      const stopAt = midCandy && layer.kind === "candy" ? Math.min(2, total) : total;
      for (let c = 1; c <= stopAt; c++) {
        t += layer.minutesPerCoat * MIN;
        const at = Math.min(t, ctx.now - 10 * MIN);
        first ??= at;
        lastCoatId = ctx.db
          .insert(coatLogs)
          .values({
            jobId: job.id,
            planVersionId: versionId,
            layerId: layer.id,
            coatNumber: c,
            at,
            painterId: painter,
            boothTemp: cond.t,
            tempUnit: cond.u,
            humidityPct: cond.h + (c % 2),
            note: layer.kind === "candy" && c === stopAt ? "Checked depth against the approved panel under the booth lights." : null,
            ...setupFor(layer.kind, gunIds, cond.u === "C"),
            mixSheetId: sheet?.id ?? null,
            createdAt: at,
          })
          .returning({ id: coatLogs.id })
          .get().id;
        if (c < total) t += layer.flashMinutes * MIN;
      }
      if (stopAt < total) break;
      t += layer.dryMinutes * MIN;
    }
    if (first != null) freezePlanVersion(ctx.db, versionId, job.id, first);
    // One correction on an older job: a temperature read in the wrong unit.
    if (job.stage === "delivered" && lastCoatId != null && boothIndex % 3 === 0) {
      const orig = ctx.db.select().from(coatLogs).where(eq(coatLogs.id, lastCoatId)).get()!;
      ctx.db
        .insert(coatLogs)
        .values({ ...orig, id: undefined, boothTemp: orig.tempUnit === "C" ? 69 : 21, tempUnit: orig.tempUnit === "C" ? "F" : "C", correctsId: orig.id, correctionReason: "Read the wall thermometer's other scale", createdAt: orig.createdAt + 20 * MIN })
        .run();
    }
    boothIndex++;
  }

  // ---- The panel library: several candies over several grounds, 2 to 6 coats, most with meter readings.
  let n = 0;
  const library: { ground: string; candy: string; coats: number; lab: { L: number; a: number; b: number } | null; id: number }[] = [];
  const libraryAt = ctx.now - 150 * 86_400_000;
  for (const candy of CANDIES) {
    for (const ground of GROUNDS) {
      if (ground.name === "Jet black" && candy.name !== "Emerald") continue;
      if ((candy.name === "Root beer" || candy.name === "Violet") && ground.name === "Bright white") continue;
      const coatsList = candy.name === "Apple red" && ground.name === "Fine silver" ? [2, 3, 4, 5, 6] : [3, 4, 5];
      for (const coats of coatsList) {
        n++;
        const clear = candy.name === "Apple red" && ground.name === "Fine silver" && coats === 6 ? 8 : 6;
        const exact = panelColour(ground.rgb, candy.absorb, coats, clear, 1);
        const noise = ((n * 37) % 11) / 25 - 0.2;
        const lab = n % 7 === 3 ? null : { L: round2(exact.L + noise), a: round2(exact.a - noise), b: round2(exact.b + noise / 2) };
        const at = libraryAt + n * 86_400_000;
        const id = insertPanel(ctx, {
          ground,
          candy,
          clear,
          coats,
          lab,
          at,
          notes: clear === 8 ? "Let down 8:1 to see how far the extra coats take it." : null,
          by: n % 2 ? ctx.userIds.painter : ctx.userIds.painter2,
          setup: setupFor("candy", gunIds, n % 4 === 0),
        });
        library.push({ ground: ground.name, candy: candy.name, coats, lab, id });
        await addPhoto(ctx, { ownerType: "panel", ownerId: id, jobId: null }, swatchRgb(exact), `panel-${id}.jpg`, { by: ctx.userIds.painter, at });
      }
    }
  }

  // ---- Approved colours: candy jobs booked or later get a panel sprayed for them and approved by the customer.
  let approvedCount = 0;
  for (const job of jobsInOrder) {
    const t = job.title.toLowerCase();
    if (!t.includes("candy") || !["booked", "in_prep", ...SPRAYED].includes(job.stage)) continue;
    // The job's own plan says which toner, ground and how many candy coats; the title is the fallback.
    const recipe = planRecipe(ctx, job.id);
    const candy = CANDIES.find((c) => c.code === recipe.tonerCode) ?? CANDIES.find((c) => t.includes(c.name.toLowerCase()));
    if (!candy) continue;
    const ground =
      GROUNDS.find((g) => g.code === recipe.groundCode) ?? (t.includes("gold") ? GROUNDS[1]! : t.includes("black") ? GROUNDS[3]! : t.includes("white") ? GROUNDS[2]! : GROUNDS[0]!);
    const coats = recipe.candyCoats ?? 4 + (approvedCount % 2);
    const exact = panelColour(ground.rgb, candy.absorb, coats, 6, 1);
    const lab = { L: round2(exact.L), a: round2(exact.a), b: round2(exact.b) };
    const at = job.createdAt + 2 * 86_400_000;
    const candySheet =
      recipe.candyLayerId != null
        ? ctx.db.select({ id: mixSheets.id }).from(mixSheets).where(and(eq(mixSheets.layerId, recipe.candyLayerId), eq(mixSheets.status, "mixed"))).orderBy(asc(mixSheets.id)).get()
        : undefined;
    const id = insertPanel(ctx, {
      ground,
      candy,
      clear: 6,
      coats,
      lab,
      at,
      jobId: job.id,
      notes: "Customer chose this one in daylight at the shop door.",
      by: job.painterId ?? ctx.userIds.painter,
      setup: setupFor("candy", gunIds, approvedCount % 3 === 2),
      planLayerId: recipe.candyLayerId ?? null,
      mixSheetId: candySheet?.id ?? null,
      conditions: approvedCount % 3 === 2 ? { boothTemp: 21, tempUnit: "C", humidityPct: 47 } : { boothTemp: 70, tempUnit: "F", humidityPct: 50 },
    });
    // Read again under the booth's fluorescent tubes and a warm indoor lamp: the candy shifts a little under each.
    ctx.db
      .insert(panelReadings)
      .values([
        { panelId: id, light: "booth", illuminant: "F11", labL: round2(lab.L - 0.4), labA: round2(lab.a - 1.1), labB: round2(lab.b + 0.9) },
        { panelId: id, light: "warm_indoor", illuminant: "A", labL: round2(lab.L + 0.6), labA: round2(lab.a + 2.3), labB: round2(lab.b + 3.1) },
      ])
      .run();
    ctx.db.update(jobs).set({ approvedPanelId: id }).where(eq(jobs.id, job.id)).run();
    await addPhoto(ctx, { ownerType: "panel", ownerId: id, jobId: job.id }, swatchRgb(exact), `approved-${job.id}.jpg`, { caption: "Approved colour panel, daylight", shareable: true, by: job.painterId, at, light: "daylight" });
    await addPhoto(ctx, { ownerType: "panel", ownerId: id, jobId: job.id }, swatchRgb({ L: lab.L + 0.6, a: lab.a + 2.3, b: lab.b + 3.1 }), `approved-${job.id}-warm.jpg`, {
      caption: "The same panel under a warm indoor lamp",
      shareable: true,
      by: job.painterId,
      at: at + MIN,
      light: "warm_indoor",
    });
    // Jobs at the booth also have a check panel sprayed with the batch: one a match, one only close.
    if (["in_booth", "curing"].includes(job.stage)) {
      const drift = approvedCount % 2 ? 0.5 : 1.6;
      const checkAt = (stageAt(ctx, job.id, "in_booth") ?? ctx.now - 86_400_000) + 2 * HOUR;
      const checkLab = { L: round2(lab.L - drift), a: round2(lab.a + drift / 2), b: round2(lab.b - drift / 3) };
      const checkId = insertPanel(ctx, {
        ground,
        candy,
        clear: 6,
        coats,
        lab: checkLab,
        at: checkAt,
        jobId: job.id,
        notes: "Check panel sprayed alongside the job with the same batch.",
        by: job.painterId ?? ctx.userIds.painter,
      });
      await addPhoto(ctx, { ownerType: "panel", ownerId: checkId, jobId: job.id }, swatchRgb(checkLab), `check-${job.id}.jpg`, { by: job.painterId, at: checkAt });
    }
    approvedCount++;
  }

  // ---- Progress photos on jobs that went through the booth; about half are shared with the customer.
  let photoIndex = 0;
  for (const job of jobsInOrder) {
    if (!SPRAYED.includes(job.stage)) continue;
    const t = job.title.toLowerCase();
    const candy = CANDIES.find((c) => t.includes(c.name.toLowerCase()));
    const colour = candy ? swatchRgb(panelColour(GROUNDS[0]!.rgb, candy.absorb, 4, 6, 1)) : t.includes("black") ? { r: 20, g: 20, b: 24 } : t.includes("white") ? { r: 236, g: 234, b: 226 } : { r: 40, g: 120, b: 124 };
    const at = (stageAt(ctx, job.id, "curing") ?? stageAt(ctx, job.id, "in_booth") ?? ctx.now - HOUR) + 30 * MIN;
    await addPhoto(ctx, { ownerType: "job", ownerId: job.id, jobId: job.id }, colour, `job-${job.id}.jpg`, {
      caption: job.stage === "in_booth" ? "In the booth" : "Out of the booth, clear coat curing",
      shareable: photoIndex % 2 === 0,
      by: job.painterId,
      at: Math.min(at, ctx.now - MIN),
    });
    photoIndex++;
  }
  return { panels: library.length };
}
