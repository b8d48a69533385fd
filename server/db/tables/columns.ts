import { sql } from "drizzle-orm";
import { integer, real, text } from "drizzle-orm/sqlite-core";
import { LENGTH_UNITS, PRESSURE_UNITS } from "../../../shared/domain/spray-setup";

/** Times are integer epoch milliseconds; the API sends ISO strings. */
export const createdAt = () => integer("created_at", { mode: "number" }).notNull().default(sql`(unixepoch('subsec') * 1000)`);
export const updatedAt = () => integer("updated_at", { mode: "number" }).notNull().default(sql`(unixepoch('subsec') * 1000)`);

/** How a coat or a panel was sprayed (shared/domain/spray-setup.ts), but the gun; figures as entered, with their units. */
export const spraySetupColumns = () => ({
  tipMm: real("tip_mm"),
  inletPressure: real("inlet_pressure"),
  pressureUnit: text("pressure_unit", { enum: PRESSURE_UNITS }),
  distance: real("distance"),
  fanWidth: real("fan_width"),
  distanceUnit: text("distance_unit", { enum: LENGTH_UNITS }),
  overlapPct: real("overlap_pct"),
});

/**
 * Edits under optimistic concurrency: `version` starts at 1 and goes up by one with every edit, and an edit must
 * name the version it read (a stale one is refused with 409 version_conflict). `updatedBy` says whose edit it was.
 */
export const editVersion = () => ({
  version: integer("version").notNull().default(1),
  updatedBy: text("updated_by"),
});
