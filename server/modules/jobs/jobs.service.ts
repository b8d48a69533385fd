import { updateAtVersion } from "../../db/edit-version";
import { aliasedTable, and, asc, count, desc, eq, gte, inArray, like, lt, lte, or, sql, type SQL, placeholder } from "drizzle-orm";
import type { z } from "zod";
import type { AppDeps } from "../../deps";
import { nextSlots } from "../schedule/schedule.service";
import type { Actor } from "../../auth/session";
import { customers, jobStageEvents, jobs, users } from "../../db/schema";
import { badRequest, conflict, notFound } from "../../http/http-error";
import { preparedQuery } from "../../db/prepared";
import type { Db } from "../../db/client";
import { iso } from "../../http/dates";
import { parseSort, type Page } from "../../../shared/api/pagination";
import { DUE_STAGES, isClosedStage, nextStagesFor, OPEN_STAGES, STAGES, type Stage, STAGE_LABELS } from "../../../shared/domain/stages";
import { recordStageMove } from "./stage-move";
import type {
  BoardDto,
  JobDetailDto,
  JobDto,
  ListJobsQuery,
  changeStageInputSchema,
  createJobInputSchema,
  updateJobInputSchema,
} from "../../../shared/schemas/job.schema";
import { findJobFor, jobScope, preparedJobScope, scopeKind, scopeValues, type ScopeKind } from "./jobs.access";
import { itemsOfJob } from "./job-items.service";
import { checkCustomerMove } from "./job-customer";
import { afterStageChange } from "../messages/messages.service";

const painters = aliasedTable(users, "painter");
// Written out in full so the inner query can never bind "id" to the wrong table.
const itemCount = sql<number>`(select count(*) from "job_items" as ji where ji."job_id" = "jobs"."id")`.mapWith(Number);

const jobColumns = {
  id: jobs.id,
  version: jobs.version,
  title: jobs.title,
  stage: jobs.stage,
  dueDate: jobs.dueDate,
  customerId: jobs.customerId,
  customerName: customers.name,
  assignedPainterId: jobs.assignedPainterId,
  assignedPainterName: painters.name,
  notes: jobs.notes,
  itemCount,
  createdAt: jobs.createdAt,
  updatedAt: jobs.updatedAt,
  stageChangedAt: jobs.stageChangedAt,
};

type JobRow = {
  version: number;
  id: number;
  title: string;
  stage: Stage;
  dueDate: string | null;
  customerId: number;
  customerName: string;
  assignedPainterId: string | null;
  assignedPainterName: string | null;
  notes: string | null;
  itemCount: number;
  createdAt: number;
  updatedAt: number;
  stageChangedAt: number;
};

/** Customers never see the shop's internal notes. */
function toDto(row: JobRow, actor: Actor): JobDto {
  const dto: JobDto = {
    ...row,
    createdAt: iso(row.createdAt),
    updatedAt: iso(row.updatedAt),
    stageChangedAt: iso(row.stageChangedAt),
  };
  if (actor.role === "customer") delete dto.notes;
  return dto;
}

function selectJobs(db: Db) {
  return db
    .select(jobColumns)
    .from(jobs)
    .innerJoin(customers, eq(jobs.customerId, customers.id))
    .leftJoin(painters, eq(jobs.assignedPainterId, painters.id));
}

const SORT = {
  id: jobs.id,
  title: jobs.title,
  customer: customers.name,
  stage: sql`(case ${jobs.stage} ${sql.raw(STAGES.map((s, i) => `when '${s}' then ${i}`).join(" "))} end)`,
  dueDate: jobs.dueDate,
  updatedAt: jobs.updatedAt,
  createdAt: jobs.createdAt,
} as const;

/** Local calendar date as YYYY-MM-DD. */
function dateOnly(ms: number, addDays = 0) {
  const d = new Date(ms);
  d.setDate(d.getDate() + addDays);
  const pad = (n: number) => String(n).padStart(2, "0");
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
}

/** What a list request filters and sorts by: each combination is one prepared query; the values come per request. */
type ListShape = { scope: ScopeKind; stages: number; customer: boolean; painter: boolean; due?: "overdue" | "week"; text: boolean; number: boolean; sort: string };


function listFilters(s: ListShape): SQL | undefined {
  const filters: (SQL | undefined)[] = [preparedJobScope(s.scope)];
  if (s.stages) filters.push(inArray(jobs.stage, Array.from({ length: s.stages }, (_, i) => placeholder(`stage${i}`))));
  if (s.customer) filters.push(eq(jobs.customerId, placeholder("customerId")));
  if (s.painter) filters.push(eq(jobs.assignedPainterId, placeholder("painterId")));
  if (s.due) {
    filters.push(inArray(jobs.stage, [...DUE_STAGES]));
    filters.push(s.due === "overdue" ? lt(jobs.dueDate, placeholder("today")) : and(gte(jobs.dueDate, placeholder("today")), lte(jobs.dueDate, placeholder("weekEnd"))));
  }
  if (s.text) filters.push(or(like(jobs.title, placeholder("text")), like(customers.name, placeholder("text")), s.number ? eq(jobs.id, placeholder("number")) : undefined));
  return and(...filters);
}

