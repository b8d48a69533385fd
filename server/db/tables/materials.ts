import { index, integer, real, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { MATERIAL_CATEGORIES, PURCHASE_UNITS } from "../../../shared/domain/materials";
import { createdAt, updatedAt, editVersion } from "./columns";

/** The shop's catalogue. Money is integer cents per purchase unit. */
export const materials = sqliteTable(
  "materials",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    /** The shop's own code, e.g. "S5-B02". */
    code: text("code").notNull(),
    name: text("name").notNull(),
    category: text("category", { enum: MATERIAL_CATEGORIES }).notNull(),
    purchaseUnit: text("purchase_unit", { enum: PURCHASE_UNITS }).notNull(),
    costCents: integer("cost_cents").notNull(),
    volumeSolidsPct: real("volume_solids_pct"),
    /** Regulatory VOC, g/L less water and exempt compounds. */
    vocGPerL: real("voc_g_per_l"),
    /** Percent by volume of water and exempt compounds (for the mixed-batch VOC). */
    waterExemptPct: real("water_exempt_pct").notNull().default(0),
    densityGPerMl: real("density_g_per_ml"),
    potLifeMinutes: integer("pot_life_minutes"),
    /** Data-sheet timing: how long a mixed batch stands before spraying (induction), minutes. */
    inductionMinutes: integer("induction_minutes"),
    /** Data-sheet recoat window: the next layer goes on no sooner than min and no later than max minutes after the last coat. */
    recoatMinMinutes: integer("recoat_min_minutes"),
    recoatMaxMinutes: integer("recoat_max_minutes"),
    containsIsocyanates: integer("contains_isocyanates", { mode: "boolean" }).notNull().default(false),
    flammable: integer("flammable", { mode: "boolean" }).notNull().default(false),
    /** Low-stock threshold in the purchase unit. */
    lowStockThreshold: real("low_stock_threshold"),
    notes: text("notes"),
    active: integer("active", { mode: "boolean" }).notNull().default(true),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ...editVersion(),
  },
  (t) => [uniqueIndex("materials_code_idx").on(t.code), index("materials_category_idx").on(t.category)],
);

/** Stock by lot, in the material's purchase unit. */
export const materialLots = sqliteTable(
  "material_lots",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    materialId: integer("material_id")
      .notNull()
      .references(() => materials.id, { onDelete: "cascade" }),
    lotNumber: text("lot_number").notNull(),
    quantityOnHand: real("quantity_on_hand").notNull(),
    receivedOn: text("received_on"),
    expiresOn: text("expires_on"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ...editVersion(),
  },
  (t) => [index("material_lots_material_idx").on(t.materialId)],
);
