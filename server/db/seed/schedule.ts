import { booths, prepPlans, scheduleSessions } from "../schema";
import { jobFacts, schedulableJobIds } from "../../modules/schedule/schedule-facts";
import { boothRules } from "../../modules/schedule/booths.service";
import { suggestSchedule } from "../../../shared/schedule";
import type { SeedContext } from "./core";

const HOUR = 3_600_000;

/**
 * Two booths (one where parts cure inside, one next to a drying room) and the coming two weeks booked: jobs whose
 * prep is not signed off get a planned prep date, then the scheduling rules place every layer still to spray.
 */
export function seedSchedule(ctx: SeedContext) {
  const { db, now } = ctx;
  const timeZone = Intl.DateTimeFormat().resolvedOptions().timeZone;
  const rows = db
    .insert(booths)
    .values([
      { name: "North booth", setupMinutes: 25, canCureOutside: false, opensAtMinute: 7 * 60, closesAtMinute: 17 * 60, workDays: [1, 2, 3, 4, 5], timeZone },
      { name: "Side booth", setupMinutes: 15, canCureOutside: true, opensAtMinute: 7 * 60, closesAtMinute: 16 * 60, workDays: [1, 2, 3, 4, 5, 6], timeZone },
    ])
    .returning()
    .all();

  const ids = schedulableJobIds({ db });
  const facts = jobFacts({ db }, ids);
  let day = 1;
  for (const job of facts.values()) {
    if (job.prepSignedOff || job.layers.length === 0) continue;
    const readyAt = now + (day++ % 6) * 24 * HOUR;
    db.insert(prepPlans).values({ jobId: job.id, readyAt, updatedBy: ctx.userIds.owner, updatedAt: now }).run();
    job.prepReadyAt = readyAt;
  }
  const { sessions } = suggestSchedule({ booths: rows.map(boothRules), jobs: [...facts.values()], from: now, horizonDays: 14 });
  if (sessions.length) db.insert(scheduleSessions).values(sessions.map((s) => ({ ...s, createdBy: ctx.userIds.owner, createdAt: now, updatedAt: now }))).run();
}
