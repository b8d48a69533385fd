import { count } from "drizzle-orm";
import { randomUUID } from "node:crypto";
import type { Db } from "../client";
import { customers, jobItems, jobStageEvents, jobs, users } from "../schema";
import { hashPassword } from "../../auth/password";
import { STAGES, type Stage } from "../../../shared/domain/stages";
import type { Substrate } from "../../../shared/domain/substrates";

/**
 * The demo shop: Harrow Creek Custom Finishes, an invented shop in an invented town.
 * Every person, customer and job here is made up.
 */
export const DEMO_PASSWORD = "paintshop-demo";
export const DEMO_SHOP = { name: "Harrow Creek Custom Finishes", town: "Harrow Creek" };

export const DEMO_USERS = [
  { key: "owner", email: "owner@demo.coatwright.test", name: "Dana Whitfield", role: "owner" },
  { key: "estimator", email: "estimator@demo.coatwright.test", name: "Rosa Penhallow", role: "estimator" },
  { key: "painter", email: "painter@demo.coatwright.test", name: "Marco Vell", role: "painter" },
  { key: "painter2", email: "painter2@demo.coatwright.test", name: "Jules Ambrose", role: "painter" },
  { key: "customer", email: "customer@demo.coatwright.test", name: "Tobias Wren", role: "customer" },
] as const;

const CUSTOMERS = [
  { name: "Tobias Wren", email: "customer@demo.coatwright.test", phone: "555-0142", address: "14 Millrace Road, Harrow Creek" },
  { name: "Imogen Castellan", email: "imogen.castellan@example.test", phone: "555-0178", address: "3 Quarry Lane, Harrow Creek" },
  { name: "Brindle Valley Golf Club", email: "grounds@brindlevalley.example.test", phone: "555-0110", address: "1 Fairway Drive, Brindle Valley" },
  { name: "Otis Farrow", email: "otis.farrow@example.test", phone: "555-0199", address: "88 Kiln Street, Harrow Creek" },
  { name: "Nadia Sorensen", email: "nadia.s@example.test", phone: "555-0123", address: "22 Orchard Row, Pell Junction" },
  { name: "Redwater Guitar Works", email: "bench@redwater.example.test", phone: "555-0155", address: "5 Foundry Yard, Harrow Creek" },
  { name: "Augustin Brell", email: "a.brell@example.test", phone: "555-0137", address: "61 Ferry Road, Pell Junction" },
  { name: "Hollis Quarry Haulage", email: "fleet@hollisquarry.example.test", phone: "555-0160", address: "Quarry Gate, Route 9" },
  { name: "Petra Lindqvist-Moore", email: "petra.lm@example.test", phone: "555-0184", address: "9 Saddler Close, Harrow Creek" },
  { name: "Cyrus Okafor", email: "cyrus.okafor@example.test", phone: "555-0171", address: "40 Beacon Hill, Pell Junction" },
  { name: "Wendeline Marsh", email: "w.marsh@example.test", phone: "555-0108", address: "2 Lock Cottages, Harrow Creek" },
  { name: "Ember Street Riders Club", email: "club@emberstreet.example.test", phone: "555-0190", address: "17 Ember Street, Harrow Creek" },
];

type ItemSeed = { name: string; substrate: Substrate; area: number; unit: "m2" | "ft2"; notes?: string };

