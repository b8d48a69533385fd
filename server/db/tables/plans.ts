import { index, integer, real, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { LAYER_KINDS } from "../../../shared/domain/layers";
import { jobs, users } from "./core";
import { materials } from "./materials";
import { createdAt, updatedAt, editVersion } from "./columns";

/**
 * A finish plan: a job's layer stack, or a reusable template (jobId null).
 * Its content lives in versions; a version used at the booth is frozen and never changes again.
 */
export const plans = sqliteTable(
  "plans",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    name: text("name").notNull(),
    description: text("description"),
    jobId: integer("job_id").references(() => jobs.id, { onDelete: "cascade" }),
    isTemplate: integer("is_template", { mode: "boolean" }).notNull().default(false),
    /** The plan this one was started from (a template, or an earlier job's plan). */
    copiedFromPlanId: integer("copied_from_plan_id"),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ...editVersion(),
  },
  (t) => [index("plans_job_idx").on(t.jobId), index("plans_template_idx").on(t.isTemplate)],
);

export const planVersions = sqliteTable(
  "plan_versions",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    planId: integer("plan_id")
      .notNull()
      .references(() => plans.id, { onDelete: "cascade" }),
    version: integer("version").notNull(),
    /** Set when the version is first used at the booth (a mix sheet recorded or a coat logged). */
    frozenAt: integer("frozen_at"),
    note: text("note"),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("plan_versions_plan_version_idx").on(t.planId, t.version)],
);

export const planLayers = sqliteTable(
  "plan_layers",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    versionId: integer("version_id")
      .notNull()
      .references(() => planVersions.id, { onDelete: "cascade" }),
    position: integer("position").notNull(),
    kind: text("kind", { enum: LAYER_KINDS }).notNull(),
    name: text("name").notNull(),
    coats: real("coats").notNull(),
    flashMinutes: real("flash_minutes").notNull().default(0),
    /** Spraying time of one coat, for the timeline. */
    minutesPerCoat: real("minutes_per_coat").notNull().default(5),
    dryMinutes: real("dry_minutes").notNull().default(0),
    /** How long a mixed batch of this layer stands before spraying, minutes (from the data sheets when the plan is saved). */
    inductionMinutes: real("induction_minutes"),
    /** The window for the next layer over this one, minutes after its last coat (from the data sheets when not given). */
    recoatMinMinutes: real("recoat_min_minutes"),
    recoatMaxMinutes: real("recoat_max_minutes"),
    gunTip: text("gun_tip"),
    pressurePsi: real("pressure_psi"),
    overlapPct: real("overlap_pct"),
    dryFilmPerCoat: real("dry_film_per_coat"),
    dryFilmUnit: text("dry_film_unit", { enum: ["um", "mil"] }).notNull().default("um"),
    transferEfficiencyPct: real("transfer_efficiency_pct").notNull().default(65),
    notes: text("notes"),
  },
  (t) => [index("plan_layers_version_idx").on(t.versionId, t.position)],
);

/** One component of a layer's mix: a catalogue material with parts, or a percent of other components (by label). */
export const layerComponents = sqliteTable(
  "layer_components",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    layerId: integer("layer_id")
      .notNull()
      .references(() => planLayers.id, { onDelete: "cascade" }),
    position: integer("position").notNull(),
    materialId: integer("material_id")
      .notNull()
      .references(() => materials.id, { onDelete: "restrict" }),
    /** The name the mix uses, unique in the layer (e.g. "clear", "hardener"). */
    label: text("label").notNull(),
    parts: real("parts"),
    percent: real("percent"),
    /** Labels of the components the percent is taken of. */
    percentOf: text("percent_of", { mode: "json" }).$type<string[]>(),
  },
  (t) => [index("layer_components_layer_idx").on(t.layerId, t.position)],
);
