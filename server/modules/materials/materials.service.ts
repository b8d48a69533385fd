import { updateAtVersion } from "../../db/edit-version";
import { and, asc, count, eq, like, or, sql, type SQL } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import type { Actor } from "../../auth/session";
import { layerComponents, materialLots, materials, mixSheetLines, uploads } from "../../db/schema";
import { removeStored } from "../uploads/storage";
import { badRequest, conflict, notFound } from "../../http/http-error";
import { iso } from "../../http/dates";
import type { RequestContext } from "../../http/context";
import { recordAudit } from "../audit/audit.service";
import { findMaterial, type MaterialRow } from "./materials.access";
import { listFiles } from "./material-files.service";
import { cautionsFor } from "../../../shared/domain/safety";
import { MATERIAL_CATEGORIES } from "../../../shared/domain/materials";
import type {
  CreateMaterialValues,
  ListMaterialsQuery,
  LotDto,
  MaterialDetailDto,
  MaterialDto,
  createLotInputSchema,
  updateLotInputSchema,
  updateMaterialInputSchema,
} from "../../../shared/schemas/material.schema";
import type { z } from "zod";
import { roleCan } from "../../../shared/domain/roles";

type LotRow = typeof materialLots.$inferSelect;

/** Only the office (owner, estimator) sees what materials cost. */
export const seesCost = (actor: Actor) => roleCan(actor.role, "office");

/** Local calendar date as YYYY-MM-DD. */
export function todayOf(ms: number) {
  const d = new Date(ms);
  const pad = (n: number) => String(n).padStart(2, "0");
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
}

const stockSum = sql<number>`coalesce((select sum(l."quantity_on_hand") from "material_lots" as l where l."material_id" = "materials"."id"), 0)`.mapWith(Number);

export function toMaterialDto(row: MaterialRow, stockOnHand: number, actor: Actor): MaterialDto {
  const { costCents, updatedBy: _updatedBy, ...rest } = row;
  const dto: MaterialDto = {
    ...rest,
    stockOnHand,
    lowStock: row.lowStockThreshold != null && stockOnHand <= row.lowStockThreshold,
    cautions: cautionsFor([row]),
    createdAt: iso(row.createdAt),
    updatedAt: iso(row.updatedAt),
  };
  if (seesCost(actor)) dto.costCents = costCents;
  return dto;
}

export function toLotDto(row: LotRow, today: string): LotDto {
  return {
    id: row.id,
    version: row.version,
    materialId: row.materialId,
    lotNumber: row.lotNumber,
    quantityOnHand: row.quantityOnHand,
    receivedOn: row.receivedOn,
    expiresOn: row.expiresOn,
    expired: row.expiresOn != null && row.expiresOn < today,
    createdAt: iso(row.createdAt),
  };
}

export function listMaterials(deps: AppDeps, actor: Actor, q: ListMaterialsQuery): MaterialDto[] {
  const filters: (SQL | undefined)[] = [];
  if (!q.includeInactive) filters.push(eq(materials.active, true));
  if (q.category) filters.push(eq(materials.category, q.category));
  if (q.q) filters.push(or(like(materials.name, `%${q.q}%`), like(materials.code, `%${q.q}%`)));
  return deps.db
    .select({ m: materials, stock: stockSum })
    .from(materials)
    .where(and(...filters))
    .orderBy(sql`(case ${materials.category} ${sql.raw(MATERIAL_CATEGORIES.map((c, i) => `when '${c}' then ${i}`).join(" "))} end)`, asc(materials.code))
    .all()
    .map((r) => toMaterialDto(r.m, r.stock, actor));
}

/** Active materials at or below their low-stock level, lowest stock (relative to the level) first. */
export function lowStock(deps: AppDeps, actor: Actor): MaterialDto[] {
  return listMaterials(deps, actor, {})
    .filter((m) => m.lowStock)
    .sort((a, b) => a.stockOnHand / Math.max(a.lowStockThreshold ?? 1, 1e-9) - b.stockOnHand / Math.max(b.lowStockThreshold ?? 1, 1e-9));
}

export function listLots(deps: AppDeps, materialId: number): LotDto[] {
  findMaterial(deps, materialId);
  const today = todayOf(deps.now());
  return deps.db
    .select()
    .from(materialLots)
    .where(eq(materialLots.materialId, materialId))
    .orderBy(sql`${materialLots.expiresOn} is null`, asc(materialLots.expiresOn), asc(materialLots.receivedOn), asc(materialLots.id))
    .all()
    .map((l) => toLotDto(l, today));
}

