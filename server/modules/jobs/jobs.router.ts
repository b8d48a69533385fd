import { Router } from "express";
import type { AppDeps } from "../../deps";
import { actorOf, allow } from "../../http/guard";
import { body, params, query } from "../../http/validate";
import { idParamsSchema } from "../../../shared/schemas/common.schema";
import {
  changeStageInputSchema,
  createJobInputSchema,
  listJobsQuerySchema,
  updateJobInputSchema,
} from "../../../shared/schemas/job.schema";
import { createJobItemInputSchema, jobItemParamsSchema, updateJobItemInputSchema } from "../../../shared/schemas/job-item.schema";
import { changeStage, createJob, deleteJob, getJob, jobBoard, listJobs, updateJob } from "./jobs.service";
import { createItem, deleteItem, getItem, listItems, updateItem } from "./job-items.service";

export function jobsRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("signedIn"), (req, res) => {
    res.json(listJobs(deps, actorOf(res), query(req, listJobsQuerySchema)));
  });
  r.get("/board", allow("staff"), (_req, res) => {
    res.json(jobBoard(deps, actorOf(res)));
  });
  r.post("/", allow("office"), (req, res) => {
    res.status(201).json(createJob(deps, actorOf(res), body(req, createJobInputSchema)));
  });
  r.get("/:id", allow("signedIn"), (req, res) => {
    res.json(getJob(deps, actorOf(res), params(req, idParamsSchema).id));
  });
  r.patch("/:id", allow("office"), (req, res) => {
    res.json(updateJob(deps, actorOf(res), params(req, idParamsSchema).id, body(req, updateJobInputSchema)));
  });
  r.delete("/:id", allow("office"), (req, res) => {
    deleteJob(deps, actorOf(res), params(req, idParamsSchema).id);
    res.status(204).end();
  });
  r.post("/:id/stage", allow("staff"), (req, res) => {
    res.json(changeStage(deps, actorOf(res), params(req, idParamsSchema).id, body(req, changeStageInputSchema)));
  });

  r.get("/:id/items", allow("signedIn"), (req, res) => {
    res.json(listItems(deps, actorOf(res), params(req, idParamsSchema).id));
  });
  r.post("/:id/items", allow("office"), (req, res) => {
    res.status(201).json(createItem(deps, actorOf(res), params(req, idParamsSchema).id, body(req, createJobItemInputSchema)));
  });
  r.get("/:id/items/:itemId", allow("signedIn"), (req, res) => {
    const path = params(req, jobItemParamsSchema);
    res.json(getItem(deps, actorOf(res), path.id, path.itemId));
  });
  r.patch("/:id/items/:itemId", allow("office"), (req, res) => {
    const path = params(req, jobItemParamsSchema);
    res.json(updateItem(deps, actorOf(res), path.id, path.itemId, body(req, updateJobItemInputSchema)));
  });
  r.delete("/:id/items/:itemId", allow("office"), (req, res) => {
    const path = params(req, jobItemParamsSchema);
    deleteItem(deps, actorOf(res), path.id, path.itemId);
    res.status(204).end();
  });
  return r;
}
