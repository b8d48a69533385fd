import { statfsSync } from "node:fs";
import type { AppDeps } from "../../deps";
import { getSettings } from "../settings/settings.service";
import type { DashboardSystemDto } from "../../../shared/schemas/dashboard.schema";

const GB = 1e9;

/** Free and total bytes of the file system holding `dir`, as an ordinary user may use them (like `df`). */
export function diskSpace(dir: string): { freeBytes: number; sizeBytes: number } | null {
  try {
    const fs = statfsSync(dir);
    return { freeBytes: fs.bavail * fs.bsize, sizeBytes: fs.blocks * fs.bsize };
  } catch {
    return null;
  }
}

/** The last backup, any backup failure, and the free space in DATA_DIR against the shop's warning threshold. */
export function systemPart(deps: AppDeps): DashboardSystemDto {
  const b = deps.backups.status();
  const space = diskSpace(deps.dataDir);
  const warnBelowBytes = Math.round(getSettings(deps).lowDiskWarningGb * GB);
  return {
    backups: {
      dir: b.dir,
      everyHours: b.everyHours,
      keep: b.keep,
      count: b.count,
      last: b.last && { name: b.last.name, takenAt: b.last.takenAt, sizeBytes: b.last.totalBytes, uploadFiles: b.last.uploadFiles },
      lastFailure: b.lastFailure,
      overdue: b.overdue,
    },
    disk: space && { dataDir: deps.dataDir, ...space, warnBelowBytes, low: space.freeBytes < warnBelowBytes },
  };
}
