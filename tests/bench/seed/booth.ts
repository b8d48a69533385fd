import type Database from "better-sqlite3";
import { coatCount } from "../../../shared/domain/booth";
import { needsAdhesionPromoter } from "../../../shared/domain/substrates";
import { SPRAYED, type SeedJob } from "./jobs";
import type { SeedLayer } from "./plans";
import { HOUR, MIN, type Rand } from "./random";

/** mL per purchase unit (US customary volumes; masses in grams, turned into mL with the density): common practice. */
const ML_PER_UNIT: Record<string, number> = { mL: 1, L: 1000, floz: 29.5735, pint: 473.176, quart: 946.353, gallon: 3785.41, g: 1, kg: 1000, oz: 28.3495, lb: 453.592 };
const MASS_UNITS = new Set(["g", "kg", "oz", "lb"]);

type Material = { id: number; purchase_unit: string; cost_cents: number; voc_g_per_l: number | null; water_exempt_pct: number; density_g_per_ml: number | null; pot_life_minutes: number | null };
type Sheet = { key: number; job: SeedJob; layer: SeedLayer; at: number; totalMl: number; floz: boolean };
type Coat = { job: SeedJob; layer: SeedLayer; coat: number; at: number; sheetKey: number | null; temp: number; unit: "C" | "F"; humidity: number; note: string | null };

/** Prep records for every item of jobs in prep or past it: signed off before the booth; about half done on jobs in prep. */
export function insertPrep(sqlite: Database.Database, rand: Rand, jobs: SeedJob[], now: number) {
  const insert = sqlite.prepare(
    `insert into prep_records (job_id, item_id, substrate, scuff_medium, scuff_grit, cleaner, tack_cloth, adhesion_promoter, adhesion_promoter_product, notes,
       prepared_by, prepared_at, signed_off_by, signed_off_at, created_at, updated_at) values (?, ?, ?, ?, ?, ?, ?, ?, ?, null, ?, ?, ?, ?, ?, ?)`,
  );
  for (const job of jobs) {
    const sprayed = SPRAYED.includes(job.stage);
    if (!sprayed && job.stage !== "in_prep") continue;
    const signed = sprayed || rand.chance(0.5);
    job.itemIds.forEach((itemId, i) => {
      const substrate = job.substrates[i]!;
      const at = sprayed ? job.boothAt! - 3 * HOUR + i * 10 * MIN : now - rand.int(2, 30) * HOUR;
      const promoter = needsAdhesionPromoter(substrate) && signed;
      insert.run(job.id, itemId, substrate, rand.pick(["scuff_pad", "hand_sanding", "da_sanding"]), rand.pick([320, 400, 600]), "Wax and grease remover, then final wipe", signed ? 1 : 0,
        promoter ? 1 : 0, promoter ? "Plastic adhesion promoter (S1-B04)" : null, job.painterId, at, signed ? job.painterId : null, signed ? at + 5 * MIN : null, at - HOUR, at);
    });
  }
}

/**
 * Mix sheets and coat logs for sprayed jobs, newest first, until the totals are reached (the shop started keeping
 * batches and coats on Coatwright at some point; older jobs have none). Rows go in in time order, so ids follow time.
 */
