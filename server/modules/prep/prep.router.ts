import { Router } from "express";
import type { AppDeps } from "../../deps";
import { actorOf, allow } from "../../http/guard";
import { body, params, query } from "../../http/validate";
import { idempotent, withAnswer } from "../../http/idempotency";
import { idParamsSchema } from "../../../shared/schemas/common.schema";
import {
  createPrepRecordInputSchema,
  listPrepRecordsQuerySchema,
  reopenPrepRecordInputSchema,
  signOffPrepRecordInputSchema,
  updatePrepRecordInputSchema,
} from "../../../shared/schemas/prep.schema";
import { createPrepRecord, getPrepRecord, jobPrep, reopenPrepRecord, signOffPrepRecord, updatePrepRecord } from "./prep.service";

/** Prep records: staff only (painters on their assigned jobs); customers never see the shop floor records. */
export function prepRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("staff"), (req, res) => {
    res.json(jobPrep(deps, actorOf(res), query(req, listPrepRecordsQuerySchema).jobId));
  });
  r.post("/", allow("staff"), (req, res) => {
    res.status(201).json(createPrepRecord(deps, actorOf(res), body(req, createPrepRecordInputSchema)));
  });
  r.get("/:id", allow("staff"), (req, res) => {
    res.json(getPrepRecord(deps, actorOf(res), params(req, idParamsSchema).id));
  });
  r.patch("/:id", allow("staff"), (req, res) => {
    res.json(updatePrepRecord(deps, actorOf(res), params(req, idParamsSchema).id, body(req, updatePrepRecordInputSchema)));
  });
  r.post("/:id/sign-off", allow("staff"), idempotent(deps), (req, res) => {
    const id = params(req, idParamsSchema).id;
    const input = body(req, signOffPrepRecordInputSchema);
    res.json(withAnswer(deps, res, 200, () => signOffPrepRecord(deps, actorOf(res), id, input)));
  });
  r.post("/:id/reopen", allow("office"), (req, res) => {
    res.json(reopenPrepRecord(deps, actorOf(res), params(req, idParamsSchema).id, body(req, reopenPrepRecordInputSchema)));
  });
  return r;
}
