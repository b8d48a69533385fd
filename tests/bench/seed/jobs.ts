import type Database from "better-sqlite3";
import { STAGES, type Stage } from "../../../shared/domain/stages";
import type { Substrate } from "../../../shared/domain/substrates";
import { loadTemplates, planCopier, type SeedPlan } from "./plans";
import { DAY, HOUR, dateOnly, type Rand } from "./random";

/** Invented names, combined; no real people. */
const FIRST = ["Ada", "Bram", "Cora", "Dax", "Elin", "Fenn", "Greta", "Hale", "Ines", "Jory", "Kestra", "Lio", "Maren", "Nico", "Orla", "Pim", "Quill", "Rhea", "Soren", "Tamsin", "Ulla", "Vaughn", "Wren", "Yara", "Zeb"];
const LAST = ["Ashdown", "Birchall", "Coldwater", "Dunmore", "Eastby", "Fairholm", "Greystone", "Hollins", "Ivers", "Jessop", "Kettering", "Larkspur", "Morrow", "Nettleford", "Oakridge", "Pennock", "Quarles", "Rushby", "Stanwick", "Thornbury", "Underhill", "Varley", "Whitlow", "Yardley"];
const CLUBS = ["Riders Club", "Golf Club", "Guitar Works", "Hot Rod Garage", "Motor Works", "Kart Club", "Fleet Services"];

type Kit = { title: string; items: { name: string; substrate: Substrate; area: number; unit: "m2" | "ft2" }[] };
const KITS: Kit[] = [
  { title: "Tank and fenders", items: [{ name: "Fuel tank", substrate: "steel", area: 0.6, unit: "m2" }, { name: "Front fender", substrate: "steel", area: 0.25, unit: "m2" }, { name: "Rear fender", substrate: "steel", area: 0.4, unit: "m2" }] },
  { title: "Helmet", items: [{ name: "Helmet shell", substrate: "fiberglass", area: 0.3, unit: "m2" }] },
  { title: "Guitar body", items: [{ name: "Body", substrate: "wood", area: 0.28, unit: "m2" }] },
  { title: "Truck hood", items: [{ name: "Hood", substrate: "steel", area: 30, unit: "ft2" }] },
  { title: "Golf-cart body", items: [{ name: "Front cowl", substrate: "plastic", area: 9, unit: "ft2" }, { name: "Rear body", substrate: "plastic", area: 16, unit: "ft2" }] },
  { title: "Bicycle frame", items: [{ name: "Frame", substrate: "aluminum", area: 0.45, unit: "m2" }, { name: "Fork", substrate: "aluminum", area: 0.1, unit: "m2" }] },
  { title: "Side covers", items: [{ name: "Left cover", substrate: "plastic", area: 0.08, unit: "m2" }, { name: "Right cover", substrate: "plastic", area: 0.08, unit: "m2" }] },
  { title: "Hood scoop", items: [{ name: "Scoop", substrate: "fiberglass", area: 4, unit: "ft2" }] },
];
const FINISHES = ["candy red over silver", "candy blue over silver", "candy orange over gold", "pearl white", "candy green over black", "gloss black", "candy purple over silver flake", "satin grey", "candy brown over gold flake", "cream and teal"];

/** Stages of recent jobs (the open pipeline plus some just finished); older jobs are delivered or cancelled. */
const RECENT: Record<Stage, number> = { inquiry: 10, quoted: 14, booked: 10, in_prep: 12, in_booth: 7, curing: 5, finishing: 7, ready: 7, delivered: 22, cancelled: 6 };
const RECENT_JOBS = 900;
export const SPRAYED: readonly Stage[] = ["in_booth", "curing", "finishing", "ready", "delivered"];

export type SeedJob = { id: number; stage: Stage; createdAt: number; painterId: string; itemIds: number[]; substrates: Substrate[]; boothAt: number | null; plan: SeedPlan | null };

export type People = { owner: string; estimator: string; painters: { id: string; share: number }[] };

/** Extra invented customers, with a few clubs and fleets that come back often. */
export function insertCustomers(sqlite: Database.Database, rand: Rand, n: number, now: number): number[] {
  const insert = sqlite.prepare("insert into customers (name, email, phone, address, notes, created_at, updated_at) values (?, ?, ?, ?, ?, ?, ?)");
  const ids: number[] = [];
  for (let i = 0; i < n; i++) {
    const club = i % 40 === 0;
    const name = club ? `${rand.pick(LAST)} ${rand.pick(CLUBS)}` : `${rand.pick(FIRST)} ${rand.pick(LAST)}`;
    const at = now - rand.int(30, 2300) * DAY;
    const email = `${name.toLowerCase().replace(/[^a-z]+/g, ".")}.${i}@example.test`;
    ids.push(Number(insert.run(name, email, `555-${String(1000 + (i % 9000)).padStart(4, "0")}`, `${rand.int(1, 200)} ${rand.pick(LAST)} Road`, i % 7 === 0 ? "Prefers e-mail." : null, at, at).lastInsertRowid));
  }
  return ids;
}

