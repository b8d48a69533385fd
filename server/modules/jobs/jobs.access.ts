import { and, eq, sql, type SQL } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import type { Actor } from "../../auth/session";
import { jobs } from "../../db/schema";
import { preparedQuery } from "../../db/prepared";
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

/** The same scope for prepared queries: its form by role, its value as the placeholder "scope" (see scopeValues). */
export type ScopeKind = "office" | "painter" | "customer";
export const scopeKind = (actor: Actor): ScopeKind => (actor.role === "painter" || actor.role === "customer" ? actor.role : "office");
export function preparedJobScope(kind: ScopeKind): SQL | undefined {
  if (kind === "painter") return eq(jobs.assignedPainterId, sql.placeholder("scope"));
  if (kind === "customer") return eq(jobs.customerId, sql.placeholder("scope"));
  return undefined;
}
export const scopeValues = (actor: Actor) => ({ scope: actor.role === "painter" ? actor.id : (actor.customerId ?? -1) });

const jobFor = preparedQuery((db, kind: ScopeKind) =>
  db
    .select()
    .from(jobs)
    .where(and(eq(jobs.id, sql.placeholder("id")), preparedJobScope(kind)))
    .prepare(),
);

export function findJobFor(deps: AppDeps, actor: Actor, id: number) {
  const job = jobFor(deps.db, scopeKind(actor)).get({ id, ...scopeValues(actor) });
  if (!job) throw notFound("Job");
  return job;
}
