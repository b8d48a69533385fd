import { atVersion, nextVersion, staleEdit } from "../../db/edit-version";
import { and, asc, eq, inArray, type SQL } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import type { Actor } from "../../auth/session";
import { coatLogs, inspectionItems, jobItems, jobs, materials, prepRecords, testPanels, uploads, users } from "../../db/schema";
import { badRequest, forbidden, HttpError, notFound } from "../../http/http-error";
import { iso } from "../../http/dates";
import { madeAt } from "../../http/made-at";
import { findJobFor } from "../jobs/jobs.access";
import { keepStored, readStored, removeStored, storeFile } from "./storage";
import {
  MAX_PHOTO_MB,
  type ListUploadsQuery,
  type UploadDto,
  type UploadOwnerType,
} from "../../../shared/schemas/upload.schema";
import type { z } from "zod";
import type { createUploadFieldsSchema, updateUploadInputSchema } from "../../../shared/schemas/upload.schema";

type UploadRow = typeof uploads.$inferSelect;
const MB = 1024 * 1024;

/**
 * The job an owner record belongs to (null for the panel library and materials), after checking that the actor
 * may reach it: painters their assigned jobs, customers their own, the office everything. Outside reads as 404.
 * Test panels are the shop's shared library, so any staff member may look at a panel's photos (`read`); adding or
 * changing one (`write`) follows the panel's job like every other job photo.
 */
export function ownerJob(deps: AppDeps, actor: Actor, ownerType: UploadOwnerType, ownerId: number, mode: "read" | "write" = "read"): number | null {
  const missing = () => notFound(OWNER_NAMES[ownerType]);
  let jobId: number | null;
  switch (ownerType) {
    case "job":
      jobId = ownerId;
      break;
    case "job_item":
      jobId = deps.db.select({ jobId: jobItems.jobId }).from(jobItems).where(eq(jobItems.id, ownerId)).get()?.jobId ?? -1;
      break;
    case "prep_record":
      jobId = deps.db.select({ jobId: prepRecords.jobId }).from(prepRecords).where(eq(prepRecords.id, ownerId)).get()?.jobId ?? -1;
      break;
    case "coat_log":
      jobId = deps.db.select({ jobId: coatLogs.jobId }).from(coatLogs).where(eq(coatLogs.id, ownerId)).get()?.jobId ?? -1;
      break;
    case "inspection_item":
      jobId = deps.db.select({ jobId: inspectionItems.jobId }).from(inspectionItems).where(eq(inspectionItems.id, ownerId)).get()?.jobId ?? -1;
      break;
    case "panel": {
      const p = deps.db.select({ jobId: testPanels.jobId }).from(testPanels).where(eq(testPanels.id, ownerId)).get();
      if (!p) throw missing();
      jobId = p.jobId;
      break;
    }
    case "material": {
      const m = deps.db.select({ id: materials.id }).from(materials).where(eq(materials.id, ownerId)).get();
      if (!m) throw missing();
      jobId = null;
      break;
    }
  }
  if (jobId === -1) throw missing();
  if (ownerType === "panel" && actor.role !== "customer") {
    if (mode === "write") checkPanelPhotoWrite(deps, actor, jobId);
    return jobId;
  }
  if (jobId !== null) {
    try {
      findJobFor(deps, actor, jobId);
    } catch {
      throw missing();
    }
  } else if (actor.role === "customer") {
    throw missing();
  }
  return jobId;
}

/** A photo of a job's test panel is added or changed only by those who reach the job: its painter and the office. */
function checkPanelPhotoWrite(deps: AppDeps, actor: Actor, jobId: number | null) {
  if (jobId === null) return;
  try {
    findJobFor(deps, actor, jobId);
  } catch {
    throw forbidden("This test panel belongs to a job you are not assigned to; its photos are added and changed by the painter on that job or the office");
  }
}

const OWNER_NAMES: Record<UploadOwnerType, string> = {
  job: "Job",
  job_item: "Item",
  prep_record: "Prep record",
  coat_log: "Coat log",
  panel: "Test panel",
  inspection_item: "Inspected item",
  material: "Material",
};