/**
 * One page of the list. The page's ids are picked first from the jobs index alone, then only those rows are joined
 * and counted: joining every matching job before sorting cost several times more on a large shop.
 */
const listPage = preparedQuery((db, s: ListShape) => {
  const { field, desc: isDesc } = parseSort(s.sort);
  const col = SORT[field as keyof typeof SORT] ?? jobs.dueDate;
  // Jobs with no due date sort last either way.
  const order = [...(field === "dueDate" ? [sql`${jobs.dueDate} is null`] : []), isDesc ? desc(col) : asc(col), desc(jobs.id)];
  const ids = db.select({ id: jobs.id }).from(jobs);
  const page = (s.text || field === "customer" ? ids.innerJoin(customers, eq(jobs.customerId, customers.id)) : ids)
    .where(listFilters(s))
    .orderBy(...order)
    .limit(placeholder("limit"))
    .offset(placeholder("offset"))
    .as("page");
  return db
    .select(jobColumns)
    .from(page)
    .innerJoin(jobs, eq(jobs.id, page.id))
    .innerJoin(customers, eq(jobs.customerId, customers.id))
    .leftJoin(painters, eq(jobs.assignedPainterId, painters.id))
    .orderBy(...order)
    .prepare();
}, JSON.stringify);

/** The customers join is only needed to search by customer name. */
const listTotal = preparedQuery((db, s: ListShape) => {
  const from = db.select({ n: count() }).from(jobs);
  return (s.text ? from.innerJoin(customers, eq(jobs.customerId, customers.id)) : from).where(listFilters(s)).prepare();
}, JSON.stringify);

export function listJobs(deps: AppDeps, actor: Actor, q: ListJobsQuery): Page<JobDto> {
  const number = q.q && /^#?\d+$/.test(q.q) ? Number(q.q.replace("#", "")) : undefined;
  const shape: ListShape = {
    scope: scopeKind(actor),
    stages: q.stage?.length ?? 0,
    customer: Boolean(q.customerId),
    painter: Boolean(q.painterId),
    due: q.due,
    text: Boolean(q.q),
    number: number !== undefined,
    sort: q.sort,
  };
  const values = {
    ...scopeValues(actor),
    ...Object.fromEntries((q.stage ?? []).map((stage, i) => [`stage${i}`, stage])),
    customerId: q.customerId,
    painterId: q.painterId,
    today: dateOnly(deps.now()),
    weekEnd: dateOnly(deps.now(), 7),
    text: `%${q.q}%`,
    number,
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  };
  const rows = listPage(deps.db, shape).all(values) as JobRow[];
  const total = listTotal(deps.db, shape).get(values)?.n ?? 0;
  return { items: rows.map((r) => toDto(r, actor)), total, page: q.page, pageSize: q.pageSize };
}

export const BOARD_CARDS_PER_STAGE = 40;

/** Every stage with its count and its most urgent jobs (soonest due first). */
export function jobBoard(deps: AppDeps, actor: Actor): BoardDto {
  const scope = jobScope(actor);
  const counts = new Map(
    deps.db
      .select({ stage: jobs.stage, n: count() })
      .from(jobs)
      .where(scope)
      .groupBy(jobs.stage)
      .all()
      .map((r) => [r.stage, r.n]),
  );
  const columns = STAGES.map((stage) => {
    const recentFirst = isClosedStage(stage);
    const rows = selectJobs(deps.db)
      .where(and(eq(jobs.stage, stage), scope))
      .orderBy(...(recentFirst ? [desc(jobs.stageChangedAt)] : [sql`${jobs.dueDate} is null`, asc(jobs.dueDate)]), desc(jobs.id))
      .limit(BOARD_CARDS_PER_STAGE)
      .all() as JobRow[];
    return { stage, total: counts.get(stage) ?? 0, jobs: rows.map((r) => toDto(r, actor)) };
  });
  const slots = nextSlots(deps, columns.flatMap((c) => (OPEN_STAGES.includes(c.stage) ? c.jobs.map((j) => j.id) : [])));
  for (const job of columns.flatMap((c) => c.jobs)) {
    const slot = slots.get(job.id);
    job.nextBoothSlot = slot ? { startsAt: new Date(slot.startsAt).toISOString(), boothName: slot.boothName } : null;
  }
  return { columns };
}

const stageEventsOf = preparedQuery((db) =>
  db
    .select({
      id: jobStageEvents.id,
      fromStage: jobStageEvents.fromStage,
      toStage: jobStageEvents.toStage,
      note: jobStageEvents.note,
      byName: sql<string>`coalesce(${users.name}, case ${jobStageEvents.via} when 'payment' then 'The customer, paying online' when 'system' then 'Coatwright' else 'Former user' end)`,
      at: jobStageEvents.at,
    })
    .from(jobStageEvents)
    .leftJoin(users, eq(jobStageEvents.userId, users.id))
    .where(eq(jobStageEvents.jobId, placeholder("jobId")))
    .orderBy(desc(jobStageEvents.at), desc(jobStageEvents.id))
    .prepare(),
);

