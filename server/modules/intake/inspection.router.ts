import { Router } from "express";
import type { AppDeps } from "../../deps";
import { actorOf, allow } from "../../http/guard";
import { ctxOf } from "../../http/context";
import { body, params } from "../../http/validate";
import { idParamsSchema } from "../../../shared/schemas/common.schema";
import { addPrepLineInputSchema, saveInspectionInputSchema } from "../../../shared/schemas/inspection.schema";
import { addPrepLine, getInspection, saveInspection } from "./inspection.service";

/** The intake inspection of a job (under /api/jobs): the office's, before quoting. */
export function inspectionRouter(deps: AppDeps) {
  const r = Router();
  r.get("/:id/inspection", allow("office"), (req, res) => {
    res.json(getInspection(deps, actorOf(res), params(req, idParamsSchema).id));
  });
  r.put("/:id/inspection", allow("office"), (req, res) => {
    res.json(saveInspection(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, saveInspectionInputSchema)));
  });
  r.post("/:id/inspection/prep-line", allow("office"), (req, res) => {
    res.json(addPrepLine(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, addPrepLineInputSchema)));
  });
  return r;
}
