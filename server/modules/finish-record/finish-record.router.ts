import { Router } from "express";
import type { AppDeps } from "../../deps";
import { actorOf, allow } from "../../http/guard";
import { body, params } from "../../http/validate";
import { ctxOf } from "../../http/context";
import { repeatFinishInputSchema } from "../../../shared/schemas/finish-record.schema";
import { repeatJob } from "./repeat.service";
import { idParamsSchema } from "../../../shared/schemas/common.schema";
import { getSettings } from "../settings/settings.service";
import { finishRecord } from "./finish-record.service";
import { renderFinishRecordPdf } from "./finish-record-pdf";
import { sendFile } from "../../http/send-file";

/** A job's finish record (under /api/jobs): staff who reach the job, and the job's own customer (their version). */
export function finishRecordRouter(deps: AppDeps) {
  const r = Router();
  r.get("/:id/finish-record", allow("signedIn"), (req, res) => {
    res.json(finishRecord(deps, actorOf(res), params(req, idParamsSchema).id));
  });
  r.get("/:id/finish-record.pdf", allow("signedIn"), async (req, res) => {
    const record = finishRecord(deps, actorOf(res), params(req, idParamsSchema).id);
    const pdf = await renderFinishRecordPdf(record, getSettings(deps).shopName);
    sendFile(res, { data: pdf, mime: "application/pdf", name: `finish-record-job-${record.job.id}.pdf`, disposition: "inline", kept: "generated" });
  });
  r.post("/:id/repeat", allow("office"), (req, res) => {
    res.status(201).json(repeatJob(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, repeatFinishInputSchema)));
  });
  return r;
}
