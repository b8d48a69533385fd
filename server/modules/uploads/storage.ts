import { mkdirSync, readFileSync, writeFileSync, unlinkSync, existsSync } from "node:fs";
import path from "node:path";
import { randomBytes } from "node:crypto";
import multer from "multer";
import type { RequestHandler } from "express";
import sharp, { type OutputInfo } from "sharp";
import { fileTypeFromBuffer } from "file-type";
import { HttpError, isStorageFull, storageFull } from "../../http/http-error";
import { acceptsFiles } from "../../http/media-type";

export const MAX_DOCUMENT_BYTES = 20 * 1024 * 1024;

const IMAGE_TYPES = ["image/jpeg", "image/png", "image/webp"] as const;
const DOCUMENT_TYPES = ["application/pdf", ...IMAGE_TYPES] as const;

/** Multer keeping the file in memory (checked by content before anything touches the disk). */
export function uploadMiddleware(maxBytes: number, field = "file"): RequestHandler {
  const receive = multer({ storage: multer.memoryStorage(), limits: { fileSize: maxBytes, files: 1, fields: 20 } }).single(field);
  return acceptsFiles((req, res, next) =>
    receive(req, res, (err: unknown) => {
      // Files are kept in memory, so any other error here is the multipart parser's (no boundary, cut-off body,
      // malformed part): the client's request is at fault, 400. Multer's own limit errors go on as they are.
      if (err instanceof Error && !(err instanceof multer.MulterError) && !(err instanceof HttpError))
        return next(new HttpError(400, "bad_request", `The upload could not be read: ${err.message}. Send the file as multipart/form-data.`, { [field]: err.message }));
      next(err);
    }));
}

export type StoredFile = {
  mime: string;
  size: number;
  originalName: string;
  storedName: string;
  thumbName: string | null;
  width: number | null;
  height: number | null;
};

const unsupported = (message: string) => new HttpError(415, "unsupported_media_type", message, { file: message });

/**
 * Checks a file by its content (never its name), and writes it under `dir` with a random name.
 * Photos are re-encoded: EXIF (camera, GPS) is dropped, orientation applied, and a 400 px WebP thumbnail made.
 * `accept` = "photo" (JPEG, PNG, WebP) or "document" (PDF or those images).
 */
export async function storeFile(dir: string, file: Express.Multer.File | undefined, accept: "photo" | "document"): Promise<StoredFile> {
  if (!file) throw new HttpError(400, "validation_failed", "Attach a file in the 'file' field", { file: "No file attached" });
  const detected = await fileTypeFromBuffer(file.buffer);
  const allowed: readonly string[] = accept === "photo" ? IMAGE_TYPES : DOCUMENT_TYPES;
  if (detected?.mime === "image/heic" || detected?.mime === "image/heif") {
    throw unsupported("HEIC photos cannot be read here; set the camera to save JPEG (\"most compatible\") and upload again");
  }
  if (!detected || !allowed.includes(detected.mime)) {
    const what = accept === "photo" ? "a JPEG, PNG or WebP photo" : "a PDF or a JPEG, PNG or WebP image";
    throw unsupported(`The file's content is not ${what}${detected ? ` (it looks like ${detected.mime})` : ""}`);
  }
  const base = randomBytes(16).toString("hex");
  const storedName = `${base}.${detected.ext}`;
  const originalName = safeName(file.originalname);
  if (detected.mime === "application/pdf") {
    writeAll(dir, [[storedName, file.buffer]]);
    return { mime: detected.mime, size: file.size, originalName, storedName, thumbName: null, width: null, height: null };
  }
  let clean: { data: Buffer; info: OutputInfo };
  let thumb: Buffer;
  try {
    clean = await sharp(file.buffer, { failOn: "error" }).rotate().toBuffer({ resolveWithObject: true });
    thumb = await sharp(clean.data).resize(400, 400, { fit: "inside", withoutEnlargement: true }).webp({ quality: 78 }).toBuffer();
  } catch {
    throw unsupported("The image could not be read; it may be damaged");
  }
  const thumbName = `${base}.thumb.webp`;
  writeAll(dir, [
    [storedName, clean.data],
    [thumbName, thumb],
  ]);
  return { mime: detected.mime, size: clean.data.length, originalName, storedName, thumbName, width: clean.info.width, height: clean.info.height };
}

/** Writes every file or none: when one write fails (a full disk), what was written is removed again. */
function writeAll(dir: string, files: [name: string, data: Buffer][]) {
  const written: string[] = [];
  try {
    mkdirSync(dir, { recursive: true });
    for (const [name, data] of files) {
      written.push(name);
      writeFileSync(path.join(dir, name), data);
    }
  } catch (err) {
    removeStored(dir, ...written);
    throw isStorageFull(err) ? storageFull() : err;
  }
}

/**
 * Records a stored file in the database with `record`; if that fails (a full disk, a record that is gone), the
 * file is removed again, so no file is left that nothing points to.
 */
export function keepStored<T>(dir: string, stored: StoredFile, record: () => T): T {
  try {
    return record();
  } catch (err) {
    removeStored(dir, stored.storedName, stored.thumbName);
    throw err;
  }
}

export function readStored(dir: string, name: string): Buffer | null {
  if (!/^[a-f0-9]{32}(\.thumb)?\.[a-z0-9]+$/.test(name)) return null;
  const p = path.join(dir, name);
  return existsSync(p) ? readFileSync(p) : null;
}

export function removeStored(dir: string, ...names: (string | null)[]) {
  for (const n of names) if (n && /^[a-f0-9]{32}/.test(n)) { try { unlinkSync(path.join(dir, n)); } catch { /* already gone */ } }
}

function safeName(name: string) {
  return (name || "file").replace(/[^\w.\- ]+/g, "_").slice(0, 120);
}