export function getMaterial(deps: AppDeps, actor: Actor, id: number): MaterialDetailDto {
  const row = findMaterial(deps, id);
  const lots = listLots(deps, id);
  const stock = lots.reduce((a, l) => a + l.quantityOnHand, 0);
  return { ...toMaterialDto(row, stock, actor), lots, files: listFiles(deps, id) };
}

function codeTaken(deps: AppDeps, code: string, exceptId?: number) {
  const row = deps.db.select({ id: materials.id }).from(materials).where(eq(materials.code, code)).get();
  return row !== undefined && row.id !== exceptId;
}

/** The cost of a material is money: its changes are audited. */
/** The data sheet's recoat window must open before it closes. */
function checkRecoatWindow(min: number | null | undefined, max: number | null | undefined) {
  if (min != null && max != null && min > max) throw badRequest("The latest recoat must be after the earliest", { recoatMaxMinutes: "Must be after the earliest recoat" });
}

export function createMaterial(deps: AppDeps, ctx: RequestContext, input: CreateMaterialValues): MaterialDetailDto {
  checkRecoatWindow(input.recoatMinMinutes, input.recoatMaxMinutes);
  if (codeTaken(deps, input.code)) throw conflict(`Code ${input.code} is already used by another material`, { code: "Already used" });
  const now = deps.now();
  const id = deps.db.transaction((tx) => {
    const row = tx
      .insert(materials)
      .values({
        code: input.code,
        name: input.name,
        category: input.category,
        purchaseUnit: input.purchaseUnit,
        costCents: input.costCents,
        volumeSolidsPct: input.volumeSolidsPct ?? null,
        vocGPerL: input.vocGPerL ?? null,
        waterExemptPct: input.waterExemptPct ?? 0,
        densityGPerMl: input.densityGPerMl ?? null,
        potLifeMinutes: input.potLifeMinutes ?? null,
        inductionMinutes: input.inductionMinutes ?? null,
        recoatMinMinutes: input.recoatMinMinutes ?? null,
        recoatMaxMinutes: input.recoatMaxMinutes ?? null,
        containsIsocyanates: input.containsIsocyanates ?? false,
        flammable: input.flammable ?? false,
        lowStockThreshold: input.lowStockThreshold ?? null,
        notes: input.notes ?? null,
        active: input.active ?? true,
        createdAt: now,
        updatedAt: now,
      })
      .returning()
      .get();
    recordAudit(tx, ctx, { kind: "money", entity: "material", entityId: row.id, action: "created", after: { code: row.code, name: row.name, costCents: row.costCents, purchaseUnit: row.purchaseUnit } }, now);
    return row.id;
  });
  return getMaterial(deps, ctx.actor, id);
}

export function updateMaterial(deps: AppDeps, ctx: RequestContext, id: number, input: z.output<typeof updateMaterialInputSchema>): MaterialDetailDto {
  const before = findMaterial(deps, id);
  checkRecoatWindow(input.recoatMinMinutes !== undefined ? input.recoatMinMinutes : before.recoatMinMinutes, input.recoatMaxMinutes !== undefined ? input.recoatMaxMinutes : before.recoatMaxMinutes);
  if (input.code && codeTaken(deps, input.code, id)) throw conflict(`Code ${input.code} is already used by another material`, { code: "Already used" });
  const { version, ...fields } = input;
  const set: Partial<MaterialRow> = {};
  for (const [k, v] of Object.entries(fields)) if (v !== undefined) (set as Record<string, unknown>)[k] = v;
  if ("waterExemptPct" in set && set.waterExemptPct === null) set.waterExemptPct = 0;
  const now = deps.now();
  deps.db.transaction((tx) => {
    updateAtVersion(tx, materials, { id, version, actorId: ctx.actor.id, what: "material" }, { ...set, updatedAt: now }, () => getMaterial(deps, ctx.actor, id));
    const moneyChanged = (set.costCents !== undefined && set.costCents !== before.costCents) || (set.purchaseUnit !== undefined && set.purchaseUnit !== before.purchaseUnit);
    if (moneyChanged) {
      recordAudit(
        tx,
        ctx,
        {
          kind: "money",
          entity: "material",
          entityId: id,
          action: "cost_changed",
          before: { code: before.code, name: before.name, costCents: before.costCents, purchaseUnit: before.purchaseUnit },
          after: { code: set.code ?? before.code, name: set.name ?? before.name, costCents: set.costCents ?? before.costCents, purchaseUnit: set.purchaseUnit ?? before.purchaseUnit },
          keep: ["code", "name"],
        },
        now,
      );
    }
  });
  return getMaterial(deps, ctx.actor, id);
}

