import { Router } from "express";
import type { AppDeps } from "../../deps";
import { actorOf, allow } from "../../http/guard";
import { body, params, query } from "../../http/validate";
import { ctxOf } from "../../http/context";
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
import { MAX_DOCUMENT_BYTES, uploadMiddleware } from "../uploads/storage";
import { deleteFile, listFiles, readFile, uploadFile } from "./material-files.service";
import {
  createLot,
  createMaterial,
  deleteLot,
  deleteMaterial,
  getMaterial,
  listLots,
  listMaterials,
  lowStock,
  updateLot,
  updateMaterial,
} from "./materials.service";
import { sendFile } from "../../http/send-file";

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
    deleteMaterial(deps, ctxOf(req, res), params(req, idParamsSchema).id);
    res.status(204).end();
  });

  r.get("/:id/lots", allow("staff"), (req, res) => {
    res.json(listLots(deps, params(req, idParamsSchema).id));
  });
  r.post("/:id/lots", allow("office"), (req, res) => {
    res.status(201).json(createLot(deps, params(req, idParamsSchema).id, body(req, createLotInputSchema)));
  });
  r.patch("/:id/lots/:lotId", allow("office"), (req, res) => {
    const path = params(req, lotParamsSchema);
    res.json(updateLot(deps, actorOf(res).id, path.id, path.lotId, body(req, updateLotInputSchema)));
  });
  r.delete("/:id/lots/:lotId", allow("office"), (req, res) => {
    const path = params(req, lotParamsSchema);
    deleteLot(deps, path.id, path.lotId);
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
    const path = params(req, fileParamsSchema);
    sendFile(res, { ...readFile(deps, path.id, path.fileId), disposition: "inline", kept: "stored" });
  });
  r.delete("/:id/files/:fileId", allow("office"), (req, res) => {
    const path = params(req, fileParamsSchema);
    deleteFile(deps, path.id, path.fileId);
    res.status(204).end();
  });
  return r;
}
