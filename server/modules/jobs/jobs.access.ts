import { and, eq, sql, type SQL } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import type { Actor } from "../../auth/session";
import { jobs } from "../../db/schema";
import { preparedQuery } from "../../db/prepared";
import { notFound } from "../../http/http-error";

/**
 * Object-level access to jobs: painters reach the jobs assigned to them, customers their own jobs,
 * the office every job. Anything outside reads as "not found", so ids reveal nothing.
 * The rule is written once here, as a kind (which column limits the actor) and a value (what it must equal); the
 * two forms below are made from it: `jobScope` for a query built per request, `preparedJobScope` + `scopeValues`
 * for a query prepared once per kind.
 */
export type ScopeKind = "office" | "painter" | "customer";
export const scopeKind = (actor: Actor): ScopeKind => (actor.role === "painter" || actor.role === "customer" ? actor.role : "office");
export const scopeValues = (actor: Actor) => ({ scope: actor.role === "painter" ? actor.id : (actor.customerId ?? -1) });

function scopeOn(kind: ScopeKind, value: string | number | ReturnType<typeof sql.placeholder>): SQL | undefined {
  if (kind === "painter") return eq(jobs.assignedPainterId, value as string);
  if (kind === "customer") return eq(jobs.customerId, value as number);
  return undefined;
}

export const jobScope = (actor: Actor): SQL | undefined => scopeOn(scopeKind(actor), scopeValues(actor).scope);
export const preparedJobScope = (kind: ScopeKind): SQL | undefined => scopeOn(kind, sql.placeholder("scope"));

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
