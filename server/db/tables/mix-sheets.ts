import { index, integer, real, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { jobs, users } from "./core";
import { materialLots, materials } from "./materials";
import { planLayers, planVersions } from "./plans";
import { createdAt } from "./columns";

/**
 * A batch for one layer. A draft can be changed; once recorded as mixed it is never edited, only voided
 * with a reason. Material figures are copied onto the lines when mixed, so the record keeps what was true then.
 */
export const mixSheets = sqliteTable(
  "mix_sheets",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    jobId: integer("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "restrict" }),
    planVersionId: integer("plan_version_id")
      .notNull()
      .references(() => planVersions.id, { onDelete: "restrict" }),
    layerId: integer("layer_id")
      .notNull()
      .references(() => planLayers.id, { onDelete: "restrict" }),
    status: text("status", { enum: ["draft", "mixed", "void"] }).notNull().default("draft"),
    /** "total": make `amount`; "component": `amount` of `knownLabel` is on hand. */
    mode: text("mode", { enum: ["total", "component"] }).notNull(),
    amount: real("amount").notNull(),
    unit: text("unit").notNull(),
    knownLabel: text("known_label"),
    weigh: integer("weigh", { mode: "boolean" }).notNull().default(false),
    roundingStep: real("rounding_step"),
    roundingUnit: text("rounding_unit"),
    totalMl: real("total_ml").notNull(),
    /** Mixed VOC of the batch, g/L less water and exempt (from the lines' figures). */
    vocGPerL: real("voc_g_per_l"),
    potLifeMinutes: integer("pot_life_minutes"),
    mixedAt: integer("mixed_at"),
    mixedBy: text("mixed_by").references(() => users.id, { onDelete: "set null" }),
    voidedAt: integer("voided_at"),
    voidedBy: text("voided_by").references(() => users.id, { onDelete: "set null" }),
    voidReason: text("void_reason"),
    /** Set when the customer approved a change order that moved the job to a later plan version. */
    supersededAt: integer("superseded_at"),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [
    index("mix_sheets_job_idx").on(t.jobId, t.createdAt),
    index("mix_sheets_layer_idx").on(t.layerId),
    index("mix_sheets_status_mixed_idx").on(t.status, t.mixedAt),
  ],
);

export const mixSheetLines = sqliteTable(
  "mix_sheet_lines",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    mixSheetId: integer("mix_sheet_id")
      .notNull()
      .references(() => mixSheets.id, { onDelete: "cascade" }),
    position: integer("position").notNull(),
    materialId: integer("material_id")
      .notNull()
      .references(() => materials.id, { onDelete: "restrict" }),
    label: text("label").notNull(),
    /** Computed amount, mL. */
    plannedMl: real("planned_ml").notNull(),
    /** What was really poured, mL (set when mixed). */
    actualMl: real("actual_ml"),
    lotId: integer("lot_id").references(() => materialLots.id, { onDelete: "set null" }),
    lotNumber: text("lot_number"),
    vocGPerL: real("voc_g_per_l"),
    waterExemptPct: real("water_exempt_pct"),
    densityGPerMl: real("density_g_per_ml"),
    /** Cost of what was used, integer cents (money: never shown to painters). */
    costCents: integer("cost_cents"),
  },
  (t) => [index("mix_sheet_lines_sheet_idx").on(t.mixSheetId), index("mix_sheet_lines_material_idx").on(t.materialId)],
);
