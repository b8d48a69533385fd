import { Router } from "express";
import { sql } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import { allow } from "../../http/guard";
import { APP_VERSION } from "../../version";
import type { HealthDto } from "../../../shared/schemas/health.schema";

/**
 * For the owner or a local monitor: is the database answering, which version runs, and how old the newest backup
 * is. Nothing secret: no paths, no settings, no counts of records.
 */
export function healthRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("public"), (_req, res) => {
    const row = deps.db.get<{ ok: number }>(sql`select 1 as ok`);
    const backups = deps.backups.status();
    const lastAt = backups.last ? Date.parse(backups.last.takenAt) : null;
    const body: HealthDto = {
      ok: row?.ok === 1,
      version: APP_VERSION,
      time: new Date(deps.now()).toISOString(),
      demoMode: deps.demoMode,
      lastBackupAt: backups.last?.takenAt ?? null,
      lastBackupAgeSeconds: lastAt === null ? null : Math.max(0, Math.round((deps.now() - lastAt) / 1000)),
      backupFailing: backups.lastFailure !== null,
    };
    res.json(body);
  });
  return r;
}
