import type { Db } from "../client";
import { seedCore, type SeedContext } from "./core";
import { seedSettings } from "./settings";

export { isEmpty, DEMO_PASSWORD, DEMO_USERS, DEMO_SHOP } from "./core";
export type { SeedContext } from "./core";

/** Later areas add a step here; each gets the ids made before it. Steps run in this order. */
const STEPS: ((ctx: SeedContext) => void | Promise<void>)[] = [seedSettings];

/** Fills an empty database with the invented demo shop. */
export async function seedDemo(db: Db, now = Date.now()) {
  const ctx = await seedCore(db, now);
  for (const step of STEPS) await step(ctx);
  return ctx;
}
