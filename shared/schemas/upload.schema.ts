import { z } from "zod";
import { idSchema, madeAtSchema, optionalText, versionSchema } from "./common.schema";
import { PANEL_LIGHTS, type PanelLight } from "../domain/spray-setup";

/** What an upload belongs to. Photos go on jobs, items, prep records, coat logs, test panels and inspected items; data sheets on materials. */
export const UPLOAD_OWNER_TYPES = ["job", "job_item", "prep_record", "coat_log", "panel", "inspection_item", "material"] as const;
export type UploadOwnerType = (typeof UPLOAD_OWNER_TYPES)[number];
export const PHOTO_OWNER_TYPES = ["job", "job_item", "prep_record", "coat_log", "panel", "inspection_item"] as const satisfies readonly UploadOwnerType[];

export const UPLOAD_KINDS = ["photo", "tds", "sds"] as const;
export type UploadKind = (typeof UPLOAD_KINDS)[number];

export { MAX_PHOTO_MB } from "../domain/photo-limits";

/** Multipart fields arrive as strings: "true"/"false"/"on" → boolean. */
const formBoolean = z.preprocess((v) => (v === "true" || v === "on" || v === "1" ? true : v === "false" || v === "0" || v === "" ? false : v), z.boolean({ error: "Must be true or false" }));

/** Photos only: data sheets are added on the material's own page (/api/materials/:id/files). */
export const createUploadFieldsSchema = z.object({
  ownerType: z.enum(PHOTO_OWNER_TYPES, { error: `ownerType must be one of: ${PHOTO_OWNER_TYPES.join(", ")}` }),
  ownerId: idSchema,
  caption: optionalText(200, "Caption"),
  shareable: formBoolean.optional(),
  /** A test panel's photo: the light it was taken under. */
  light: z.preprocess((v) => (v === "" ? undefined : v), z.enum(PANEL_LIGHTS, { error: `light must be one of: ${PANEL_LIGHTS.join(", ")}` }).optional()),
  /** When the photo was taken, from a tablet that was offline (not in the future, not before the job); default: now. */
  at: z.preprocess((v) => (v === "" ? undefined : v), madeAtSchema),
});
export type CreateUploadFields = z.input<typeof createUploadFieldsSchema>;

export const listUploadsQuerySchema = z
  .object({
    jobId: idSchema.optional(),
    ownerType: z.enum(UPLOAD_OWNER_TYPES, { error: `ownerType must be one of: ${UPLOAD_OWNER_TYPES.join(", ")}` }).optional(),
    ownerId: idSchema.optional(),
  })
  .refine((q) => q.jobId !== undefined || (q.ownerType !== undefined && q.ownerId !== undefined), {
    path: ["jobId"],
    message: "Give jobId, or ownerType with ownerId",
  });
export type ListUploadsQuery = z.infer<typeof listUploadsQuerySchema>;

export const updateUploadInputSchema = z
  .object({
    shareable: z.boolean({ error: "shareable must be true or false" }).optional(),
    caption: optionalText(200, "Caption"),
    light: z.enum(PANEL_LIGHTS, { error: `light must be one of: ${PANEL_LIGHTS.join(", ")}` }).nullable().optional(),
    version: versionSchema,
  })
  .refine((v) => v.shareable !== undefined || v.caption !== undefined || v.light !== undefined, { path: ["shareable"], message: "Nothing to change" });
export type UpdateUploadInput = z.input<typeof updateUploadInputSchema>;

export type UploadDto = {
  /** The edit version: goes up with every change; an edit sends the one it read. */
  version: number;
  id: number;
  ownerType: UploadOwnerType;
  ownerId: number;
  jobId: number | null;
  kind: UploadKind;
  mime: string;
  /** Bytes. */
  size: number;
  originalName: string;
  width: number | null;
  height: number | null;
  caption: string | null;
  shareable: boolean;
  /** For a test panel's photo: the light it was taken under. */
  light: PanelLight | null;
  uploadedById: string | null;
  uploadedByName: string | null;
  /** When it was received. */
  createdAt: string;
  /** When it was taken (a photo taken offline arrives later); the time received for anything sent straight away. */
  takenAt: string;
  /** Same-origin addresses of the file and its thumbnail (null for documents). */
  url: string;
  thumbUrl: string | null;
};
