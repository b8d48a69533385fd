import { Router, type RequestHandler } from "express";
import multer from "multer";
import type { AppDeps } from "../../deps";
import { actorOf, allow } from "../../http/guard";
import { body, params, query } from "../../http/validate";
import { idParamsSchema } from "../../../shared/schemas/common.schema";
import {
  createUploadFieldsSchema,
  listUploadsQuerySchema,
  MAX_PHOTO_MB,
  updateUploadInputSchema,
} from "../../../shared/schemas/upload.schema";
import { uploadMiddleware } from "./storage";
import { acceptsFiles } from "../../http/media-type";
import { idempotent, withAnswer } from "../../http/idempotency";
import { createUpload, deleteUpload, listUploads, photoTooLarge, readUpload, updateUpload } from "./uploads.service";
import { sendFile } from "../../http/send-file";

/** Multer in memory, with the size limit answered as a 413 that says what the limits are. */
function receiveFile(): RequestHandler {
  const receive = uploadMiddleware(MAX_PHOTO_MB * 1024 * 1024);
  return acceptsFiles((req, res, next) => {
    receive(req, res, (err: unknown) => next(err instanceof multer.MulterError && err.code === "LIMIT_FILE_SIZE" ? photoTooLarge() : err));
  });
}

export function uploadsRouter(deps: AppDeps) {
  const r = Router();
  /** multipart/form-data: file, ownerType, ownerId, caption, shareable, light, at (when taken, from an offline tablet). Photos only (JPEG, PNG, WebP); takes an Idempotency-Key. */
  r.post("/", allow("staff"), receiveFile(), idempotent(deps), async (req, res) => {
    // The row and the key's answer are written together, once the file is on disk.
    res.status(201).json(await createUpload(deps, actorOf(res), body(req, createUploadFieldsSchema), req.file, (write) => withAnswer(deps, res, 201, write)));
  });
  r.get("/", allow("signedIn"), (req, res) => {
    res.json(listUploads(deps, actorOf(res), query(req, listUploadsQuerySchema)));
  });
  r.get("/:id", allow("signedIn"), (req, res) => {
    sendFile(res, { ...readUpload(deps, actorOf(res), params(req, idParamsSchema).id, "file"), disposition: "inline", kept: "stored" });
  });
  r.get("/:id/thumb", allow("signedIn"), (req, res) => {
    sendFile(res, { ...readUpload(deps, actorOf(res), params(req, idParamsSchema).id, "thumb"), disposition: "inline", kept: "stored" });
  });
  r.patch("/:id", allow("staff"), (req, res) => {
    res.json(updateUpload(deps, actorOf(res), params(req, idParamsSchema).id, body(req, updateUploadInputSchema)));
  });
  r.delete("/:id", allow("staff"), (req, res) => {
    deleteUpload(deps, actorOf(res), params(req, idParamsSchema).id);
    res.status(204).end();
  });
  return r;
}