const KITS: { title: string; items: ItemSeed[] }[] = [
  {
    title: "Motorcycle tank and fenders",
    items: [
      { name: "Fuel tank", substrate: "steel", area: 0.6, unit: "m2" },
      { name: "Front fender", substrate: "steel", area: 0.25, unit: "m2" },
      { name: "Rear fender", substrate: "steel", area: 0.4, unit: "m2" },
    ],
  },
  { title: "Open-face helmet", items: [{ name: "Helmet shell", substrate: "fiberglass", area: 0.3, unit: "m2", notes: "Remove visor snaps first" }] },
  { title: "Full-face helmet", items: [{ name: "Helmet shell", substrate: "plastic", area: 0.35, unit: "m2" }] },
  { title: "Guitar body", items: [{ name: "Solid body", substrate: "wood", area: 0.28, unit: "m2", notes: "Grain filled and sealed by the customer's luthier" }] },
  { title: "Truck hood", items: [{ name: "Hood", substrate: "steel", area: 30, unit: "ft2" }] },
  {
    title: "Golf-cart body",
    items: [
      { name: "Front cowl", substrate: "plastic", area: 9, unit: "ft2" },
      { name: "Rear body", substrate: "plastic", area: 16, unit: "ft2" },
      { name: "Roof", substrate: "plastic", area: 14, unit: "ft2" },
    ],
  },
  {
    title: "Bicycle frame and fork",
    items: [
      { name: "Frame", substrate: "aluminum", area: 0.45, unit: "m2" },
      { name: "Fork", substrate: "aluminum", area: 0.1, unit: "m2" },
    ],
  },
  {
    title: "Side covers and headlight bucket",
    items: [
      { name: "Left side cover", substrate: "plastic", area: 0.08, unit: "m2" },
      { name: "Right side cover", substrate: "plastic", area: 0.08, unit: "m2" },
      { name: "Headlight bucket", substrate: "steel", area: 0.07, unit: "m2" },
    ],
  },
  { title: "Hot-rod hood scoop", items: [{ name: "Hood scoop", substrate: "fiberglass", area: 4, unit: "ft2" }] },
  { title: "Carbon mirror caps", items: [{ name: "Mirror caps (pair)", substrate: "carbon_fiber", area: 0.12, unit: "m2" }] },
];

const FINISHES = [
  "candy apple red over silver",
  "candy cobalt over fine silver",
  "candy tangerine over gold",
  "pearl white with ghost flames",
  "candy emerald over black base",
  "gloss black with gold pinstripe",
  "candy violet over silver flake",
  "satin gunmetal",
  "candy root beer over gold flake",
  "two-tone cream and teal",
];

/** Stage of each demo job, in order: enough in every stage to fill the board. */
const STAGE_PLAN: Stage[] = [
  ...Array<Stage>(5).fill("inquiry"),
  ...Array<Stage>(6).fill("quoted"),
  ...Array<Stage>(5).fill("booked"),
  ...Array<Stage>(5).fill("in_prep"),
  ...Array<Stage>(4).fill("in_booth"),
  ...Array<Stage>(4).fill("curing"),
  ...Array<Stage>(4).fill("finishing"),
  ...Array<Stage>(4).fill("ready"),
  ...Array<Stage>(6).fill("delivered"),
  ...Array<Stage>(3).fill("cancelled"),
];

