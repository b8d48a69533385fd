import { and, eq, type SQL } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import type { Actor } from "../../auth/session";
import { jobs } from "../../db/schema";
import { notFound } from "../../http/http-error";

/**
 * Object-level access to jobs: painters reach the jobs assigned to them, customers their own jobs,
 * the office every job. Anything outside reads as "not found", so ids reveal nothing.
 */
export function jobScope(actor: Actor): SQL | undefined {
  if (actor.role === "painter") return eq(jobs.assignedPainterId, actor.id);
  if (actor.role === "customer") return eq(jobs.customerId, actor.customerId ?? -1);
  return undefined;
}

export function findJobFor(deps: AppDeps, actor: Actor, id: number) {
  const job = deps.db
    .select()
    .from(jobs)
    .where(and(eq(jobs.id, id), jobScope(actor)))
    .get();
  if (!job) throw notFound("Job");
  return job;
}
