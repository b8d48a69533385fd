import { Router } from "express";
import type { AppDeps } from "../../deps";
import { actorOf, allow } from "../../http/guard";
import { ctxOf } from "../../http/context";
import { idempotent, withAnswer } from "../../http/idempotency";
import { body, params, query } from "../../http/validate";
import { idParamsSchema } from "../../../shared/schemas/common.schema";
import { correctCoatLogInputSchema, createCoatLogInputSchema, listCoatLogsQuerySchema } from "../../../shared/schemas/booth.schema";
import { correctCoatLog, getBooth, listCoatLogs, logCoat } from "./booth.service";
import { jobTicket } from "./job-ticket";

/** The booth card and the job ticket, under /api/jobs. Staff only; painters reach their assigned jobs. */
export function boothRouter(deps: AppDeps) {
  const r = Router();
  r.get("/:id/booth", allow("staff"), (req, res) => {
    res.json(getBooth(deps, actorOf(res), params(req, idParamsSchema).id));
  });
  r.get("/:id/ticket", allow("staff"), async (req, res) => {
    res.json(await jobTicket(deps, actorOf(res), params(req, idParamsSchema).id));
  });
  return r;
}

/**
 * Coat logs: append-only. A tap adds a coat; a correction is a new entry naming the one it corrects. Both take an
 * `Idempotency-Key` (the tablet's offline queue sends each entry with its own).
 */
export function coatLogsRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("staff"), (req, res) => {
    res.json(listCoatLogs(deps, actorOf(res), query(req, listCoatLogsQuerySchema).jobId));
  });
  r.post("/", allow("staff"), idempotent(deps), (req, res) => {
    const input = body(req, createCoatLogInputSchema);
    res.status(201).json(withAnswer(deps, res, 201, () => logCoat(deps, ctxOf(req, res), input)));
  });
  r.post("/:id/corrections", allow("staff"), idempotent(deps), (req, res) => {
    const id = params(req, idParamsSchema).id;
    const input = body(req, correctCoatLogInputSchema);
    res.status(201).json(withAnswer(deps, res, 201, () => correctCoatLog(deps, ctxOf(req, res), id, input)));
  });
  return r;
}
