import { Router } from "express";
import type { AppDeps } from "../../deps";
import { actorOf, allow } from "../../http/guard";
import { body, params, query } from "../../http/validate";
import { ctxOf } from "../../http/context";
import { notFound } from "../../http/http-error";
import { idParamsSchema } from "../../../shared/schemas/common.schema";
import {
  createLotInputSchema,
  createMaterialInputSchema,
  fileParamsSchema,
  listMaterialsQuerySchema,
  lotParamsSchema,
  updateLotInputSchema,
  updateMaterialInputSchema,
  uploadMaterialFileInputSchema,
} from "../../../shared/schemas/material.schema";
import { MAX_DOCUMENT_BYTES, readStored, removeStored, uploadMiddleware } from "../uploads/storage";
import {
  createLot,
  createMaterial,
  deleteFile,
  deleteLot,
  deleteMaterial,
  findFile,
  getMaterial,
  listFiles,
  listLots,
  listMaterials,
  lowStock,
  updateLot,
  updateMaterial,
  uploadFile,
} from "./materials.service";

/**
 * The materials catalogue. Every staff member reads it (painters without any cost field); the office edits it.
 * Data sheets (technical and safety) are PDFs or images, checked by content, served only to signed-in staff.
 */
export function materialsRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("staff"), (req, res) => {
    res.json(listMaterials(deps, actorOf(res), query(req, listMaterialsQuerySchema)));
  });
  r.get("/low-stock", allow("staff"), (_req, res) => {
    res.json(lowStock(deps, actorOf(res)));
  });
  r.post("/", allow("office"), (req, res) => {
    res.status(201).json(createMaterial(deps, ctxOf(req, res), body(req, createMaterialInputSchema)));
  });
  r.get("/:id", allow("staff"), (req, res) => {
    res.json(getMaterial(deps, actorOf(res), params(req, idParamsSchema).id));
  });
  r.patch("/:id", allow("office"), (req, res) => {
    res.json(updateMaterial(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, updateMaterialInputSchema)));
  });
  r.delete("/:id", allow("office"), (req, res) => {
    const { storedNames } = deleteMaterial(deps, ctxOf(req, res), params(req, idParamsSchema).id);
    removeStored(deps.uploadsDir, ...storedNames);
    res.status(204).end();
  });

  r.get("/:id/lots", allow("staff"), (req, res) => {
    res.json(listLots(deps, params(req, idParamsSchema).id));
  });
  r.post("/:id/lots", allow("office"), (req, res) => {
    res.status(201).json(createLot(deps, params(req, idParamsSchema).id, body(req, createLotInputSchema)));
  });
  r.patch("/:id/lots/:lotId", allow("office"), (req, res) => {
    const p = params(req, lotParamsSchema);
    res.json(updateLot(deps, actorOf(res).id, p.id, p.lotId, body(req, updateLotInputSchema)));
  });
  r.delete("/:id/lots/:lotId", allow("office"), (req, res) => {
    const p = params(req, lotParamsSchema);
    deleteLot(deps, p.id, p.lotId);
    res.status(204).end();
  });

  r.get("/:id/files", allow("staff"), (req, res) => {
    res.json(listFiles(deps, params(req, idParamsSchema).id));
  });
  r.post("/:id/files", allow("office"), uploadMiddleware(MAX_DOCUMENT_BYTES), async (req, res) => {
    const id = params(req, idParamsSchema).id;
    const { kind } = body(req, uploadMaterialFileInputSchema);
    res.status(201).json(await uploadFile(deps, actorOf(res), id, kind, req.file));
  });
  r.get("/:id/files/:fileId", allow("staff"), (req, res) => {
    const p = params(req, fileParamsSchema);
    const file = findFile(deps, p.id, p.fileId);
    const data = readStored(deps.uploadsDir, file.storedName);
    if (!data) throw notFound("File");
    res.setHeader("Content-Type", file.mime);
    res.setHeader("Content-Disposition", `inline; filename="${file.originalName.replace(/"/g, "")}"`);
    res.setHeader("Cache-Control", "private, max-age=300");
    res.send(data);
  });
  r.delete("/:id/files/:fileId", allow("office"), (req, res) => {
    const p = params(req, fileParamsSchema);
    const file = deleteFile(deps, p.id, p.fileId);
    removeStored(deps.uploadsDir, file.storedName, file.thumbName);
    res.status(204).end();
  });
  return r;
}
