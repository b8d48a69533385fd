import { Router } from "express";
import type { AppDeps } from "../../deps";
import { actorOf, allow } from "../../http/guard";
import { body, params, query } from "../../http/validate";
import { ctxOf } from "../../http/context";
import { idParamsSchema } from "../../../shared/schemas/common.schema";
import {
  createMixSheetInputSchema,
  listMixSheetsQuerySchema,
  recordMixSheetInputSchema,
  voidMixSheetInputSchema,
} from "../../../shared/schemas/mix-sheet.schema";
import { createMixSheet, deleteDraft, getMixSheet, listMixSheets, recordMixSheet, voidMixSheet } from "./mix-sheets.service";

/**
 * Mix sheets for the layers of a job's plan. Staff only; painters reach the sheets of their assigned jobs
 * and never see a cost. Recorded sheets are never edited, only voided with a reason.
 */
export function mixSheetsRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("staff"), (req, res) => {
    res.json(listMixSheets(deps, actorOf(res), query(req, listMixSheetsQuerySchema)));
  });
  r.post("/", allow("staff"), (req, res) => {
    res.status(201).json(createMixSheet(deps, ctxOf(req, res), body(req, createMixSheetInputSchema)));
  });
  r.get("/:id", allow("staff"), (req, res) => {
    res.json(getMixSheet(deps, actorOf(res), params(req, idParamsSchema).id));
  });
  r.delete("/:id", allow("staff"), (req, res) => {
    deleteDraft(deps, actorOf(res), params(req, idParamsSchema).id);
    res.status(204).end();
  });
  r.post("/:id/record", allow("staff"), (req, res) => {
    res.json(recordMixSheet(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, recordMixSheetInputSchema)));
  });
  r.post("/:id/void", allow("staff"), (req, res) => {
    res.json(voidMixSheet(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, voidMixSheetInputSchema).reason));
  });
  return r;
}
