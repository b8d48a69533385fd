import { index, integer, real, sqliteTable, text, uniqueIndex, type AnySQLiteColumn } from "drizzle-orm/sqlite-core";
import { SUBSTRATES } from "../../../shared/domain/substrates";
import { SCUFF_MEDIA } from "../../../shared/domain/prep";
import { TEMP_UNITS } from "../../../shared/domain/booth";
import { SOLVENT_PURPOSES } from "../../../shared/domain/materials";
import { jobItems, jobs, users } from "./core";
import { materials } from "./materials";
import { planLayers, planVersions } from "./plans";
import { mixSheets } from "./mix-sheets";
import { createdAt, spraySetupColumns, updatedAt, editVersion } from "./columns";
import { guns } from "./equipment";
import { ILLUMINANTS, PANEL_LIGHTS } from "../../../shared/domain/spray-setup";

/**
 * Prep of one job item before it goes in the booth: one record per item. Editable until signed off;
 * after sign-off only the office can reopen it (with a note).
 */
export const prepRecords = sqliteTable(
  "prep_records",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    jobId: integer("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "cascade" }),
    itemId: integer("item_id")
      .notNull()
      .references(() => jobItems.id, { onDelete: "cascade" }),
    /** The item's substrate when the prep was done. */
    substrate: text("substrate", { enum: SUBSTRATES }).notNull(),
    scuffMedium: text("scuff_medium", { enum: SCUFF_MEDIA }),
    scuffGrit: integer("scuff_grit"),
    cleaner: text("cleaner"),
    tackCloth: integer("tack_cloth", { mode: "boolean" }).notNull().default(false),
    adhesionPromoter: integer("adhesion_promoter", { mode: "boolean" }).notNull().default(false),
    adhesionPromoterProduct: text("adhesion_promoter_product"),
    notes: text("notes"),
    /** Who last recorded prep steps, and when. */
    preparedBy: text("prepared_by").references(() => users.id, { onDelete: "set null" }),
    preparedAt: integer("prepared_at").notNull(),
    signedOffBy: text("signed_off_by").references(() => users.id, { onDelete: "set null" }),
    signedOffAt: integer("signed_off_at"),
    /** Why a sign-off was taken back (kept so the history shows it). */
    reopenedNote: text("reopened_note"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ...editVersion(),
  },
  (t) => [uniqueIndex("prep_records_item_idx").on(t.itemId), index("prep_records_job_idx").on(t.jobId)],
);

/**
 * Coats sprayed at the booth. Append-only: a mistake is fixed by a new row naming the row it corrects
 * (correctsId) with a reason; `voids` says the coat did not happen.
 */
export const coatLogs = sqliteTable(
  "coat_logs",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    jobId: integer("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "cascade" }),
    planVersionId: integer("plan_version_id")
      .notNull()
      .references(() => planVersions.id, { onDelete: "restrict" }),
    layerId: integer("layer_id")
      .notNull()
      .references(() => planLayers.id, { onDelete: "restrict" }),
    coatNumber: integer("coat_number").notNull(),
    /** When the coat was sprayed (server time of the tap, or the corrected time). */
    at: integer("at").notNull(),
    painterId: text("painter_id").references(() => users.id, { onDelete: "set null" }),
    /** As entered, with its unit. */
    boothTemp: real("booth_temp"),
    tempUnit: text("temp_unit", { enum: TEMP_UNITS }),
    humidityPct: real("humidity_pct"),
    note: text("note"),
    /** The open batch when the coat was logged. */
    mixSheetId: integer("mix_sheet_id").references(() => mixSheets.id, { onDelete: "set null" }),
    /** Given when the first coat went on before every item's prep was signed off. */
    prepOverrideReason: text("prep_override_reason"),
    /** Given when the coat went on against a timing rule (flash, dry, recoat window, induction, no batch); the rules broken beside it. */
    timingOverrideReason: text("timing_override_reason"),
    /** The owner's reason for spraying a layer that a change order waiting for the customer would alter. */
    changeOverrideReason: text("change_override_reason"),
    timingBreaches: text("timing_breaches", { mode: "json" }).$type<{ rule: string; message: string }[]>(),
    gunId: integer("gun_id").references(() => guns.id, { onDelete: "set null" }),
    ...spraySetupColumns(),
    correctsId: integer("corrects_id").references((): AnySQLiteColumn => coatLogs.id, { onDelete: "restrict" }),
    correctionReason: text("correction_reason"),
    voids: integer("voids", { mode: "boolean" }).notNull().default(false),
    createdAt: createdAt(),
  },
  (t) => [
    index("coat_logs_job_idx").on(t.jobId, t.at),
    index("coat_logs_layer_idx").on(t.layerId),
    index("coat_logs_corrects_idx").on(t.correctsId),
    index("coat_logs_created_idx").on(t.createdAt),
    // Dashboard: booth hours over a date window.
    index("coat_logs_at_idx").on(t.at),
  ],
);

/** Sprayed test panels: how each was made, optional colour-meter reading (CIELAB). Photos are uploads (owner "panel"). */
export const testPanels = sqliteTable(
  "test_panels",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    groundName: text("ground_name").notNull(),
    groundMaterialId: integer("ground_material_id").references(() => materials.id, { onDelete: "set null" }),
    candyName: text("candy_name").notNull(),
    candyMaterialId: integer("candy_material_id").references(() => materials.id, { onDelete: "set null" }),
    letDownClear: real("let_down_clear").notNull(),
    letDownToner: real("let_down_toner").notNull(),
    coats: integer("coats").notNull(),
    jobId: integer("job_id").references(() => jobs.id, { onDelete: "set null" }),
    planLayerId: integer("plan_layer_id").references(() => planLayers.id, { onDelete: "set null" }),
    mixSheetId: integer("mix_sheet_id").references(() => mixSheets.id, { onDelete: "set null" }),
    labL: real("lab_l"),
    labA: real("lab_a"),
    labB: real("lab_b"),
    sprayedOn: text("sprayed_on"),
    notes: text("notes"),
    gunId: integer("gun_id").references(() => guns.id, { onDelete: "set null" }),
    ...spraySetupColumns(),
    boothTemp: real("booth_temp"),
    tempUnit: text("temp_unit", { enum: TEMP_UNITS }),
    humidityPct: real("humidity_pct"),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ...editVersion(),
  },
  (t) => [
    index("test_panels_ground_candy_idx").on(t.groundName, t.candyName, t.coats),
    index("test_panels_candy_idx").on(t.candyName),
    index("test_panels_job_idx").on(t.jobId),
  ],
);