export function toUploadDto(row: UploadRow & { uploadedByName?: string | null }): UploadDto {
  return {
    id: row.id,
    version: row.version,
    ownerType: row.ownerType,
    ownerId: row.ownerId,
    jobId: row.jobId,
    kind: row.kind,
    mime: row.mime,
    size: row.size,
    originalName: row.originalName,
    width: row.width,
    height: row.height,
    caption: row.caption,
    shareable: row.shareable,
    light: row.light,
    uploadedById: row.uploadedBy,
    uploadedByName: row.uploadedByName ?? null,
    createdAt: iso(row.createdAt),
    takenAt: iso(row.takenAt ?? row.createdAt),
    url: `/api/uploads/${row.id}`,
    thumbUrl: row.thumbName ? `/api/uploads/${row.id}/thumb` : null,
  };
}

function selectUploads(deps: AppDeps, where: SQL | undefined) {
  return deps.db
    .select({ u: uploads, uploadedByName: users.name })
    .from(uploads)
    .leftJoin(users, eq(uploads.uploadedBy, users.id))
    .where(where)
    .orderBy(asc(uploads.createdAt), asc(uploads.id))
    .all()
    .map((r) => toUploadDto({ ...r.u, uploadedByName: r.uploadedByName }));
}

/** Photos of several owners of one type at once (for lists), already filtered for a customer. */
export function photosOf(deps: AppDeps, actor: Actor, ownerType: UploadOwnerType, ownerIds: number[]): Map<number, UploadDto[]> {
  const out = new Map<number, UploadDto[]>();
  if (ownerIds.length === 0) return out;
  const filters: (SQL | undefined)[] = [eq(uploads.ownerType, ownerType), inArray(uploads.ownerId, ownerIds), eq(uploads.kind, "photo")];
  if (actor.role === "customer") filters.push(eq(uploads.shareable, true));
  for (const u of selectUploads(deps, and(...filters))) out.set(u.ownerId, [...(out.get(u.ownerId) ?? []), u]);
  return out;
}

export async function createUpload(
  deps: AppDeps,
  actor: Actor,
  fields: z.output<typeof createUploadFieldsSchema>,
  file: Express.Multer.File | undefined,
  /** Wraps the database write (the route stores an Idempotency-Key's answer in the same transaction). */
  within: (write: () => UploadDto) => UploadDto = (write) => write(),
): Promise<UploadDto> {
  const jobId = ownerJob(deps, actor, fields.ownerType, fields.ownerId, "write");
  if (!file) throw badRequest("Attach a file in the 'file' field", { file: "No file attached" });
  if (file.size > MAX_PHOTO_MB * MB) throw photoTooLarge(file.size);
  const now = deps.now();
  const job = jobId === null ? undefined : deps.db.select({ createdAt: jobs.createdAt }).from(jobs).where(eq(jobs.id, jobId)).get();
  const takenAt = fields.at === undefined ? null : madeAt(fields.at, now, [{ time: job?.createdAt, what: "the job was created" }]);
  const stored = await storeFile(deps.uploadsDir, file, "photo");
  return keepStored(deps.uploadsDir, stored, () =>
    within(() => {
      const row = deps.db
        .insert(uploads)
        .values({
          ownerType: fields.ownerType,
          ownerId: fields.ownerId,
          jobId,
          kind: "photo",
          ...stored,
          caption: fields.caption ?? null,
          shareable: jobId !== null && (fields.shareable ?? false),
          light: fields.ownerType === "panel" ? (fields.light ?? null) : null,
          uploadedBy: actor.id,
          createdAt: now,
          takenAt,
        })
        .returning()
        .get()!;
      return toUploadDto({ ...row, uploadedByName: actor.name });
    }),
  );
}

export function photoTooLarge(size?: number) {
  const what = size ? `This photo is ${(size / MB).toFixed(1)} MB` : `This photo is over ${MAX_PHOTO_MB} MB`;
  return new HttpError(413, "payload_too_large", `${what}; photos are limited to ${MAX_PHOTO_MB} MB. Send a smaller photo (most phones and cameras can save a smaller size).`, {
    file: `Larger than ${MAX_PHOTO_MB} MB`,
  });
}

export function listUploads(deps: AppDeps, actor: Actor, q: ListUploadsQuery): UploadDto[] {
  const filters: (SQL | undefined)[] = [];
  if (q.ownerType !== undefined && q.ownerId !== undefined) {
    const jobId = ownerJob(deps, actor, q.ownerType, q.ownerId);
    if (q.jobId !== undefined && q.jobId !== jobId) return [];
    filters.push(eq(uploads.ownerType, q.ownerType), eq(uploads.ownerId, q.ownerId));
  } else if (q.jobId !== undefined) {
    findJobFor(deps, actor, q.jobId);
    filters.push(eq(uploads.jobId, q.jobId));
  }
  if (actor.role === "customer") filters.push(eq(uploads.shareable, true), eq(uploads.kind, "photo"));
  return selectUploads(deps, and(...filters));
}

