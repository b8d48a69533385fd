import { index, integer, real, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { AREA_UNITS } from "../../../shared/domain/substrates";
import { EXISTING_FINISHES, FINDING_LEVELS, SOLVENT_TEST_RESULTS } from "../../../shared/domain/intake";
import { PANEL_SIGN_OFF_STATUSES } from "../../../shared/domain/colour-sign-off";
import { jobItems, jobs, users } from "./core";
import { testPanels } from "./booth";
import { uploads } from "./uploads";
import { createdAt, editVersion, updatedAt } from "./columns";

/** The intake inspection of a job before it is quoted: one per job. */
export const inspections = sqliteTable(
  "inspections",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    jobId: integer("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "cascade" }),
    /** Words the customer reads beside the quote. */
    customerSummary: text("customer_summary"),
    /** The shop's own notes; never shown to the customer. */
    notes: text("notes"),
    inspectedBy: text("inspected_by").references(() => users.id, { onDelete: "set null" }),
    inspectedAt: integer("inspected_at").notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ...editVersion(),
  },
  (t) => [uniqueIndex("inspections_job_idx").on(t.jobId)],
);

const level = (name: string) => text(name, { enum: FINDING_LEVELS }).notNull().default("none");

/** One item's condition at intake. Photos are uploads (owner "inspection_item"). */
export const inspectionItems = sqliteTable(
  "inspection_items",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    inspectionId: integer("inspection_id")
      .notNull()
      .references(() => inspections.id, { onDelete: "cascade" }),
    jobId: integer("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "cascade" }),
    itemId: integer("item_id")
      .notNull()
      .references(() => jobItems.id, { onDelete: "cascade" }),
    existingFinish: text("existing_finish", { enum: EXISTING_FINISHES }).notNull(),
    dents: level("dents"),
    cracks: level("cracks"),
    pinholes: level("pinholes"),
    stressCracks: level("stress_cracks"),
    rust: level("rust"),
    earlierRepairs: level("earlier_repairs"),
    hardwareToRemove: text("hardware_to_remove"),
    measuredArea: real("measured_area"),
    areaUnit: text("area_unit", { enum: AREA_UNITS }),
    solventTest: text("solvent_test", { enum: SOLVENT_TEST_RESULTS }).notNull().default("not_done"),
    /** The shop's own note on the item. */
    note: text("note"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ...editVersion(),
  },
  (t) => [uniqueIndex("inspection_items_item_idx").on(t.itemId), index("inspection_items_job_idx").on(t.jobId)],
);

/**
 * A test panel sent to the customer to approve as the job's colour. What was sent is kept as sent (label, let-down,
 * coats, photo, ΔE00 to the target), so a later change to the panel does not change what the customer agreed to.
 */
export const panelSignOffs = sqliteTable(
  "panel_sign_offs",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    jobId: integer("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "cascade" }),
    panelId: integer("panel_id")
      .notNull()
      .references(() => testPanels.id, { onDelete: "restrict" }),
    status: text("status", { enum: PANEL_SIGN_OFF_STATUSES }).notNull().default("waiting"),
    label: text("label").notNull(),
    letDownClear: real("let_down_clear").notNull(),
    letDownToner: real("let_down_toner").notNull(),
    coats: integer("coats").notNull(),
    photoId: integer("photo_id").references(() => uploads.id, { onDelete: "set null" }),
    targetLabel: text("target_label"),
    deltaE: real("delta_e"),
    message: text("message"),
    sentTo: text("sent_to").notNull(),
    sentBy: text("sent_by").references(() => users.id, { onDelete: "set null" }),
    sentAt: integer("sent_at").notNull(),
    decidedAt: integer("decided_at"),
    decidedVia: text("decided_via", { enum: ["account", "link"] }),
    decidedBy: text("decided_by").references(() => users.id, { onDelete: "set null" }),
    decidedAddress: text("decided_address"),
    decisionName: text("decision_name"),
    decisionNote: text("decision_note"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ...editVersion(),
  },
  (t) => [index("panel_sign_offs_job_idx").on(t.jobId, t.status), index("panel_sign_offs_panel_idx").on(t.panelId)],
);
