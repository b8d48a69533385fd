import { updateAtVersion } from "../../db/edit-version";
import { and, eq, gt, gte, inArray, lt } from "drizzle-orm";
import type { z } from "zod";
import type { AppDeps } from "../../deps";
import type { Actor } from "../../auth/session";
import { booths, prepPlans, scheduleSessions, users } from "../../db/schema";
import { badRequest, notFound } from "../../http/http-error";
import type { RequestContext } from "../../http/context";
import { findJobFor } from "../jobs/jobs.access";
import { findConflicts, lastCoatAt, sessionAt, suggestSchedule, type Conflict, type Session } from "../../../shared/schedule";
import type {
  acceptSuggestionInputSchema,
  ConflictDto,
  prepPlanInputSchema,
  ScheduleDto,
  SchedulableJobDto,
  SessionDto,
  sessionInputSchema,
  SuggestionDto,
  suggestInputSchema,
  updateSessionInputSchema,
} from "../../../shared/schemas/schedule.schema";
import { boothDto, boothRows, boothRules } from "./booths.service";
import { jobFacts, schedulableJobIds, type JobFacts } from "./schedule-facts";

type SessionRow = typeof scheduleSessions.$inferSelect;
const DAY = 86_400_000;
const iso = (ms: number) => new Date(ms).toISOString();

/** Everything the rules need about the booths and jobs a set of sessions touches. */
function factsFor(deps: AppDeps, jobIds: Iterable<number>) {
  const rows = boothRows(deps);
  const jobsById = jobFacts(deps, [...new Set(jobIds)]);
  return { rows, booths: rows.map(boothRules), jobsById, jobs: [...jobsById.values()] };
}

function toSessionDtos(facts: ReturnType<typeof factsFor>, sessions: readonly (Session & { id?: number; version?: number })[], painters: Map<string, string>): SessionDto[] {
  return sessions.map((s) => {
    const job = facts.jobsById.get(s.jobId);
    const layer = job?.allLayers.find((l) => l.id === s.layerId);
    const booth = facts.booths.find((b) => b.id === s.boothId);
    return {
      id: s.id ?? null,
      version: s.version ?? null,
      boothId: s.boothId,
      jobId: s.jobId,
      jobTitle: job?.title ?? `Job #${s.jobId}`,
      layerId: s.layerId,
      layerName: layer?.name ?? "A layer no longer in the plan",
      layerPosition: layer?.position ?? 0,
      startsAt: iso(s.startsAt),
      sprayEndsAt: iso(booth && layer ? lastCoatAt(s, booth, layer) : s.endsAt),
      endsAt: iso(s.endsAt),
      painterName: job?.painterId ? (painters.get(job.painterId) ?? null) : null,
    };
  });
}

const conflictDtos = (found: readonly Conflict[], sessions: readonly { id?: number }[]): ConflictDto[] =>
  found.map((c) => ({ kind: c.kind, jobId: c.jobId, sessionIds: c.sessions.map((i) => sessions[i]?.id ?? null), message: c.message }));

const painterNames = (deps: AppDeps) => new Map(deps.db.select({ id: users.id, name: users.name }).from(users).where(eq(users.role, "painter")).all().map((u) => [u.id, u.name]));

const asSession = (r: SessionRow): Session & { id: number; version: number } => ({ id: r.id, version: r.version, boothId: r.boothId, jobId: r.jobId, layerId: r.layerId, startsAt: r.startsAt, endsAt: r.endsAt });

/**
 * The booth schedule between two instants, with every conflict among its sessions. Conflicts are found with the
 * sessions two weeks either side too, so a layer's window is checked against the layer under it even across the
 * edge of the view. A painter sees the sessions of the jobs assigned to them.
 */
export function getSchedule(deps: AppDeps, actor: Actor, from: number, to: number): ScheduleDto {
  const around = deps.db
    .select()
    .from(scheduleSessions)
    .where(and(lt(scheduleSessions.startsAt, to + 14 * DAY), gt(scheduleSessions.endsAt, from - 14 * DAY)))
    .all()
    .map(asSession);
  const facts = factsFor(deps, around.map((s) => s.jobId));
  const found = findConflicts(around, facts);
  const mine = (s: Session) => actor.role !== "painter" || facts.jobsById.get(s.jobId)?.painterId === actor.id;
  const inView = around.filter((s) => s.startsAt < to && s.endsAt > from && mine(s));
  const shown = new Set(inView.map((s) => s.id));
  return {
    from: iso(from),
    to: iso(to),
    booths: facts.rows.map(boothDto),
    sessions: toSessionDtos(facts, inView, painterNames(deps)).sort((a, b) => a.startsAt.localeCompare(b.startsAt)),
    // Planning is the office's: a painter's view carries no conflicts (they would name other painters' jobs).
    conflicts: actor.role === "painter" ? [] : conflictDtos(found, around).filter((c) => c.sessionIds.some((id) => id != null && shown.has(id))),
  };
}

