import { eq } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import { materials } from "../../db/schema";
import { notFound } from "../../http/http-error";

export type MaterialRow = typeof materials.$inferSelect;

/** The material with this id, or 404. */
export function findMaterial(deps: Pick<AppDeps, "db">, id: number): MaterialRow {
  const row = deps.db.select().from(materials).where(eq(materials.id, id)).get();
  if (!row) throw notFound("Material");
  return row;
}