const jobRowFor = preparedQuery((db, kind: ScopeKind) =>
  selectJobs(db)
    .where(and(eq(jobs.id, placeholder("id")), preparedJobScope(kind)))
    .prepare(),
);

/** The job with its items and (for staff) its stage history; the access check is the first query's scope. */
export function getJob(deps: AppDeps, actor: Actor, id: number): JobDetailDto {
  const row = jobRowFor(deps.db, scopeKind(actor)).get({ id, ...scopeValues(actor) }) as JobRow | undefined;
  if (!row) throw notFound("Job");
  const job = toDto(row, actor);
  const canMove = actor.role !== "painter" || row.assignedPainterId === actor.id;
  return {
    ...job,
    items: itemsOfJob(deps, actor, id),
    events: actor.role === "customer" ? [] : stageEventsOf(deps.db).all({ jobId: id }).map((e) => ({ ...e, at: iso(e.at) })),
    nextStages: canMove ? nextStagesFor(actor.role, row.stage) : [],
  };
}

function checkRefs(deps: AppDeps, input: { customerId?: number; assignedPainterId?: string | null }) {
  if (input.customerId !== undefined) {
    const c = deps.db.select({ id: customers.id }).from(customers).where(eq(customers.id, input.customerId)).get();
    if (!c) throw badRequest("That customer does not exist", { customerId: "No such customer" });
  }
  if (input.assignedPainterId) {
    const painter = deps.db.select({ role: users.role, active: users.active }).from(users).where(eq(users.id, input.assignedPainterId)).get();
    if (!painter || painter.role !== "painter" || !painter.active)
      throw badRequest("Assign the job to an active painter", { assignedPainterId: "Not an active painter" });
  }
}

export function createJob(deps: AppDeps, actor: Actor, input: z.output<typeof createJobInputSchema>): JobDetailDto {
  checkRefs(deps, input);
  const now = deps.now();
  const id = deps.db.transaction((tx) => {
    const job = tx
      .insert(jobs)
      .values({
        customerId: input.customerId,
        title: input.title,
        dueDate: input.dueDate ?? null,
        assignedPainterId: input.assignedPainterId ?? null,
        notes: input.notes ?? null,
        stage: "inquiry",
        stageChangedAt: now,
        createdAt: now,
        updatedAt: now,
      })
      .returning({ id: jobs.id })
      .get();
    tx.insert(jobStageEvents).values({ jobId: job.id, fromStage: null, toStage: "inquiry", userId: actor.id, at: now, note: "Job created" }).run();
    return job.id;
  });
  return getJob(deps, actor, id);
}

export function updateJob(deps: AppDeps, actor: Actor, id: number, input: z.output<typeof updateJobInputSchema>): JobDetailDto {
  const job = findJobFor(deps, actor, id);
  checkRefs(deps, input);
  checkCustomerMove(deps, job, input.customerId);
  const { version, ...fields } = input;
  updateAtVersion(deps.db, jobs, { id, version, actorId: actor.id, what: "job" }, { ...fields, updatedAt: deps.now() }, () => getJob(deps, actor, id));
  return getJob(deps, actor, id);
}

export function changeStage(deps: AppDeps, actor: Actor, id: number, input: z.output<typeof changeStageInputSchema>): JobDetailDto {
  const job = findJobFor(deps, actor, id);
  if (job.stage === input.stage) throw conflict(`The job is already ${STAGE_LABELS[job.stage].toLowerCase()}`, { stage: "Same stage" });
  const allowed = nextStagesFor(actor.role, job.stage);
  if (!allowed.includes(input.stage)) {
    const options = allowed.map((s) => STAGE_LABELS[s]).join(", ") || "none for your role";
    throw conflict(`A job cannot move from ${STAGE_LABELS[job.stage]} to ${STAGE_LABELS[input.stage]}. Allowed: ${options}`, {
      stage: "Not allowed from the current stage",
    });
  }
  const now = deps.now();
  deps.db.transaction((tx) => {
    recordStageMove(tx, { jobId: id, from: job.stage, to: input.stage, note: input.note ?? null, userId: actor.id, at: now });
  });
  afterStageChange(deps, actor, id, input.stage);
  return getJob(deps, actor, id);
}

/** Only an inquiry can be deleted outright; anything further along is cancelled so its history stays. */
export function deleteJob(deps: AppDeps, actor: Actor, id: number) {
  const job = findJobFor(deps, actor, id);
  if (job.stage !== "inquiry") throw conflict("Only an inquiry can be deleted; move the job to Cancelled instead", { stage: job.stage });
  try {
    deps.db.delete(jobs).where(eq(jobs.id, id)).run();
  } catch (error) {
    // A job that went further and came back (e.g. quoted → inquiry) may hold records that must be kept
    // (recorded mix sheets, quotes, payments); the database refuses, and so do we.
    const e = error as { code?: string; message?: string };
    if (e.code?.startsWith("SQLITE_CONSTRAINT") && /FOREIGN KEY/i.test(e.message ?? "")) {
      throw conflict("This job has records that must be kept (batches, quotes or payments); move it to Cancelled instead", { stage: job.stage });
    }
    throw error;
  }
}