/** Jobs that may need booth time, with their layers and which are booked, for placing by hand. */
export function listSchedulableJobs(deps: AppDeps): SchedulableJobDto[] {
  const facts = jobFacts(deps, schedulableJobIds(deps));
  const booked = new Set(deps.db.select({ layerId: scheduleSessions.layerId }).from(scheduleSessions).all().map((s) => s.layerId));
  return [...facts.values()]
    .filter((j) => j.allLayers.length > 0)
    .sort((a, b) => (a.dueDate ?? "9999").localeCompare(b.dueDate ?? "9999") || a.id - b.id)
    .map((j) => ({
      id: j.id,
      title: j.title,
      dueDate: j.dueDate,
      stage: j.stage,
      prepReadyAt: j.prepReadyAt == null ? null : iso(j.prepReadyAt),
      prepSignedOff: j.prepSignedOff,
      layers: j.layers.map((l) => ({ id: l.id, name: l.name, position: l.position, coats: l.coats, scheduled: booked.has(l.id) })),
    }));
}

/** The booth and the job's layer a session is for, checked; the session's end follows from the rules. */
function placed(deps: AppDeps, facts: { jobsById: Map<number, JobFacts> }, input: { boothId: number; jobId: number; layerId: number; startsAt: number }): Session {
  const booth = deps.db.select().from(booths).where(eq(booths.id, input.boothId)).get();
  if (!booth) throw badRequest("There is no such booth", { boothId: "No such booth" });
  if (!booth.active) throw badRequest(`${booth.name} is not in use`, { boothId: "Booth not in use" });
  const job = facts.jobsById.get(input.jobId);
  if (!job) throw badRequest("There is no such job", { jobId: "No such job" });
  const layer = job.layers.find((l) => l.id === input.layerId);
  if (!layer) {
    const done = job.allLayers.some((l) => l.id === input.layerId);
    throw badRequest(done ? "That layer is already sprayed" : "That layer is not in the job's plan", { layerId: done ? "Already sprayed" : "Not a layer of this job" });
  }
  return sessionAt(boothRules(booth), layer, input.startsAt);
}

function sessionWithConflicts(deps: AppDeps, actor: Actor, id: number) {
  const row = deps.db.select().from(scheduleSessions).where(eq(scheduleSessions.id, id)).get();
  if (!row) throw notFound("Session");
  return getSchedule(deps, actor, row.startsAt - DAY, row.endsAt + DAY);
}

export function createSession(deps: AppDeps, ctx: RequestContext, input: z.output<typeof sessionInputSchema>): ScheduleDto {
  findJobFor(deps, ctx.actor, input.jobId);
  const facts = factsFor(deps, [input.jobId]);
  const s = placed(deps, facts, { ...input, startsAt: Date.parse(input.startsAt) });
  const id = deps.db.transaction((tx) => {
    if (tx.select({ id: scheduleSessions.id }).from(scheduleSessions).where(eq(scheduleSessions.layerId, s.layerId)).get())
      throw badRequest("That layer is already on the schedule: move its session instead", { layerId: "Already booked" });
    const now = deps.now();
    return tx.insert(scheduleSessions).values({ ...s, createdBy: ctx.actor.id, createdAt: now, updatedAt: now }).returning({ id: scheduleSessions.id }).all()[0]!.id;
  });
  return sessionWithConflicts(deps, ctx.actor, id);
}

export function updateSession(deps: AppDeps, ctx: RequestContext, id: number, input: z.output<typeof updateSessionInputSchema>): ScheduleDto {
  const row = deps.db.select().from(scheduleSessions).where(eq(scheduleSessions.id, id)).get();
  if (!row) throw notFound("Session");
  const facts = factsFor(deps, [row.jobId]);
  const s = placed(deps, facts, { boothId: input.boothId ?? row.boothId, jobId: row.jobId, layerId: row.layerId, startsAt: input.startsAt ? Date.parse(input.startsAt) : row.startsAt });
  updateAtVersion(deps.db, scheduleSessions, { id, version: input.version, actorId: ctx.actor.id, what: "booth session" }, { boothId: s.boothId, startsAt: s.startsAt, endsAt: s.endsAt, updatedAt: deps.now() }, () =>
    getSchedule(deps, ctx.actor, row.startsAt - DAY, row.endsAt + DAY).sessions.find((x) => x.id === id),
  );
  return sessionWithConflicts(deps, ctx.actor, id);
}

export function deleteSession(deps: AppDeps, id: number) {
  const gone = deps.db.delete(scheduleSessions).where(eq(scheduleSessions.id, id)).run();
  if (gone.changes === 0) throw notFound("Session");
}

/**
 * A proposed schedule from `from`: every layer still to spray of the schedulable jobs, earliest due date first.
 * Sessions that started before `from` stay; nothing is saved.
 */
