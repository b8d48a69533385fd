import Database from "better-sqlite3";
import { mkdirSync } from "node:fs";
import path from "node:path";
import { coatCount } from "../../../shared/domain/booth";
import { migrateDb, openDb } from "../../../server/db/client";
import { seedDemo } from "../../../server/db/seed/index";
import { insertBoothRecords, insertPrep } from "./booth";
import { insertCustomers, insertJobs, type People } from "./jobs";
import { loadTemplates, planCopier, type SeedLayer } from "./plans";
import { DAY, HOUR, MIN, dateOnly, makeRand } from "./random";

export const TARGET = { jobs: 10_000, coatLogs: 100_000, mixSheets: 20_000 };
/** The shop ten times over, for how cost grows with it. */
export const LARGE = { jobs: 100_000, coatLogs: 1_000_000, mixSheets: 200_000 };
export type ShopSize = typeof TARGET;

const count = (sqlite: Database.Database, table: string) => (sqlite.prepare(`select count(*) as n from ${table}`).get() as { n: number }).n;

/**
 * The large shop: the real migrations and the normal demo seed (so the demo accounts exist), then invented bulk data
 * through prepared statements in one transaction, up to TARGET in total.
 */
export async function seedLargeShop(dataDir: string, now = Date.now(), target: ShopSize = TARGET) {
  mkdirSync(dataDir, { recursive: true });
  const dbFile = path.join(dataDir, "coatwright.db");
  const db = openDb(dbFile);
  migrateDb(db);
  await seedDemo(db, now, { uploadsDir: path.join(dataDir, "uploads") });
  db.$client.close();

  const sqlite = new Database(dbFile);
  sqlite.pragma("journal_mode = WAL");
  sqlite.pragma("foreign_keys = ON");
  const rand = makeRand(20261202);
  sqlite.transaction(() => {
    const people = peopleOf(sqlite);
    const customerIds = [...(sqlite.prepare("select id from customers").pluck().all() as number[]), ...insertCustomers(sqlite, rand, 2400, now)];
    const jobs = insertJobs(sqlite, rand, people, customerIds, target.jobs - count(sqlite, "jobs"), now);
    insertPrep(sqlite, rand, jobs, now);
    insertBoothRecords(sqlite, rand, jobs, { coats: target.coatLogs - count(sqlite, "coat_logs"), sheets: target.mixSheets - count(sqlite, "mix_sheets") }, now);
  })();
  const totals = Object.fromEntries(["jobs", "job_items", "job_stage_events", "customers", "plans", "plan_layers", "prep_records", "coat_logs", "mix_sheets", "mix_sheet_lines"].map((t) => [t, count(sqlite, t)]));
  sqlite.close();
  return { dbFile, totals };
}

/** The demo people, plus two painters who worked at the shop in earlier years (invented). */
function peopleOf(sqlite: Database.Database): People {
  const idOf = (email: string) => sqlite.prepare("select id from users where email = ?").pluck().get(email) as string;
  const painter = idOf("painter@demo.coatwright.test");
  const hash = sqlite.prepare("select password_hash from users where id = ?").pluck().get(painter) as string;
  const since = Date.now() - 2300 * DAY;
  const addPainter = (id: string, email: string, name: string) => {
    sqlite.prepare("insert into users (id, email, name, role, password_hash, active, created_at, updated_at) values (?, ?, ?, 'painter', ?, 1, ?, ?)").run(id, email, name, hash, since, since);
    return id;
  };
  return {
    owner: idOf("owner@demo.coatwright.test"),
    estimator: idOf("estimator@demo.coatwright.test"),
    painters: [
      { id: painter, share: 45 },
      { id: idOf("painter2@demo.coatwright.test"), share: 35 },
      { id: addPainter("bench-painter-3", "painter3@demo.coatwright.test", "Oskar Brandt"), share: 12 },
      { id: addPainter("bench-painter-4", "painter4@demo.coatwright.test", "Lena Farrier"), share: 8 },
    ],
  };
}

export type SprayJob = { jobId: number; versionId: number; coats: { layerId: number; coatNumber: number }[]; layers: SeedLayer[] };

/**
 * Jobs ready for the booth for the coat-log measurement: in prep, assigned to `painterEmail`, prep signed off, a
 * finish plan of the first template. Added after the read routes are measured, so the jobs table is not skewed.
 */
