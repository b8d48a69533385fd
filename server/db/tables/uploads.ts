import { index, integer, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { jobs, users } from "./core";
import { createdAt, editVersion } from "./columns";
import { PANEL_LIGHTS } from "../../../shared/domain/spray-setup";

/**
 * Every uploaded file (data sheets, safety sheets, photos), stored under DATA_DIR/uploads by a random name.
 * `ownerType` + `ownerId` say what it belongs to; `jobId` is kept for access checks on job photos.
 */
export const uploads = sqliteTable(
  "uploads",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    ownerType: text("owner_type", { enum: ["material", "job", "job_item", "prep_record", "coat_log", "panel", "inspection_item"] }).notNull(),
    ownerId: integer("owner_id").notNull(),
    jobId: integer("job_id").references(() => jobs.id, { onDelete: "cascade" }),
    /** tds = technical data sheet, sds = safety data sheet, photo. */
    kind: text("kind", { enum: ["tds", "sds", "photo"] }).notNull(),
    mime: text("mime").notNull(),
    size: integer("size").notNull(),
    originalName: text("original_name").notNull(),
    storedName: text("stored_name").notNull(),
    thumbName: text("thumb_name"),
    width: integer("width"),
    height: integer("height"),
    caption: text("caption"),
    /** Staff mark a job photo as one the customer may see. */
    shareable: integer("shareable", { mode: "boolean" }).notNull().default(false),
    /** The light a panel photo was taken under. */
    light: text("light", { enum: PANEL_LIGHTS }),
    uploadedBy: text("uploaded_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    /** When the photo was taken, if it was sent later from a tablet's offline queue (null: when it was received). */
    takenAt: integer("taken_at"),
    ...editVersion(),
  },
  (t) => [index("uploads_owner_idx").on(t.ownerType, t.ownerId), index("uploads_job_idx").on(t.jobId)],
);
