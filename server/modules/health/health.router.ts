import { Router } from "express";
import type { AppDeps } from "../../deps";
import { allow } from "../../http/guard";
import { health } from "./health.service";

/** For the owner or a local monitor: see health.service. */
export function healthRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("public"), (_req, res) => {
    res.json(health(deps));
  });
  return r;
}
