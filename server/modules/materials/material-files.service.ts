import { and, asc, eq } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import type { Actor } from "../../auth/session";
import { uploads, users } from "../../db/schema";
import { notFound } from "../../http/http-error";
import { iso } from "../../http/dates";
import { keepStored, readStored, removeStored, storeFile } from "../uploads/storage";
import { findMaterial } from "./materials.access";
import type { MaterialFileDto, MaterialFileKind } from "../../../shared/schemas/material.schema";

/** A material's documents: data sheets and safety data sheets, checked by content and stored like other uploads. */
export function listFiles(deps: AppDeps, materialId: number): MaterialFileDto[] {
  findMaterial(deps, materialId);
  return deps.db
    .select({ u: uploads, by: users.name })
    .from(uploads)
    .leftJoin(users, eq(uploads.uploadedBy, users.id))
    .where(and(eq(uploads.ownerType, "material"), eq(uploads.ownerId, materialId)))
    .orderBy(asc(uploads.kind), asc(uploads.id))
    .all()
    .map(({ u, by }) => ({
      id: u.id,
      kind: u.kind as MaterialFileKind,
      mime: u.mime,
      size: u.size,
      originalName: u.originalName,
      createdAt: iso(u.createdAt),
      uploadedByName: by,
    }));
}

export function addFile(
  deps: AppDeps,
  actor: Actor,
  materialId: number,
  kind: MaterialFileKind,
  stored: { mime: string; size: number; originalName: string; storedName: string; thumbName: string | null; width: number | null; height: number | null },
): MaterialFileDto {
  findMaterial(deps, materialId);
  const row = deps.db
    .insert(uploads)
    .values({ ownerType: "material", ownerId: materialId, kind, ...stored, uploadedBy: actor.id, createdAt: deps.now() })
    .returning()
    .get();
  return { id: row.id, kind, mime: row.mime, size: row.size, originalName: row.originalName, createdAt: iso(row.createdAt), uploadedByName: actor.name };
}

/** Checks a data sheet (or safety sheet) by its content, stores it and records it on the material: all or nothing. */
export async function uploadFile(deps: AppDeps, actor: Actor, materialId: number, kind: MaterialFileKind, file: Express.Multer.File | undefined): Promise<MaterialFileDto> {
  findMaterial(deps, materialId);
  const stored = await storeFile(deps.uploadsDir, file, "document");
  return keepStored(deps.uploadsDir, stored, () => addFile(deps, actor, materialId, kind, stored));
}

function findFile(deps: AppDeps, materialId: number, fileId: number) {
  findMaterial(deps, materialId);
  const row = deps.db
    .select()
    .from(uploads)
    .where(and(eq(uploads.id, fileId), eq(uploads.ownerType, "material"), eq(uploads.ownerId, materialId)))
    .get();
  if (!row) throw notFound("File");
  return row;
}

/** The stored document, ready to send. */
export function readFile(deps: AppDeps, materialId: number, fileId: number) {
  const file = findFile(deps, materialId, fileId);
  const data = readStored(deps.uploadsDir, file.storedName);
  if (!data) throw notFound("File");
  return { data, mime: file.mime, name: file.originalName };
}

/** Removes the document's record, then its stored file. */
export function deleteFile(deps: AppDeps, materialId: number, fileId: number) {
  const row = findFile(deps, materialId, fileId);
  deps.db.delete(uploads).where(eq(uploads.id, fileId)).run();
  removeStored(deps.uploadsDir, row.storedName, row.thumbName);
}
