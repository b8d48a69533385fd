import { updateAtVersion } from "../../db/edit-version";
import { asc, desc, eq } from "drizzle-orm";
import type { z } from "zod";
import type { AppDeps } from "../../deps";
import { guns } from "../../db/schema";
import { badRequest, conflict, notFound } from "../../http/http-error";
import type { GunDto, gunInputSchema, updateGunInputSchema } from "../../../shared/schemas/spray-setup.schema";

type GunRow = typeof guns.$inferSelect;
const toDto = (g: GunRow): GunDto => ({ id: g.id, name: g.name, description: g.description, active: g.active, version: g.version });

/** The shop's guns, active ones first; guns are never deleted (old coat logs name them), only put away. */
export function listGuns(deps: AppDeps): GunDto[] {
  return deps.db.select().from(guns).orderBy(desc(guns.active), asc(guns.name), asc(guns.id)).all().map(toDto);
}

function nameTaken(deps: AppDeps, name: string, exceptId?: number) {
  const same = deps.db.select({ id: guns.id, name: guns.name }).from(guns).all();
  return same.some((g) => g.id !== exceptId && g.name.toLowerCase() === name.toLowerCase());
}

export function createGun(deps: AppDeps, input: z.output<typeof gunInputSchema>): GunDto {
  if (nameTaken(deps, input.name)) throw conflict(`A gun is already called ${input.name}`, { name: "Already used" });
  const now = deps.now();
  const row = deps.db
    .insert(guns)
    .values({ name: input.name, description: input.description ?? null, active: input.active ?? true, createdAt: now, updatedAt: now })
    .returning()
    .get()!;
  return toDto(row);
}

export function updateGun(deps: AppDeps, actorId: string, id: number, input: z.output<typeof updateGunInputSchema>): GunDto {
  const row = deps.db.select().from(guns).where(eq(guns.id, id)).get();
  if (!row) throw notFound("Gun");
  if (input.name && nameTaken(deps, input.name, id)) throw conflict(`A gun is already called ${input.name}`, { name: "Already used" });
  const set: Partial<GunRow> = {};
  if (input.name !== undefined) set.name = input.name;
  if (input.description !== undefined) set.description = input.description;
  if (input.active !== undefined) set.active = input.active;
  updateAtVersion(deps.db, guns, { id, version: input.version, actorId, what: "gun" }, { ...set, updatedAt: deps.now() }, () => toDto(deps.db.select().from(guns).where(eq(guns.id, id)).get()!));
  return toDto(deps.db.select().from(guns).where(eq(guns.id, id)).get()!);
}

/** Checks a gun id sent with a coat log or a panel: it must be one of the shop's guns. */
export function checkGun(deps: AppDeps, gunId: number | null | undefined) {
  if (gunId == null) return;
  if (!deps.db.select({ id: guns.id }).from(guns).where(eq(guns.id, gunId)).get()) throw badRequest("That gun is not on the shop's list", { gunId: "No such gun" });
}

/** Gun names by id, for showing set-ups. */
export function gunNames(deps: AppDeps): Map<number, string> {
  return new Map(deps.db.select({ id: guns.id, name: guns.name }).from(guns).all().map((g) => [g.id, g.name]));
}
