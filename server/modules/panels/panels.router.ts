import { Router } from "express";
import type { AppDeps } from "../../deps";
import { actorOf, allow } from "../../http/guard";
import { ctxOf } from "../../http/context";
import { body, params, query } from "../../http/validate";
import { idParamsSchema } from "../../../shared/schemas/common.schema";
import {
  comparePanelsQuerySchema,
  createPanelInputSchema,
  ladderQuerySchema,
  listPanelsQuerySchema,
  setApprovedPanelInputSchema,
  updatePanelInputSchema,
} from "../../../shared/schemas/panel.schema";
import { repeatPanel } from "../finish-record/repeat.service";
import { repeatFinishInputSchema } from "../../../shared/schemas/finish-record.schema";
import { comparePanels, createPanel, deletePanel, getPanel, jobColour, listPanels, panelLadder, setApprovedPanel, updatePanel } from "./panels.service";

/** The test-panel library: all staff read and add panels; the office removes them. */
export function panelsRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("staff"), (req, res) => {
    res.json(listPanels(deps, actorOf(res), query(req, listPanelsQuerySchema)));
  });
  r.get("/compare", allow("staff"), (req, res) => {
    res.json(comparePanels(deps, actorOf(res), query(req, comparePanelsQuerySchema).ids));
  });
  r.get("/ladder", allow("staff"), (req, res) => {
    res.json(panelLadder(deps, actorOf(res), query(req, ladderQuerySchema)));
  });
  r.post("/", allow("staff"), (req, res) => {
    res.status(201).json(createPanel(deps, actorOf(res), body(req, createPanelInputSchema)));
  });
  r.get("/:id", allow("staff"), (req, res) => {
    res.json(getPanel(deps, actorOf(res), params(req, idParamsSchema).id));
  });
  r.patch("/:id", allow("staff"), (req, res) => {
    res.json(updatePanel(deps, actorOf(res), params(req, idParamsSchema).id, body(req, updatePanelInputSchema)));
  });
  r.post("/:id/repeat", allow("office"), (req, res) => {
    res.status(201).json(repeatPanel(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, repeatFinishInputSchema)));
  });
  r.delete("/:id", allow("office"), (req, res) => {
    deletePanel(deps, actorOf(res), params(req, idParamsSchema).id);
    res.status(204).end();
  });
  return r;
}

/** A job's agreed colour (under /api/jobs): anyone who reaches the job reads it; the office sets it. */
export function jobColourRouter(deps: AppDeps) {
  const r = Router();
  r.get("/:id/colour", allow("signedIn"), (req, res) => {
    res.json(jobColour(deps, actorOf(res), params(req, idParamsSchema).id));
  });
  r.put("/:id/approved-panel", allow("office"), (req, res) => {
    res.json(setApprovedPanel(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, setApprovedPanelInputSchema).panelId));
  });
  return r;
}