/** The upload row if the actor may see it (anything else is "not found"), and for `write` may change it. */
function findUploadFor(deps: AppDeps, actor: Actor, id: number, mode: "read" | "write" = "read"): UploadRow {
  const row = deps.db.select().from(uploads).where(eq(uploads.id, id)).get();
  if (!row) throw notFound("File");
  const staffLibrary = row.ownerType === "panel" && actor.role !== "customer";
  if (staffLibrary) {
    // the panel library: any staff member looks; changes follow the panel's job
    if (mode === "write") checkPanelPhotoWrite(deps, actor, row.jobId);
  } else if (row.jobId !== null) {
    try {
      findJobFor(deps, actor, row.jobId);
    } catch {
      throw notFound("File");
    }
  } else if (actor.role === "customer") {
    throw notFound("File");
  }
  if (actor.role === "customer" && (!row.shareable || row.kind !== "photo")) throw notFound("File");
  return row;
}

export function readUpload(deps: AppDeps, actor: Actor, id: number, variant: "file" | "thumb") {
  const row = findUploadFor(deps, actor, id);
  const name = variant === "thumb" ? row.thumbName : row.storedName;
  if (!name) throw notFound(variant === "thumb" ? "Thumbnail" : "File");
  const data = readStored(deps.uploadsDir, name);
  if (!data) throw notFound("File");
  return { data, mime: variant === "thumb" ? "image/webp" : row.mime, name: row.originalName };
}

/** Photos are changed here; material data sheets only on the material's page. */
function checkWrite(row: UploadRow) {
  if (row.ownerType === "material") throw badRequest("Data sheets are managed on the material's page", { file: "A material data sheet" });
}

export function updateUpload(deps: AppDeps, actor: Actor, id: number, input: z.output<typeof updateUploadInputSchema>): UploadDto {
  const row = findUploadFor(deps, actor, id, "write");
  checkWrite(row);
  if (input.shareable && row.jobId === null) throw badRequest("Only photos of a customer's job can be shared", { shareable: "Not a job photo" });
  const dto = (r: typeof uploads.$inferSelect) => {
    const name = r.uploadedBy ? deps.db.select({ name: users.name }).from(users).where(eq(users.id, r.uploadedBy)).get()?.name : null;
    return toUploadDto({ ...r, uploadedByName: name ?? null });
  };
  const updated = deps.db
    .update(uploads)
    .set({
      ...(input.shareable !== undefined ? { shareable: input.shareable } : {}),
      ...(input.caption !== undefined ? { caption: input.caption } : {}),
      ...(input.light !== undefined && row.ownerType === "panel" ? { light: input.light } : {}),
      ...nextVersion(uploads, actor.id),
    })
    .where(and(eq(uploads.id, id), atVersion(uploads, input.version)))
    .returning()
    .get();
  if (!updated) {
    const now = deps.db.select().from(uploads).where(eq(uploads.id, id)).get()!;
    throw staleEdit(deps.db, "photo", dto(now), { updatedBy: now.updatedBy, updatedAt: null });
  }
  const by = updated.uploadedBy ? deps.db.select({ name: users.name }).from(users).where(eq(users.id, updated.uploadedBy)).get()?.name : null;
  return toUploadDto({ ...updated, uploadedByName: by ?? null });
}

/** The office removes any file; a painter only files they uploaded themselves. */
export function deleteUpload(deps: AppDeps, actor: Actor, id: number) {
  const row = findUploadFor(deps, actor, id, "write");
  checkWrite(row);
  if (actor.role === "painter" && row.uploadedBy !== actor.id) throw forbidden("Painters remove only the files they added; ask the office");
  deps.db.delete(uploads).where(eq(uploads.id, id)).run();
  removeStored(deps.uploadsDir, row.storedName, row.thumbName);
}

/** Removes the stored files and rows of every upload of an owner (when the owner itself is deleted). */
export function deleteUploadsOf(deps: AppDeps, ownerType: UploadOwnerType, ownerId: number) {
  const rows = deps.db.select().from(uploads).where(and(eq(uploads.ownerType, ownerType), eq(uploads.ownerId, ownerId))).all();
  if (!rows.length) return;
  deps.db.delete(uploads).where(and(eq(uploads.ownerType, ownerType), eq(uploads.ownerId, ownerId))).run();
  for (const r of rows) removeStored(deps.uploadsDir, r.storedName, r.thumbName);
}
