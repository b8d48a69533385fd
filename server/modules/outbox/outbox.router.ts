import { Router } from "express";
import { z } from "zod";
import type { AppDeps } from "../../deps";
import { allow } from "../../http/guard";
import { notFound } from "../../http/http-error";
import { params } from "../../http/validate";
import { readOutbox, readOutboxAttachment } from "../../stand-ins/smtp-outbox";
import { fromDigits } from "../../../shared/schemas/common.schema";
import { sendFile } from "../../http/send-file";

/** The local SMTP stand-in's outbox, readable by the owner in demo mode only. */
export function outboxRouter(deps: AppDeps) {
  const r = Router();
  const requireDemo = () => {
    if (!deps.demoMode || !deps.outboxDir) throw notFound("Outbox (only in demo mode)");
    return deps.outboxDir;
  };
  r.get("/", allow("owner"), (_req, res) => {
    res.json({ items: readOutbox(requireDemo()) });
  });
  r.get("/:id/attachments/:index", allow("owner"), (req, res) => {
    const path = params(req, z.object({ id: z.string().regex(/^[a-z0-9-]+$/), index: z.preprocess(fromDigits, z.number().int().min(0)) }));
    const dir = requireDemo();
    const message = readOutbox(dir).find((m) => m.id === path.id);
    const meta = message?.attachments[path.index];
    const content = readOutboxAttachment(dir, path.id, path.index);
    if (!meta || !content) throw notFound("Attachment");
    sendFile(res, { data: content, mime: meta.contentType, name: meta.filename, disposition: "attachment", kept: "generated" });
  });
  return r;
}
