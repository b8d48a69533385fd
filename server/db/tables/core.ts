import { sql } from "drizzle-orm";
import { index, integer, real, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { ROLES } from "../../../shared/domain/roles";
import { STAGES } from "../../../shared/domain/stages";
import { AREA_UNITS, SUBSTRATES } from "../../../shared/domain/substrates";
import { createdAt, updatedAt, editVersion } from "./columns";


export const customers = sqliteTable(
  "customers",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    name: text("name").notNull(),
    email: text("email"),
    phone: text("phone"),
    address: text("address"),
    notes: text("notes"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ...editVersion(),
  },
  (t) => [index("customers_name_idx").on(t.name)],
);

export const users = sqliteTable(
  "users",
  {
    id: text("id").primaryKey(),
    email: text("email").notNull(),
    name: text("name").notNull(),
    role: text("role", { enum: ROLES }).notNull(),
    customerId: integer("customer_id").references(() => customers.id, { onDelete: "restrict" }),
    passwordHash: text("password_hash").notNull(),
    active: integer("active", { mode: "boolean" }).notNull().default(true),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ...editVersion(),
  },
  (t) => [uniqueIndex("users_email_idx").on(t.email), index("users_role_idx").on(t.role)],
);

export const sessions = sqliteTable(
  "sessions",
  {
    id: text("id").primaryKey(),
    userId: text("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    expiresAt: integer("expires_at").notNull(),
  },
  (t) => [index("sessions_user_idx").on(t.userId)],
);

/** One-time password reset tokens; only a SHA-256 of the token is stored. */
export const passwordResetTokens = sqliteTable("password_reset_tokens", {
  tokenHash: text("token_hash").primaryKey(),
  userId: text("user_id")
    .notNull()
    .references(() => users.id, { onDelete: "cascade" }),
  expiresAt: integer("expires_at").notNull(),
  usedAt: integer("used_at"),
  createdAt: createdAt(),
});

export const jobs = sqliteTable(
  "jobs",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    customerId: integer("customer_id")
      .notNull()
      .references(() => customers.id, { onDelete: "restrict" }),
    title: text("title").notNull(),
    stage: text("stage", { enum: STAGES }).notNull().default("inquiry"),
    dueDate: text("due_date"),
    assignedPainterId: text("assigned_painter_id").references(() => users.id, { onDelete: "set null" }),
    notes: text("notes"),
    /** The finish-plan version this job was (or is being) sprayed with; set when the version is first used. */
    sprayedPlanVersionId: integer("sprayed_plan_version_id"),
    /** The test panel the customer agreed as the job's colour (test_panels.id; no FK, the panels table comes later). */
    approvedPanelId: integer("approved_panel_id"),
    stageChangedAt: integer("stage_changed_at").notNull().default(sql`(unixepoch('subsec') * 1000)`),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ...editVersion(),
  },
  (t) => [
    index("jobs_customer_idx").on(t.customerId),
    index("jobs_stage_due_idx").on(t.stage, t.dueDate),
    index("jobs_painter_idx").on(t.assignedPainterId),
    index("jobs_due_idx").on(t.dueDate),
    index("jobs_updated_idx").on(t.updatedAt),
  ],
);

export const jobItems = sqliteTable(
  "job_items",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    jobId: integer("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    substrate: text("substrate", { enum: SUBSTRATES }).notNull(),
    surfaceArea: real("surface_area").notNull(),
    areaUnit: text("area_unit", { enum: AREA_UNITS }).notNull(),
    notes: text("notes"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ...editVersion(),
  },
  (t) => [index("job_items_job_idx").on(t.jobId)],
);

/** Every stage move, with who made it and when. Append-only. */
export const jobStageEvents = sqliteTable(
  "job_stage_events",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    jobId: integer("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "cascade" }),
    fromStage: text("from_stage", { enum: STAGES }),
    toStage: text("to_stage", { enum: STAGES }).notNull(),
    note: text("note"),
    userId: text("user_id").references(() => users.id, { onDelete: "set null" }),
    /** Who made the move when no user did: a customer's online payment, or the server itself. */
    via: text("via", { enum: ["user", "payment", "system"] }).notNull().default("user"),
    at: integer("at").notNull(),
  },
  (t) => [index("job_stage_events_job_idx").on(t.jobId, t.at), index("job_stage_events_to_stage_idx").on(t.toStage, t.at)],
);
