import { asc, desc, eq, inArray } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import { coatLogs, jobItems, jobs, planLayers, planVersions, plans, prepPlans, prepRecords, scheduleSessions } from "../../db/schema";
import { coatCount, effectiveCoats } from "../../../shared/domain/booth";
import type { Stage } from "../../../shared/domain/stages";
import type { ScheduleJob, ScheduleLayer } from "../../../shared/schedule";

/** Stages whose jobs may still need booth time. */
export const SCHEDULABLE_STAGES: readonly Stage[] = ["booked", "in_prep", "in_booth", "curing"];

export type JobFacts = ScheduleJob & {
  stage: Stage;
  painterId: string | null;
  prepSignedOff: boolean;
  /** Every sprayed layer of the version the booth uses, including those already done (for names and order). */
  allLayers: ScheduleLayer[];
};

/** The plan version the booth card sprays for a job: the one it started with, else its plan's latest. */
function boothVersionId(db: AppDeps["db"], job: { id: number; sprayedPlanVersionId: number | null }): number | null {
  if (job.sprayedPlanVersionId != null) return job.sprayedPlanVersionId;
  const plan = db.select({ id: plans.id }).from(plans).where(eq(plans.jobId, job.id)).orderBy(desc(plans.id)).limit(1).get();
  if (!plan) return null;
  return db.select({ id: planVersions.id }).from(planVersions).where(eq(planVersions.planId, plan.id)).orderBy(desc(planVersions.version)).limit(1).get()?.id ?? null;
}

/**
 * What the schedule needs to know about jobs: their sprayed layers in plan order (prep is done through the prep
 * records, not in the booth), which are still to spray, and when prep is or will be signed off.
 */
export function jobFacts(deps: Pick<AppDeps, "db">, jobIds: readonly number[]): Map<number, JobFacts> {
  const db = deps.db;
  const out = new Map<number, JobFacts>();
  if (jobIds.length === 0) return out;
  const rows = db.select({ id: jobs.id, title: jobs.title, stage: jobs.stage, dueDate: jobs.dueDate, painterId: jobs.assignedPainterId, sprayedPlanVersionId: jobs.sprayedPlanVersionId }).from(jobs).where(inArray(jobs.id, [...jobIds])).all();
  const planned = new Map(db.select().from(prepPlans).where(inArray(prepPlans.jobId, [...jobIds])).all().map((p) => [p.jobId, p.readyAt]));
  for (const job of rows) {
    const versionId = boothVersionId(db, job);
    const layers: ScheduleLayer[] = versionId == null ? [] : db
          .select()
          .from(planLayers)
          .where(eq(planLayers.versionId, versionId))
          .orderBy(asc(planLayers.position))
          .all()
          .filter((l) => l.kind !== "prep")
          .map((l) => ({
            id: l.id,
            jobId: job.id,
            position: l.position,
            name: l.name,
            coats: l.coats,
            minutesPerCoat: l.minutesPerCoat,
            flashMinutes: l.flashMinutes,
            dryMinutes: l.dryMinutes,
            recoatMinMinutes: null,
            recoatMaxMinutes: null,
          }));
    const coats = effectiveCoats(db.select({ id: coatLogs.id, layerId: coatLogs.layerId, coatNumber: coatLogs.coatNumber, at: coatLogs.at, correctsId: coatLogs.correctsId, voids: coatLogs.voids }).from(coatLogs).where(eq(coatLogs.jobId, job.id)).all());
    const done = (l: ScheduleLayer) => coats.filter((c) => c.layerId === l.id).length >= coatCount(l.coats);
    const items = db.select({ id: jobItems.id, signedOffAt: prepRecords.signedOffAt }).from(jobItems).leftJoin(prepRecords, eq(prepRecords.itemId, jobItems.id)).where(eq(jobItems.jobId, job.id)).all();
    const signedOff = items.length > 0 && items.every((i) => i.signedOffAt != null);
    out.set(job.id, {
      id: job.id,
      title: job.title,
      stage: job.stage,
      dueDate: job.dueDate,
      painterId: job.painterId,
      prepSignedOff: signedOff,
      prepReadyAt: signedOff ? Math.max(...items.map((i) => i.signedOffAt!)) : (planned.get(job.id) ?? null),
      allLayers: layers,
      layers: layers.filter((l) => !done(l)),
    });
  }
  return out;
}

/** Jobs that may need booth time: in a schedulable stage, or with a session on the schedule. */
export function schedulableJobIds(deps: Pick<AppDeps, "db">): number[] {
  const staged = deps.db.select({ id: jobs.id }).from(jobs).where(inArray(jobs.stage, [...SCHEDULABLE_STAGES])).all().map((j) => j.id);
  const booked = deps.db.selectDistinct({ id: scheduleSessions.jobId }).from(scheduleSessions).all().map((j) => j.id);
  return [...new Set([...staged, ...booked])].sort((a, b) => a - b);
}
