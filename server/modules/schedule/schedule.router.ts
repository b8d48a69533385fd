import { Router } from "express";
import { z } from "zod";
import type { AppDeps } from "../../deps";
import { actorOf, allow } from "../../http/guard";
import { ctxOf } from "../../http/context";
import { body, params, query } from "../../http/validate";
import { idParamsSchema, idSchema } from "../../../shared/schemas/common.schema";
import {
  acceptSuggestionInputSchema,
  boothInputSchema,
  prepPlanInputSchema,
  scheduleQuerySchema,
  sessionInputSchema,
  suggestInputSchema,
  updateBoothInputSchema,
  updateSessionInputSchema,
} from "../../../shared/schemas/schedule.schema";
import { createBooth, listBooths, updateBooth } from "./booths.service";
import { acceptSuggestion, createSession, deleteSession, getSchedule, listSchedulableJobs, setPrepPlan, suggest, updateSession } from "./schedule.service";

/** The shop's booths: every staff member sees them; the owner keeps them. */
export function boothsRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("staff"), (_req, res) => {
    res.json(listBooths(deps));
  });
  r.post("/", allow("owner"), (req, res) => {
    res.status(201).json(createBooth(deps, ctxOf(req, res), body(req, boothInputSchema)));
  });
  r.patch("/:id", allow("owner"), (req, res) => {
    res.json(updateBooth(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, updateBoothInputSchema)));
  });
  return r;
}

/** Booth time: staff read it (a painter their own jobs'), the office plans it. */
export function scheduleRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("staff"), (req, res) => {
    const q = query(req, scheduleQuerySchema);
    res.json(getSchedule(deps, actorOf(res), Date.parse(q.from), Date.parse(q.to)));
  });
  r.get("/jobs", allow("office"), (_req, res) => {
    res.json(listSchedulableJobs(deps));
  });
  r.put("/jobs/:jobId/prep", allow("office"), (req, res) => {
    const { jobId } = params(req, z.object({ jobId: idSchema }));
    res.json(setPrepPlan(deps, ctxOf(req, res), jobId, body(req, prepPlanInputSchema)));
  });
  r.post("/sessions", allow("office"), (req, res) => {
    res.status(201).json(createSession(deps, ctxOf(req, res), body(req, sessionInputSchema)));
  });
  r.patch("/sessions/:id", allow("office"), (req, res) => {
    res.json(updateSession(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, updateSessionInputSchema)));
  });
  r.delete("/sessions/:id", allow("office"), (req, res) => {
    deleteSession(deps, params(req, idParamsSchema).id);
    res.status(204).end();
  });
  r.post("/suggest", allow("office"), (req, res) => {
    res.json(suggest(deps, body(req, suggestInputSchema)));
  });
  r.post("/accept", allow("office"), (req, res) => {
    res.json(acceptSuggestion(deps, ctxOf(req, res), body(req, acceptSuggestionInputSchema)));
  });
  return r;
}