/** Colour-meter readings of a panel under other lights than the main (daylight) one, each with its illuminant. */
export const panelReadings = sqliteTable(
  "panel_readings",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    panelId: integer("panel_id")
      .notNull()
      .references(() => testPanels.id, { onDelete: "cascade" }),
    light: text("light", { enum: PANEL_LIGHTS }).notNull(),
    illuminant: text("illuminant", { enum: ILLUMINANTS }).notNull(),
    labL: real("lab_l").notNull(),
    labA: real("lab_a").notNull(),
    labB: real("lab_b").notNull(),
  },
  (t) => [uniqueIndex("panel_readings_panel_light_idx").on(t.panelId, t.light)],
);

/**
 * Prep and cleaning solvent used outside a mixed batch (wax and grease remover, gun wash): counted in the VOC log.
 * Append-only; the VOC figures are copied from the catalogue when logged, like a batch's lines.
 */
export const solventUses = sqliteTable(
  "solvent_uses",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    materialId: integer("material_id")
      .notNull()
      .references(() => materials.id, { onDelete: "restrict" }),
    jobId: integer("job_id").references(() => jobs.id, { onDelete: "set null" }),
    purpose: text("purpose", { enum: SOLVENT_PURPOSES }).notNull(),
    /** As entered, and in mL. */
    amount: real("amount").notNull(),
    unit: text("unit").notNull(),
    volumeMl: real("volume_ml").notNull(),
    vocGPerL: real("voc_g_per_l"),
    waterExemptPct: real("water_exempt_pct").notNull().default(0),
    note: text("note"),
    usedAt: integer("used_at").notNull(),
    loggedBy: text("logged_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [index("solvent_uses_used_idx").on(t.usedAt), index("solvent_uses_job_idx").on(t.jobId)],
);