/** `n` jobs over about six years, oldest first, with items, stage history and (from quoted on) a finish plan. */
export function insertJobs(sqlite: Database.Database, rand: Rand, people: People, customerIds: number[], n: number, now: number): SeedJob[] {
  const insertJob = sqlite.prepare(
    "insert into jobs (customer_id, title, stage, due_date, assigned_painter_id, notes, stage_changed_at, created_at, updated_at) values (?, ?, ?, ?, ?, ?, ?, ?, ?)",
  );
  const insertItem = sqlite.prepare("insert into job_items (job_id, name, substrate, surface_area, area_unit, notes, created_at, updated_at) values (?, ?, ?, ?, ?, null, ?, ?)");
  const insertEvent = sqlite.prepare("insert into job_stage_events (job_id, from_stage, to_stage, note, user_id, at) values (?, ?, ?, ?, ?, ?)");
  const copyPlan = planCopier(sqlite, rand, people.estimator);
  const templates = loadTemplates(sqlite);
  const templateWeights = { 0: 45, 1: 20, 2: 30, 3: 5 } as Record<string, number>;
  const painterShares = Object.fromEntries(people.painters.map((p) => [p.id, p.share]));

  // Creation times, oldest first: the shop got busier over the years.
  const created = Array.from({ length: n }, () => now - Math.round(2190 * DAY * rand.next() ** 1.4) - HOUR).sort((a, b) => a - b);
  const out: SeedJob[] = [];
  created.forEach((createdAt, index) => {
    const recent = index >= n - RECENT_JOBS;
    const stage: Stage = recent ? rand.weighted(RECENT) : rand.chance(0.95) ? "delivered" : "cancelled";
    const stageIndex = STAGES.indexOf(stage);
    const open = stage !== "delivered" && stage !== "cancelled";
    // Open work moved recently; finished work a few weeks after it came in.
    const changedAt = open ? now - rand.int(1, 72) * HOUR : Math.min(now - DAY, createdAt + rand.int(18, 50) * DAY);
    const startAt = Math.min(createdAt, changedAt - HOUR);
    const due = rand.chance(0.05) ? null : open ? dateOnly(now + rand.int(-10, 40) * DAY) : dateOnly(startAt + rand.int(14, 45) * DAY);
    const inProduction = stageIndex >= STAGES.indexOf("booked") && stage !== "cancelled";
    const painterId = rand.weighted(painterShares);
    const kit = rand.pick(KITS);
    const customerId = customerIds[Math.floor(customerIds.length * rand.next() ** 2)]!;
    const id = Number(
      insertJob.run(customerId, `${kit.title}, ${rand.pick(FINISHES)}`, stage, due, inProduction || rand.chance(0.3) ? painterId : null, rand.chance(0.2) ? "Customer brings the parts in on a Monday." : null, changedAt, startAt, changedAt)
        .lastInsertRowid,
    );
    const itemIds = kit.items.map((it) => Number(insertItem.run(id, it.name, it.substrate, it.area, it.unit, startAt, startAt).lastInsertRowid));

    const path: Stage[] = stage === "cancelled" ? ["inquiry", "quoted", "cancelled"] : STAGES.slice(0, stageIndex + 1);
    let boothAt: number | null = null;
    path.forEach((to, k) => {
      const at = k === path.length - 1 ? changedAt : startAt + Math.round(((changedAt - startAt) * k) / path.length);
      if (to === "in_booth") boothAt = at;
      const by = ["in_prep", "in_booth", "curing", "finishing"].includes(to) ? painterId : k % 2 ? people.estimator : people.owner;
      insertEvent.run(id, k === 0 ? null : path[k - 1]!, to, k === 0 ? "Job created" : null, by, at);
    });
    const plan = stage === "inquiry" || (stage === "cancelled" && rand.chance(0.5)) ? null : copyPlan(templates[Number(rand.weighted(templateWeights))]!, id, startAt + DAY);
    out.push({ id, stage, createdAt: startAt, painterId, itemIds, substrates: kit.items.map((i) => i.substrate), boothAt, plan });
  });
  return out;
}
