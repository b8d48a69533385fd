import { Router } from "express";
import type { AppDeps } from "../../deps";
import { allow } from "../../http/guard";
import { query } from "../../http/validate";
import { listAuditQuerySchema } from "../../../shared/schemas/audit.schema";
import { listAudit } from "./audit.service";

/** Read-only: the audit trail has no route that changes or deletes it. */
export function auditRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("owner"), (req, res) => {
    res.json(listAudit(deps, query(req, listAuditQuerySchema)));
  });
  return r;
}