/** Small deterministic generator so the demo looks the same on every machine. */
function prng(seed: number) {
  let s = seed >>> 0;
  return () => {
    s = (s * 1664525 + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
}

const DAY = 86_400_000;
const dateOnly = (ms: number) => new Date(ms).toISOString().slice(0, 10);

export function isEmpty(db: Db): boolean {
  return (db.select({ n: count() }).from(users).get()?.n ?? 0) === 0;
}

/** What later seed steps build on: the ids of the demo people, customers and jobs. */
export type SeedContext = {
  db: Db;
  now: number;
  rand: () => number;
  userIds: Record<(typeof DEMO_USERS)[number]["key"], string>;
  customerIds: number[];
  jobs: { id: number; stage: Stage; customerId: number; painterId: string | null; title: string; createdAt: number }[];
  /** Where demo photos are written (DATA_DIR/uploads); steps skip files when it is not given. */
  uploadsDir?: string;
};

export async function seedCore(db: Db, now = Date.now()): Promise<SeedContext> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const rand = prng(20261202);
  const pick = <T>(xs: readonly T[]) => xs[Math.floor(rand() * xs.length)]!;

  const seededJobs: SeedContext["jobs"] = [];
  const ctx = db.transaction((tx) => {
    const customerIds = CUSTOMERS.map(
      (c, i) =>
        tx
          .insert(customers)
          .values({ ...c, notes: i % 3 === 0 ? "Prefers a text message over a call." : null, createdAt: now - (200 - i * 9) * DAY, updatedAt: now - (200 - i * 9) * DAY })
          .returning({ id: customers.id })
          .get().id,
    );
    const userIds: Record<string, string> = {};
    for (const u of DEMO_USERS) {
      const id = randomUUID();
      userIds[u.key] = id;
      tx.insert(users)
        .values({ id, email: u.email, name: u.name, role: u.role, passwordHash, customerId: u.role === "customer" ? customerIds[0]! : null, createdAt: now - 300 * DAY, updatedAt: now - 300 * DAY })
        .run();
    }
    const painters = [userIds.painter!, userIds.painter2!];

    STAGE_PLAN.forEach((stage, i) => {
      const kit = KITS[i % KITS.length]!;
      const finish = FINISHES[(i * 3) % FINISHES.length]!;
      // The demo customer gets the first job of several stages, so the portal has something to show.
      const customerId = i % 9 === 0 ? customerIds[0]! : pick(customerIds.slice(1));
      const stageIndex = STAGES.indexOf(stage);
      const createdAt = now - Math.round((40 + rand() * 60 - stageIndex * 4) * DAY);
      const dueOffset = stage === "delivered" || stage === "cancelled" ? -Math.round(5 + rand() * 40) : Math.round(-4 + rand() * 40);
      const inProduction = stageIndex >= STAGES.indexOf("booked") && stage !== "cancelled";
      const painter = inProduction || rand() < 0.3 ? (i % 3 === 2 ? painters[1]! : painters[0]!) : null;
      const stageChangedAt = Math.min(now - DAY, createdAt + Math.round((stageIndex + 1) * 2.5 * DAY));
      const jobId = tx
        .insert(jobs)
        .values({
          customerId,
          title: `${kit.title}, ${finish}`,
          stage,
          dueDate: i % 11 === 4 ? null : dateOnly(now + dueOffset * DAY),
          assignedPainterId: painter,
          notes: i % 4 === 0 ? "Customer supplied reference photo; match the flake size." : null,
          stageChangedAt,
          createdAt,
          updatedAt: stageChangedAt,
        })
        .returning({ id: jobs.id })
        .get().id;
      seededJobs.push({ id: jobId, stage, customerId, painterId: painter, title: `${kit.title}, ${finish}`, createdAt });
      for (const item of kit.items) {
        tx.insert(jobItems)
          .values({ jobId, name: item.name, substrate: item.substrate, surfaceArea: item.area, areaUnit: item.unit, notes: item.notes ?? null, createdAt, updatedAt: createdAt })
          .run();
      }
      // Walk the job through the stages that led to where it is now.
      const path: Stage[] = stage === "cancelled" ? ["inquiry", "quoted", "cancelled"] : STAGES.slice(0, stageIndex + 1).filter((s) => s !== "cancelled");
      path.forEach((to, k) => {
        const at = k === path.length - 1 ? stageChangedAt : createdAt + Math.round(((stageChangedAt - createdAt) * k) / path.length);
        const by = ["in_prep", "in_booth", "curing", "finishing"].includes(to) && painter ? painter : k % 2 ? userIds.estimator! : userIds.owner!;
        tx.insert(jobStageEvents)
          .values({ jobId, fromStage: k === 0 ? null : path[k - 1]!, toStage: to, userId: by, at, note: k === 0 ? "Job created" : null })
          .run();
      });
    });
    return { customerIds, userIds: userIds as SeedContext["userIds"] };
  });
  return { db, now, rand, ...ctx, jobs: seededJobs };
}
