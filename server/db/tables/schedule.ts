import { index, integer, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { jobs, users } from "./core";
import { planLayers } from "./plans";
import { createdAt, editVersion, updatedAt } from "./columns";

/** The shop's spray booths, with what the schedule needs to know about each. */
export const booths = sqliteTable(
  "booths",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    name: text("name").notNull(),
    /** Masking, mixing and gun set-up before a layer's first coat. */
    setupMinutes: integer("setup_minutes").notNull().default(20),
    /** Whether parts may leave this booth to cure; if not, each layer's dry time is spent in the booth. */
    canCureOutside: integer("can_cure_outside", { mode: "boolean" }).notNull().default(false),
    opensAtMinute: integer("opens_at_minute").notNull().default(7 * 60),
    closesAtMinute: integer("closes_at_minute").notNull().default(17 * 60),
    /** Days worked, as a list of 0 (Sunday) … 6 (Saturday), stored as JSON. */
    workDays: text("work_days", { mode: "json" }).$type<number[]>().notNull(),
    timeZone: text("time_zone").notNull(),
    active: integer("active", { mode: "boolean" }).notNull().default(true),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ...editVersion(),
  },
  (t) => [uniqueIndex("booths_name_idx").on(t.name)],
);

/** One layer of a job booked into a booth. */
export const scheduleSessions = sqliteTable(
  "schedule_sessions",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    boothId: integer("booth_id")
      .notNull()
      .references(() => booths.id, { onDelete: "restrict" }),
    jobId: integer("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "cascade" }),
    layerId: integer("layer_id")
      .notNull()
      .references(() => planLayers.id, { onDelete: "cascade" }),
    startsAt: integer("starts_at").notNull(),
    endsAt: integer("ends_at").notNull(),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ...editVersion(),
  },
  (t) => [index("schedule_sessions_time_idx").on(t.startsAt), index("schedule_sessions_booth_idx").on(t.boothId, t.startsAt), uniqueIndex("schedule_sessions_layer_idx").on(t.layerId)],
);

/** When a job's prep is planned to be signed off, so booth time is not booked before it. */
export const prepPlans = sqliteTable("prep_plans", {
  jobId: integer("job_id")
    .primaryKey()
    .references(() => jobs.id, { onDelete: "cascade" }),
  readyAt: integer("ready_at").notNull(),
  updatedBy: text("updated_by").references(() => users.id, { onDelete: "set null" }),
  updatedAt: updatedAt(),
});
