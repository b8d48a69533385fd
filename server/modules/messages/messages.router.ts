import { Router } from "express";
import type { AppDeps } from "../../deps";
import { actorOf, allow } from "../../http/guard";
import { body, query } from "../../http/validate";
import { listMessagesQuerySchema, readyNoticeInputSchema } from "../../../shared/schemas/message.schema";
import { listMessages, sendReadyNotice } from "./messages.service";

/** The e-mails sent to customers about their jobs (office only: they carry prices). */
export function messagesRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("office"), (req, res) => {
    res.json({ items: listMessages(deps, query(req, listMessagesQuerySchema).jobId) });
  });
  r.post("/ready-notice", allow("office"), async (req, res) => {
    res.status(201).json(await sendReadyNotice(deps, actorOf(res).id, body(req, readyNoticeInputSchema).jobId));
  });
  return r;
}
