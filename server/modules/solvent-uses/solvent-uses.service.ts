import { and, asc, eq, gte, lt } from "drizzle-orm";
import type { z } from "zod";
import type { AppDeps } from "../../deps";
import type { Actor } from "../../auth/session";
import type { RequestContext } from "../../http/context";
import { jobs, materials, solventUses, users } from "../../db/schema";
import { badRequest } from "../../http/http-error";
import { iso } from "../../http/dates";
import { findJobFor } from "../jobs/jobs.access";
import { convertVolume } from "../../../shared/mix/index";
import { MATERIAL_CATEGORY_LABELS, SOLVENT_CATEGORIES } from "../../../shared/domain/materials";
import type { createSolventUseInputSchema, SolventUseDto } from "../../../shared/schemas/solvent-use.schema";

/** VOC mass of a volume at a regulatory VOC (g/L less water and exempt): g/L × L × (1 − water and exempt share). */
export const solventVocKg = (volumeMl: number, vocGPerL: number | null, waterExemptPct: number) =>
  vocGPerL == null ? 0 : (vocGPerL * (volumeMl / 1000) * (1 - waterExemptPct / 100)) / 1000;

/** Local midnight of a YYYY-MM-DD date, epoch ms (the compliance log's day boundary). */
export function dayStart(date: string) {
  const [y, m, d] = date.split("-").map(Number) as [number, number, number];
  return new Date(y, m - 1, d).getTime();
}

/** Logs solvent used now; a job named must be one the actor reaches. The catalogue's VOC figures are copied onto it. */
export function logSolventUse(deps: AppDeps, ctx: RequestContext, input: z.output<typeof createSolventUseInputSchema>): SolventUseDto {
  const m = deps.db.select().from(materials).where(eq(materials.id, input.materialId)).get();
  if (!m) throw badRequest("No such material in the catalogue", { materialId: "No such material" });
  if (!SOLVENT_CATEGORIES.includes(m.category))
    throw badRequest(`${m.code} is a ${MATERIAL_CATEGORY_LABELS[m.category].toLowerCase()}; solvent use is for cleaners and reducers (mixed paint is counted through its batch)`, {
      materialId: "Choose a cleaner or a reducer",
    });
  if (input.jobId != null) findJobFor(deps, ctx.actor, input.jobId);
  const now = deps.now();
  const row = deps.db
    .insert(solventUses)
    .values({
      materialId: m.id,
      jobId: input.jobId ?? null,
      purpose: input.purpose,
      amount: input.amount,
      unit: input.unit,
      volumeMl: convertVolume(input.amount, input.unit, "mL"),
      vocGPerL: m.vocGPerL,
      waterExemptPct: m.waterExemptPct,
      note: input.note ?? null,
      usedAt: now,
      loggedBy: ctx.actor.id,
      createdAt: now,
    })
    .returning({ id: solventUses.id })
    .get();
  return solventUseRows(deps, { id: row.id })[0]!;
}

function solventUseRows(deps: Pick<AppDeps, "db">, where: { id?: number; fromMs?: number; toMs?: number }): SolventUseDto[] {
  return deps.db
    .select({ u: solventUses, code: materials.code, name: materials.name, category: materials.category, jobTitle: jobs.title, by: users.name })
    .from(solventUses)
    .innerJoin(materials, eq(solventUses.materialId, materials.id))
    .leftJoin(jobs, eq(solventUses.jobId, jobs.id))
    .leftJoin(users, eq(solventUses.loggedBy, users.id))
    .where(
      and(
        where.id != null ? eq(solventUses.id, where.id) : undefined,
        where.fromMs != null ? gte(solventUses.usedAt, where.fromMs) : undefined,
        where.toMs != null ? lt(solventUses.usedAt, where.toMs) : undefined,
      ),
    )
    .orderBy(asc(solventUses.usedAt), asc(solventUses.id))
    .all()
    .map(({ u, code, name, category, jobTitle, by }) => ({
      id: u.id,
      materialId: u.materialId,
      materialCode: code,
      materialName: name,
      category,
      jobId: u.jobId,
      jobTitle,
      purpose: u.purpose,
      amount: u.amount,
      unit: u.unit,
      volumeMl: u.volumeMl,
      vocGPerL: u.vocGPerL,
      vocKg: solventVocKg(u.volumeMl, u.vocGPerL, u.waterExemptPct),
      note: u.note,
      usedAt: iso(u.usedAt),
      loggedByName: by,
    }));
}

/** Solvent uses between two epoch-ms bounds (the compliance log counts them beside the batches). */
export const solventUsesBetween = (deps: Pick<AppDeps, "db">, fromMs: number, toMs: number) => solventUseRows(deps, { fromMs, toMs });

/** The list for a date range (staff: the booth logs them, the office reads them in the VOC log). */
export function listSolventUses(deps: AppDeps, _actor: Actor, q: { from: string; to: string }): SolventUseDto[] {
  return solventUsesBetween(deps, dayStart(q.from), dayStart(q.to) + 86_400_000);
}
