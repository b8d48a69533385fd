import { sql } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import { APP_VERSION } from "../../version";
import type { HealthDto } from "../../../shared/schemas/health.schema";

/**
 * Is the database answering, which version runs, and how old the newest backup is. Nothing secret: no paths, no
 * settings, no counts of records.
 */
export function health(deps: AppDeps): HealthDto {
  const row = deps.db.get<{ ok: number }>(sql`select 1 as ok`);
  const backups = deps.backups.status();
  const lastAt = backups.last ? Date.parse(backups.last.takenAt) : null;
  return {
    ok: row?.ok === 1,
    version: APP_VERSION,
    time: new Date(deps.now()).toISOString(),
    demoMode: deps.demoMode,
    lastBackupAt: backups.last?.takenAt ?? null,
    lastBackupAgeSeconds: lastAt === null ? null : Math.max(0, Math.round((deps.now() - lastAt) / 1000)),
    backupFailing: backups.lastFailure !== null,
  };
}