/** A material that a plan or a batch record uses can only be retired (active = false), never deleted. */
/** Deletes a material no record uses, with its files (their rows in the transaction, the stored files after it). */
export function deleteMaterial(deps: AppDeps, ctx: RequestContext, id: number) {
  const row = findMaterial(deps, id);
  const inPlans = deps.db.select({ n: count() }).from(layerComponents).where(eq(layerComponents.materialId, id)).get()?.n ?? 0;
  const inBatches = deps.db.select({ n: count() }).from(mixSheetLines).where(eq(mixSheetLines.materialId, id)).get()?.n ?? 0;
  if (inPlans || inBatches) {
    throw conflict(`${row.code} is used by ${inPlans ? "a finish plan" : "a mix sheet"}; retire it instead (untick Active) so the records keep it`, {
      active: "Retire instead of deleting",
    });
  }
  const files = deps.db
    .select({ s: uploads.storedName, t: uploads.thumbName })
    .from(uploads)
    .where(and(eq(uploads.ownerType, "material"), eq(uploads.ownerId, id)))
    .all();
  const now = deps.now();
  deps.db.transaction((tx) => {
    tx.delete(uploads).where(and(eq(uploads.ownerType, "material"), eq(uploads.ownerId, id))).run();
    tx.delete(materials).where(eq(materials.id, id)).run();
    recordAudit(tx, ctx, { kind: "money", entity: "material", entityId: id, action: "deleted", before: { code: row.code, name: row.name, costCents: row.costCents } }, now);
  });
  removeStored(deps.uploadsDir, ...files.flatMap((f) => [f.s, f.t]));
}

export function createLot(deps: AppDeps, materialId: number, input: z.output<typeof createLotInputSchema>): LotDto {
  findMaterial(deps, materialId);
  checkLotDates(input);
  const now = deps.now();
  const row = deps.db
    .insert(materialLots)
    .values({
      materialId,
      lotNumber: input.lotNumber,
      quantityOnHand: input.quantityOnHand,
      receivedOn: input.receivedOn ?? null,
      expiresOn: input.expiresOn ?? null,
      createdAt: now,
      updatedAt: now,
    })
    .returning()
    .get();
  return toLotDto(row, todayOf(now));
}

function checkLotDates(input: { receivedOn?: string | null; expiresOn?: string | null }) {
  if (input.receivedOn && input.expiresOn && input.expiresOn < input.receivedOn) {
    throw badRequest("The expiry date is before the received date", { expiresOn: "Before the received date" });
  }
}

function findLot(deps: AppDeps, materialId: number, lotId: number): LotRow {
  findMaterial(deps, materialId);
  const lot = deps.db
    .select()
    .from(materialLots)
    .where(and(eq(materialLots.id, lotId), eq(materialLots.materialId, materialId)))
    .get();
  if (!lot) throw notFound("Lot");
  return lot;
}

/** A stock count correction or a date fix. */
export function updateLot(deps: AppDeps, actorId: string, materialId: number, lotId: number, input: z.output<typeof updateLotInputSchema>): LotDto {
  const lot = findLot(deps, materialId, lotId);
  checkLotDates({ receivedOn: input.receivedOn !== undefined ? input.receivedOn : lot.receivedOn, expiresOn: input.expiresOn !== undefined ? input.expiresOn : lot.expiresOn });
  const { version, ...fields } = input;
  const set: Partial<LotRow> = {};
  for (const [k, v] of Object.entries(fields)) if (v !== undefined) (set as Record<string, unknown>)[k] = v;
  const now = deps.now();
  const current = () => toLotDto(deps.db.select().from(materialLots).where(eq(materialLots.id, lotId)).get()!, todayOf(now));
  updateAtVersion(deps.db, materialLots, { id: lotId, version, actorId, what: "lot" }, { ...set, updatedAt: now }, current);
  return current();
}

/** Mix-sheet lines keep the lot number they copied, so a used lot may still be removed (e.g. when empty). */
export function deleteLot(deps: AppDeps, materialId: number, lotId: number) {
  findLot(deps, materialId, lotId);
  deps.db.delete(materialLots).where(eq(materialLots.id, lotId)).run();
}
