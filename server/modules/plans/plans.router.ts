import { Router } from "express";
import type { AppDeps } from "../../deps";
import { actorOf, allow } from "../../http/guard";
import { body, params, query } from "../../http/validate";
import { ctxOf } from "../../http/context";
import { idParamsSchema } from "../../../shared/schemas/common.schema";
import {
  copyAsTemplateInputSchema,
  listPlansQuerySchema,
  planDocumentSchema,
  savePlanInputSchema,
  startJobPlanInputSchema,
  versionParamsSchema,
} from "../../../shared/schemas/plan.schema";
import { copyAsTemplate, createTemplate, deletePlan, getJobPlan, getPlan, getVersion, listPlans, listVersions, savePlan, startJobPlan } from "./plans.service";
import { estimateFor } from "./plan-estimate.service";

/**
 * Finish plans and templates. Staff read (painters: templates and the plans of their assigned jobs, without
 * costs); the office writes. Every write is audited (kind "plan").
 */
export function plansRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("staff"), (req, res) => {
    res.json(listPlans(deps, actorOf(res), query(req, listPlansQuerySchema)));
  });
  r.post("/", allow("office"), (req, res) => {
    res.status(201).json(createTemplate(deps, ctxOf(req, res), body(req, planDocumentSchema)));
  });
  r.get("/:id", allow("staff"), (req, res) => {
    res.json(getPlan(deps, actorOf(res), params(req, idParamsSchema).id));
  });
  r.put("/:id", allow("office"), (req, res) => {
    res.json(savePlan(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, savePlanInputSchema)));
  });
  r.delete("/:id", allow("office"), (req, res) => {
    deletePlan(deps, ctxOf(req, res), params(req, idParamsSchema).id);
    res.status(204).end();
  });
  r.post("/:id/copy-as-template", allow("office"), (req, res) => {
    res.status(201).json(copyAsTemplate(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, copyAsTemplateInputSchema).name));
  });
  r.get("/:id/versions", allow("staff"), (req, res) => {
    res.json(listVersions(deps, actorOf(res), params(req, idParamsSchema).id));
  });
  r.get("/:id/versions/:versionId", allow("staff"), (req, res) => {
    const path = params(req, versionParamsSchema);
    res.json(getVersion(deps, actorOf(res), path.id, path.versionId));
  });
  return r;
}

/** A job's finish plan: /api/jobs/:id/plan (mounted beside the jobs router). */
export function jobPlanRouter(deps: AppDeps) {
  const r = Router();
  r.get("/:id/plan", allow("staff"), (req, res) => {
    const id = params(req, idParamsSchema).id;
    const actor = actorOf(res);
    const plan = getJobPlan(deps, actor, id);
    res.json({ plan, estimate: plan ? estimateFor(deps, actor, id) : null });
  });
  r.post("/:id/plan", allow("office"), (req, res) => {
    res.status(201).json(startJobPlan(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, startJobPlanInputSchema)));
  });
  return r;
}
