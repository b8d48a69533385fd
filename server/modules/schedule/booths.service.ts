import { updateAtVersion } from "../../db/edit-version";
import { asc, desc, eq } from "drizzle-orm";
import type { z } from "zod";
import type { AppDeps } from "../../deps";
import { booths } from "../../db/schema";
import { badRequest, conflict, notFound } from "../../http/http-error";
import type { RequestContext } from "../../http/context";
import { recordAudit } from "../audit/audit.service";
import type { Booth } from "../../../shared/schedule";
import { hhmmOf, minuteOfDay, type BoothDto, type boothInputSchema, type updateBoothInputSchema } from "../../../shared/schemas/schedule.schema";

export type BoothRow = typeof booths.$inferSelect;

export const boothDto = (b: BoothRow): BoothDto => ({
  id: b.id,
  version: b.version,
  name: b.name,
  setupMinutes: b.setupMinutes,
  canCureOutside: b.canCureOutside,
  opensAt: hhmmOf(b.opensAtMinute),
  closesAt: hhmmOf(b.closesAtMinute),
  workDays: [...b.workDays].sort(),
  timeZone: b.timeZone,
  active: b.active,
});

/** A booth as the scheduling rules take it. */
export const boothRules = (b: BoothRow): Booth => ({
  id: b.id,
  name: b.name,
  setupMinutes: b.setupMinutes,
  canCureOutside: b.canCureOutside,
  opensAtMinute: b.opensAtMinute,
  closesAtMinute: b.closesAtMinute,
  workDays: b.workDays,
  timeZone: b.timeZone,
});

export function boothRows(deps: Pick<AppDeps, "db">): BoothRow[] {
  return deps.db.select().from(booths).orderBy(desc(booths.active), asc(booths.name), asc(booths.id)).all();
}

export function listBooths(deps: AppDeps): BoothDto[] {
  return boothRows(deps).map(boothDto);
}

function checkName(deps: AppDeps, name: string, exceptId?: number) {
  const taken = deps.db.select({ id: booths.id, name: booths.name }).from(booths).all().some((b) => b.id !== exceptId && b.name.toLowerCase() === name.toLowerCase());
  if (taken) throw conflict(`A booth is already called ${name}`, { name: "Already used" });
}

export function createBooth(deps: AppDeps, ctx: RequestContext, input: z.output<typeof boothInputSchema>): BoothDto {
  checkName(deps, input.name);
  const now = deps.now();
  const row = deps.db.transaction((tx) => {
    const created = tx
      .insert(booths)
      .values({
        name: input.name,
        setupMinutes: input.setupMinutes,
        canCureOutside: input.canCureOutside,
        opensAtMinute: minuteOfDay(input.opensAt),
        closesAtMinute: minuteOfDay(input.closesAt),
        workDays: [...new Set(input.workDays)],
        timeZone: input.timeZone,
        active: input.active,
        createdAt: now,
        updatedAt: now,
      })
      .returning()
      .all()[0]!;
    recordAudit(tx, ctx, { kind: "settings", entity: "booth", entityId: created.id, action: "create", after: boothDto(created) }, now);
    return created;
  });
  return boothDto(row);
}

export function updateBooth(deps: AppDeps, ctx: RequestContext, id: number, input: z.output<typeof updateBoothInputSchema>): BoothDto {
  const before = deps.db.select().from(booths).where(eq(booths.id, id)).get();
  if (!before) throw notFound("Booth");
  if (input.name !== undefined) checkName(deps, input.name, id);
  const opens = input.opensAt !== undefined ? minuteOfDay(input.opensAt) : before.opensAtMinute;
  const closes = input.closesAt !== undefined ? minuteOfDay(input.closesAt) : before.closesAtMinute;
  if (closes <= opens) throw badRequest("Closing time must be after opening time", { closesAt: "Must be after opening time" });
  const now = deps.now();
  const row = deps.db.transaction((tx) => {
    updateAtVersion(tx, booths, { id, version: input.version, actorId: ctx.actor.id, what: "booth" }, {
        ...(input.name !== undefined && { name: input.name }),
        ...(input.setupMinutes !== undefined && { setupMinutes: input.setupMinutes }),
        ...(input.canCureOutside !== undefined && { canCureOutside: input.canCureOutside }),
        ...(input.workDays !== undefined && { workDays: [...new Set(input.workDays)] }),
        ...(input.timeZone !== undefined && { timeZone: input.timeZone }),
        ...(input.active !== undefined && { active: input.active }),
        opensAtMinute: opens,
        closesAtMinute: closes,
        updatedAt: now,
      }, () => boothDto(tx.select().from(booths).where(eq(booths.id, id)).get()!));
    const updated = tx.select().from(booths).where(eq(booths.id, id)).get()!;
    recordAudit(tx, ctx, { kind: "settings", entity: "booth", entityId: id, action: "update", before: boothDto(before), after: boothDto(updated) }, now);
    return updated;
  });
  return boothDto(row);
}