export function suggest(deps: AppDeps, input: z.output<typeof suggestInputSchema>): SuggestionDto {
  const from = input.from ? Date.parse(input.from) : deps.now();
  const facts = factsFor(deps, schedulableJobIds(deps));
  const keep = deps.db.select().from(scheduleSessions).where(lt(scheduleSessions.startsAt, from)).all().map(asSession);
  const kept = new Set(keep.map((s) => s.layerId));
  const jobsToPlace = facts.jobs.map((j) => ({ ...j, layers: j.layers.filter((l) => !kept.has(l.id)) })).filter((j) => j.layers.length > 0);
  const active = facts.booths.filter((b) => facts.rows.find((r) => r.id === b.id)?.active);
  const proposal = suggestSchedule({ booths: active, jobs: jobsToPlace, keep, from, horizonDays: input.horizonDays });
  return {
    from: iso(from),
    sessions: toSessionDtos(facts, proposal.sessions, painterNames(deps)),
    unplaced: proposal.unplaced.map((u) => ({ ...u, jobTitle: facts.jobsById.get(u.jobId)?.title ?? `Job #${u.jobId}` })),
    conflicts: conflictDtos(findConflicts([...keep, ...proposal.sessions], facts), [...keep, ...proposal.sessions]),
  };
}

/** Saves an accepted (possibly adjusted) proposal: the sessions from `from` on are replaced by these, in one go. */
export function acceptSuggestion(deps: AppDeps, ctx: RequestContext, input: z.output<typeof acceptSuggestionInputSchema>): ScheduleDto {
  const from = Date.parse(input.from);
  const facts = factsFor(deps, input.sessions.map((s) => s.jobId));
  const sessions = input.sessions.map((s, i) => {
    try {
      return placed(deps, facts, { ...s, startsAt: Date.parse(s.startsAt) });
    } catch (err) {
      throw badRequest(`Session ${i + 1}: ${(err as Error).message}`, { [`sessions.${i}`]: (err as Error).message });
    }
  });
  const layers = sessions.map((s) => s.layerId);
  if (new Set(layers).size !== layers.length) throw badRequest("A layer is booked twice in the proposal", { sessions: "A layer appears twice" });
  if (sessions.some((s) => s.startsAt < from)) throw badRequest("Every session starts at or after the proposal's start", { sessions: "Starts before from" });
  const now = deps.now();
  deps.db.transaction((tx) => {
    tx.delete(scheduleSessions).where(gte(scheduleSessions.startsAt, from)).run();
    if (layers.length) tx.delete(scheduleSessions).where(inArray(scheduleSessions.layerId, layers)).run();
    for (const s of sessions) tx.insert(scheduleSessions).values({ ...s, createdBy: ctx.actor.id, createdAt: now, updatedAt: now }).run();
  });
  const last = Math.max(from + DAY, ...sessions.map((s) => s.endsAt));
  return getSchedule(deps, ctx.actor, from, Math.min(last, from + 62 * DAY));
}

/** When a job's prep is planned to be signed off (null clears it). */
export function setPrepPlan(deps: AppDeps, ctx: RequestContext, jobId: number, input: z.output<typeof prepPlanInputSchema>) {
  findJobFor(deps, ctx.actor, jobId);
  if (input.readyAt == null) deps.db.delete(prepPlans).where(eq(prepPlans.jobId, jobId)).run();
  else {
    const readyAt = Date.parse(input.readyAt);
    deps.db
      .insert(prepPlans)
      .values({ jobId, readyAt, updatedBy: ctx.actor.id, updatedAt: deps.now() })
      .onConflictDoUpdate({ target: prepPlans.jobId, set: { readyAt, updatedBy: ctx.actor.id, updatedAt: deps.now() } })
      .run();
  }
  return listSchedulableJobs(deps).find((j) => j.id === jobId) ?? null;
}

/** The next booked session of each job, for the board. */
export function nextSlots(deps: Pick<AppDeps, "db" | "now">, jobIds: readonly number[]): Map<number, { startsAt: number; boothName: string }> {
  if (jobIds.length === 0) return new Map();
  const rows = deps.db
    .select({ jobId: scheduleSessions.jobId, startsAt: scheduleSessions.startsAt, boothName: booths.name })
    .from(scheduleSessions)
    .innerJoin(booths, eq(booths.id, scheduleSessions.boothId))
    .where(and(inArray(scheduleSessions.jobId, [...jobIds]), gt(scheduleSessions.endsAt, deps.now())))
    .orderBy(scheduleSessions.startsAt)
    .all();
  const out = new Map<number, { startsAt: number; boothName: string }>();
  for (const r of rows) if (!out.has(r.jobId)) out.set(r.jobId, { startsAt: r.startsAt, boothName: r.boothName });
  return out;
}

