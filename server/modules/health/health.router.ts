import { Router } from "express";
import { sql } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import { allow } from "../../http/guard";

export function healthRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("public"), (_req, res) => {
    const row = deps.db.get<{ ok: number }>(sql`select 1 as ok`);
    res.json({ ok: row?.ok === 1, time: new Date(deps.now()).toISOString(), demoMode: deps.demoMode });
  });
  return r;
}
