import { booths, scheduleSessions } from "../../server/db/schema";
import { addBoothPlan } from "./booth-fixtures";
import type { Shop } from "./test-app";

/** Monday 7 December 2026, 08:00 UTC: a working morning in the booths below. */
export const MONDAY_8 = Date.UTC(2026, 11, 7, 8, 0);
export const HOUR = 3_600_000;

/** Two booths on UTC, 07:00–17:00 Monday to Friday; the second lets parts cure outside. */
export function addBooths(s: Shop) {
  const [one, two] = s.db
    .insert(booths)
    .values([
      { name: "Booth 1", setupMinutes: 20, canCureOutside: false, workDays: [1, 2, 3, 4, 5], timeZone: "UTC" },
      { name: "Booth 2", setupMinutes: 15, canCureOutside: true, workDays: [1, 2, 3, 4, 5], timeZone: "UTC" },
    ])
    .returning()
    .all();
  return { one: one!, two: two! };
}

/** Job A's plan (sealer, candy, clear) booked with its sealer in booth 1 on Monday at 08:00. */
export function bookedShop(s: Shop) {
  const b = addBooths(s);
  const plan = addBoothPlan(s, s.jobA.id);
  const session = s.db
    .insert(scheduleSessions)
    .values({ boothId: b.one.id, jobId: s.jobA.id, layerId: plan.layers[0]!.id, startsAt: MONDAY_8, endsAt: MONDAY_8 + 2 * HOUR })
    .returning()
    .all()[0]!;
  return { ...b, plan, session };
}
