import { updateAtVersion } from "../../db/edit-version";
import { and, asc, eq, sql } from "drizzle-orm";
import { preparedQuery } from "../../db/prepared";
import type { z } from "zod";
import type { AppDeps } from "../../deps";
import type { Actor } from "../../auth/session";
import { jobItems, jobs } from "../../db/schema";
import { notFound } from "../../http/http-error";
import { iso } from "../../http/dates";
import type { JobItemDto } from "../../../shared/schemas/job.schema";
import type { createJobItemInputSchema, updateJobItemInputSchema } from "../../../shared/schemas/job-item.schema";
import { findJobFor } from "./jobs.access";

function toDto(row: typeof jobItems.$inferSelect, actor: Actor): JobItemDto {
  const { updatedBy: _updatedBy, ...fields } = row;
  return {
    ...fields,
    notes: actor.role === "customer" ? null : row.notes,
    createdAt: iso(row.createdAt),
    updatedAt: iso(row.updatedAt),
  };
}

const itemsQuery = preparedQuery((db) => db.select().from(jobItems).where(eq(jobItems.jobId, sql.placeholder("jobId"))).orderBy(asc(jobItems.id)).prepare());

/** A job's items, for a caller that has already checked the actor may see the job. */
export function itemsOfJob(deps: AppDeps, actor: Actor, jobId: number): JobItemDto[] {
  return itemsQuery(deps.db).all({ jobId }).map((r) => toDto(r, actor));
}

export function listItems(deps: AppDeps, actor: Actor, jobId: number): JobItemDto[] {
  findJobFor(deps, actor, jobId);
  return itemsOfJob(deps, actor, jobId);
}

function findItem(deps: AppDeps, actor: Actor, jobId: number, itemId: number) {
  findJobFor(deps, actor, jobId);
  const item = deps.db
    .select()
    .from(jobItems)
    .where(and(eq(jobItems.id, itemId), eq(jobItems.jobId, jobId)))
    .get();
  if (!item) throw notFound("Item");
  return item;
}

export function getItem(deps: AppDeps, actor: Actor, jobId: number, itemId: number) {
  return toDto(findItem(deps, actor, jobId, itemId), actor);
}

const touchJob = (deps: AppDeps, jobId: number) => deps.db.update(jobs).set({ updatedAt: deps.now() }).where(eq(jobs.id, jobId)).run();

export function createItem(deps: AppDeps, actor: Actor, jobId: number, input: z.output<typeof createJobItemInputSchema>) {
  findJobFor(deps, actor, jobId);
  const row = deps.db
    .insert(jobItems)
    .values({ jobId, ...input, notes: input.notes ?? null })
    .returning()
    .get();
  touchJob(deps, jobId);
  return toDto(row, actor);
}

export function updateItem(deps: AppDeps, actor: Actor, jobId: number, itemId: number, input: z.output<typeof updateJobItemInputSchema>) {
  const before = findItem(deps, actor, jobId, itemId);
  const { version, ...fields } = input;
  updateAtVersion(deps.db, jobItems, { id: itemId, version, actorId: actor.id, what: "item" }, { ...fields, updatedAt: deps.now() }, () =>
    toDto(deps.db.select().from(jobItems).where(eq(jobItems.id, itemId)).get() ?? before, actor),
  );
  touchJob(deps, jobId);
  return toDto(deps.db.select().from(jobItems).where(eq(jobItems.id, itemId)).get()!, actor);
}

export function deleteItem(deps: AppDeps, actor: Actor, jobId: number, itemId: number) {
  findItem(deps, actor, jobId, itemId);
  deps.db.delete(jobItems).where(eq(jobItems.id, itemId)).run();
  touchJob(deps, jobId);
}