export function insertBoothRecords(sqlite: Database.Database, rand: Rand, jobs: SeedJob[], want: { coats: number; sheets: number }, now: number) {
  const sheets: Sheet[] = [];
  const coats: Coat[] = [];
  const newestFirst = jobs.filter((j) => SPRAYED.includes(j.stage) && j.plan && j.boothAt != null).sort((a, b) => b.createdAt - a.createdAt);
  for (const job of newestFirst) {
    const layers = job.plan!.layers.filter((l) => l.kind !== "prep");
    const cut = job.stage === "in_booth" ? layers.length - 1 : layers.length; // still spraying: the clear is not on yet
    const jobCoats = layers.slice(0, cut).reduce((n, l) => n + coatCount(l.coats), 0);
    if (coats.length + jobCoats > want.coats) break;
    const unit = rand.chance(0.7) ? "C" : "F";
    const temp = unit === "C" ? rand.int(18, 26) : rand.int(64, 79);
    let t = job.boothAt! + 15 * MIN;
    for (const layer of layers.slice(0, cut)) {
      let sheetKey: number | null = null;
      if (layer.components.length && sheets.length < want.sheets) {
        sheetKey = sheets.length;
        sheets.push({ key: sheetKey, job, layer, at: t, totalMl: rand.int(5, 40) * 25, floz: rand.chance(0.3) });
        t += 5 * MIN;
      }
      for (let c = 1; c <= coatCount(layer.coats); c++) {
        t += layer.minutesPerCoat * MIN;
        const note = layer.kind === "candy" && c === coatCount(layer.coats) && rand.chance(0.3) ? "Checked the depth against the panel under the booth lights." : null;
        coats.push({ job, layer, coat: c, at: Math.min(t, now - 10 * MIN), sheetKey, temp, unit, humidity: rand.int(35, 65), note });
        t += layer.flashMinutes * MIN;
      }
      t += layer.dryMinutes * MIN;
    }
  }
  const sheetIds = insertSheets(sqlite, rand, sheets);
  const insertCoat = sqlite.prepare(
    `insert into coat_logs (job_id, plan_version_id, layer_id, coat_number, at, painter_id, booth_temp, temp_unit, humidity_pct, note, mix_sheet_id,
       prep_override_reason, corrects_id, correction_reason, voids, created_at) values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, null, ?, ?, 0, ?)`,
  );
  const lastCoat = new Map<number, { id: number; c: Coat }>();
  for (const c of coats.sort((a, b) => a.at - b.at)) {
    const id = Number(insertCoat.run(c.job.id, c.job.plan!.versionId, c.layer.id, c.coat, c.at, c.job.painterId, c.temp, c.unit, c.humidity, c.note, c.sheetKey == null ? null : sheetIds[c.sheetKey], null, null, c.at).lastInsertRowid);
    lastCoat.set(c.job.id, { id, c });
  }
  // The few left to reach the total: corrections of a temperature read on the wall thermometer's other scale.
  const corrected = [...lastCoat.values()].filter((l) => l.c.job.stage === "delivered").slice(0, want.coats - coats.length);
  for (const { id, c } of corrected) {
    const other = c.unit === "C" ? { t: Math.round((c.temp * 9) / 5 + 32), u: "F" } : { t: Math.round(((c.temp - 32) * 5) / 9), u: "C" };
    insertCoat.run(c.job.id, c.job.plan!.versionId, c.layer.id, c.coat, c.at, c.job.painterId, other.t, other.u, c.humidity, c.note, c.sheetKey == null ? null : sheetIds[c.sheetKey], id, "Read the other scale", c.at + 20 * MIN);
  }
  // The plan version each sprayed job used is frozen from its first coat (or from the day it went in the booth).
  const freeze = sqlite.prepare("update plan_versions set frozen_at = ? where id = ?");
  const sprayedWith = sqlite.prepare("update jobs set sprayed_plan_version_id = ? where id = ?");
  for (const job of jobs.filter((j) => SPRAYED.includes(j.stage) && j.plan)) {
    freeze.run(job.boothAt ?? job.createdAt, job.plan!.versionId);
    sprayedWith.run(job.plan!.versionId, job.id);
  }
  return { coats: coats.length + corrected.length, sheets: sheets.length };
}

/** Mixed batches with their lines; amounts split by parts (percent components as a share of what they are a percent of). */
function insertSheets(sqlite: Database.Database, rand: Rand, sheets: Sheet[]): number[] {
  const materials = new Map((sqlite.prepare("select * from materials").all() as Material[]).map((m) => [m.id, m]));
  const insertSheet = sqlite.prepare(
    `insert into mix_sheets (job_id, plan_version_id, layer_id, status, mode, amount, unit, weigh, total_ml, voc_g_per_l, pot_life_minutes, mixed_at, mixed_by, created_by, created_at)
     values (?, ?, ?, 'mixed', 'total', ?, ?, 0, ?, ?, ?, ?, ?, ?, ?)`,
  );
  const insertLine = sqlite.prepare(
    `insert into mix_sheet_lines (mix_sheet_id, position, material_id, label, planned_ml, actual_ml, lot_id, lot_number, voc_g_per_l, water_exempt_pct, density_g_per_ml, cost_cents)
     values (?, ?, ?, ?, ?, ?, null, ?, ?, ?, ?, ?)`,
  );
  const ids: number[] = [];
  for (const s of [...sheets].sort((a, b) => a.at - b.at)) {
    const partsTotal = s.layer.components.reduce((n, c) => n + (c.parts ?? 0), 0) || 1;
    const shares = s.layer.components.map((c) => (c.parts ?? ((c.percent ?? 0) / 100) * partsTotal) / partsTotal);
    const sum = shares.reduce((a, b) => a + b, 0);
    const comps = s.layer.components.map((c, i) => ({ c, m: materials.get(c.materialId)!, ml: (s.totalMl * shares[i]!) / sum }));
    // Invented data: a volume-weighted VOC, not the engine's less-water-and-exempt figure.
    const voc = comps.reduce((n, x) => n + (x.m.voc_g_per_l ?? 0) * x.ml, 0) / s.totalMl;
    const potLife = Math.min(...comps.map((x) => x.m.pot_life_minutes ?? Infinity));
    const amount = s.floz ? Math.round((s.totalMl / 29.5735) * 2) / 2 : s.totalMl;
    const id = Number(
      insertSheet.run(s.job.id, s.job.plan!.versionId, s.layer.id, amount, s.floz ? "floz" : "mL", s.totalMl, voc, Number.isFinite(potLife) ? potLife : null, s.at, s.job.painterId, s.job.painterId, s.at - 10 * MIN).lastInsertRowid,
    );
    comps.forEach(({ c, m, ml }, i) => {
      const unitMl = MASS_UNITS.has(m.purchase_unit) ? ML_PER_UNIT[m.purchase_unit]! / (m.density_g_per_ml ?? 1) : ML_PER_UNIT[m.purchase_unit]!;
      insertLine.run(id, i + 1, m.id, c.label, ml, ml * (1 + (rand.next() - 0.5) * 0.02), `L${rand.int(2201, 2712)}`, m.voc_g_per_l, m.water_exempt_pct, m.density_g_per_ml, Math.round((m.cost_cents * ml) / unitMl));
    });
    ids[s.key] = id;
  }
  return ids;
}