export function addSprayPool(dbFile: string, painterEmail: string, n: number, now = Date.now()): SprayJob[] {
  const sqlite = new Database(dbFile);
  sqlite.pragma("busy_timeout = 5000");
  const rand = makeRand(7);
  const painter = sqlite.prepare("select id from users where email = ?").pluck().get(painterEmail) as string;
  const owner = sqlite.prepare("select id from users where role = 'owner' limit 1").pluck().get() as string;
  const customerId = sqlite.prepare("select id from customers order by id limit 1").pluck().get() as number;
  const template = loadTemplates(sqlite)[0]!;
  const copyPlan = planCopier(sqlite, rand, owner);
  const insertJob = sqlite.prepare("insert into jobs (customer_id, title, stage, due_date, assigned_painter_id, stage_changed_at, created_at, updated_at) values (?, ?, 'in_prep', ?, ?, ?, ?, ?)");
  const insertItem = sqlite.prepare("insert into job_items (job_id, name, substrate, surface_area, area_unit, created_at, updated_at) values (?, 'Fuel tank', 'steel', 0.6, 'm2', ?, ?)");
  const insertEvent = sqlite.prepare("insert into job_stage_events (job_id, from_stage, to_stage, note, user_id, at) values (?, ?, ?, null, ?, ?)");
  const insertPrep = sqlite.prepare(
    "insert into prep_records (job_id, item_id, substrate, scuff_medium, scuff_grit, cleaner, tack_cloth, prepared_by, prepared_at, signed_off_by, signed_off_at, created_at, updated_at) values (?, ?, 'steel', 'da_sanding', 400, 'Wax and grease remover', 1, ?, ?, ?, ?, ?, ?)",
  );
  const pool = sqlite.transaction(() =>
    Array.from({ length: n }, (_, i) => {
      const at = now - 5 * DAY + i * MIN;
      const jobId = Number(insertJob.run(customerId, `Booth run ${i + 1}, candy red over silver`, dateOnly(now + 7 * DAY), painter, now - HOUR, at, now - HOUR).lastInsertRowid);
      const itemId = Number(insertItem.run(jobId, at, at).lastInsertRowid);
      ["inquiry", "quoted", "booked", "in_prep"].forEach((to, k, all) => insertEvent.run(jobId, k ? all[k - 1] : null, to, owner, at + k * HOUR));
      insertPrep.run(jobId, itemId, painter, now - 2 * HOUR, painter, now - HOUR, now - 2 * HOUR, now - HOUR);
      const plan = copyPlan(template, jobId, at);
      const coats = plan.layers.filter((l) => l.kind !== "prep").flatMap((l) => Array.from({ length: coatCount(l.coats) }, (_, c) => ({ layerId: l.id, coatNumber: c + 1 })));
      return { jobId, versionId: plan.versionId, coats, layers: plan.layers };
    }),
  )();
  sqlite.close();
  return pool;
}

/**
 * A draft mix sheet for every layer with a mix of the pool's jobs, lines split by parts as the engine would (percent
 * components taken of the parts total): what the mix-sheet record measurement records, one sheet per request.
 */
export function addDraftSheets(dbFile: string, pool: SprayJob[], painterEmail: string, now = Date.now()): number[] {
  const sqlite = new Database(dbFile);
  sqlite.pragma("busy_timeout = 5000");
  const painter = sqlite.prepare("select id from users where email = ?").pluck().get(painterEmail) as string;
  const insertSheet = sqlite.prepare(
    `insert into mix_sheets (job_id, plan_version_id, layer_id, status, mode, amount, unit, weigh, total_ml, voc_g_per_l, pot_life_minutes, created_by, created_at)
     values (?, ?, ?, 'draft', 'total', 300, 'mL', 0, 300, null, null, ?, ?)`,
  );
  const insertLine = sqlite.prepare("insert into mix_sheet_lines (mix_sheet_id, position, material_id, label, planned_ml) values (?, ?, ?, ?, ?)");
  // Recording takes stock from the lots: enough on the shelf for every sheet of the run, so none is refused for stock.
  sqlite.prepare("update material_lots set quantity_on_hand = quantity_on_hand + 100000").run();
  const ids = sqlite.transaction(() =>
    pool.flatMap((job) =>
      job.layers
        .filter((l) => l.components.length > 0)
        .map((layer) => {
          const partsTotal = layer.components.reduce((n, c) => n + (c.parts ?? 0), 0) || 1;
          const shares = layer.components.map((c) => c.parts ?? ((c.percent ?? 0) / 100) * partsTotal);
          const sum = shares.reduce((a, b) => a + b, 0);
          const id = Number(insertSheet.run(job.jobId, job.versionId, layer.id, painter, now).lastInsertRowid);
          layer.components.forEach((c, i) => insertLine.run(id, i + 1, c.materialId, c.label, (300 * shares[i]!) / sum));
          return id;
        }),
    ),
  )();
  sqlite.close();
  return ids;
}
