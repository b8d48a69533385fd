import { Router } from "express";
import type { AppDeps } from "../../deps";
import { actorOf, allow } from "../../http/guard";
import { ctxOf } from "../../http/context";
import { body, query } from "../../http/validate";
import { createSolventUseInputSchema, listSolventUsesQuerySchema } from "../../../shared/schemas/solvent-use.schema";
import { listSolventUses, logSolventUse } from "./solvent-uses.service";

/** Prep and cleaning solvent used outside a batch: logged by the booth, counted in the VOC log. */
export function solventUsesRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("staff"), (req, res) => {
    res.json(listSolventUses(deps, actorOf(res), query(req, listSolventUsesQuerySchema)));
  });
  r.post("/", allow("staff"), (req, res) => {
    res.status(201).json(logSolventUse(deps, ctxOf(req, res), body(req, createSolventUseInputSchema)));
  });
  return r;
}
