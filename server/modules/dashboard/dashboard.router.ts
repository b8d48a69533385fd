import { Router } from "express";
import type { AppDeps } from "../../deps";
import { actorOf, allow } from "../../http/guard";
import { dashboard } from "./dashboard.service";

export function dashboardRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("office"), (_req, res) => {
    res.json(dashboard(deps, actorOf(res)));
  });
  return r;
}
