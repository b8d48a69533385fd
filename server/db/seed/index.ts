import type { Db } from "../client";
import { seedCore, type SeedContext } from "./core";
import { seedSettings } from "./settings";
import { seedMaterials } from "./materials";
import { seedBooth } from "./booth";
import { seedQuotes } from "./quotes";
import { seedSchedule } from "./schedule";
import { seedIntake } from "./intake";
import { seedChangeOrders } from "./change-orders";

export { isEmpty, DEMO_PASSWORD, DEMO_USERS, DEMO_SHOP } from "./core";
export type { SeedContext } from "./core";

/** Later areas add a step here; each gets the ids made before it. Steps run in this order. */
const STEPS: ((ctx: SeedContext) => void | Promise<void>)[] = [seedSettings, seedMaterials, seedBooth, seedIntake, seedQuotes, seedChangeOrders, seedSchedule];

/** Fills an empty database with the invented demo shop. With `uploadsDir`, demo photos are written there too. */
export async function seedDemo(db: Db, now = Date.now(), options: { uploadsDir?: string } = {}) {
  const ctx: SeedContext = { ...(await seedCore(db, now)), uploadsDir: options.uploadsDir };
  for (const step of STEPS) await step(ctx);
  return ctx;
}
