import type Database from "better-sqlite3";
import type { Logger } from "../log/logger";
import { listBackups, pruneBackups, removePartials, type BackupInfo, type BackupKind } from "./backup-files";
import { takeBackup } from "./take-backup";

export type BackupSettings = {
  dir: string;
  /** Hours between scheduled backups (fractions allowed); 0 turns the schedule off. */
  everyHours: number;
  keep: number;
};

export type BackupStatus = {
  dir: string;
  everyHours: number;
  keep: number;
  running: boolean;
  count: number;
  last: { name: string; kind: BackupKind; takenAt: string; totalBytes: number; dbBytes: number; uploadFiles: number } | null;
  lastFailure: { at: string; message: string } | null;
  /** No backup for twice the interval (or never): something is wrong even if no failure was seen. */
  overdue: boolean;
  nextAt: string | null;
};

const HOUR = 3_600_000;
/** After a failure the next try comes sooner than a whole interval. */
const RETRY_MS = 15 * 60_000;
/** setTimeout's longest wait; a longer one wakes up early and waits again. */
const MAX_TIMER = 2 ** 31 - 1;

type Options = BackupSettings & { sqlite: Database.Database; uploadsDir: string; log: Logger; now: () => number };

/**
 * Takes backups on a schedule and on demand, one at a time, prunes old ones, and remembers the last failure so the
 * owner's dashboard can show it. The schedule counts from the newest backup on disk, so a server restarted every
 * night still backs up when one is due, and a fresh install takes its first backup as soon as it starts.
 */
export function createBackupService(options: Options) {
  const interval = options.everyHours * HOUR;
  let running: Promise<BackupInfo> | null = null;
  let lastFailure: { at: number; message: string } | null = null;
  let timer: NodeJS.Timeout | null = null;
  let nextAt: number | null = null;
  let stopped = true;

  const newestRegular = () => listBackups(options.dir).find((b) => b.kind !== "pre-migration") ?? null;

  function run(kind: BackupKind = "manual"): Promise<BackupInfo> {
    running ??= (async () => {
      try {
        const info = await takeBackup({ sqlite: options.sqlite, uploadsDir: options.uploadsDir, backupDir: options.dir, kind, now: options.now() });
        const pruned = pruneBackups(options.dir, options.keep);
        lastFailure = null;
        options.log.info({ backup: info.name, dbBytes: info.db.bytes, uploadFiles: info.uploads.files, uploadBytes: info.uploads.bytes, pruned }, "backup taken");
        return info;
      } catch (err) {
        const message = err instanceof Error ? err.message : String(err);
        lastFailure = { at: options.now(), message };
        options.log.error({ err, dir: options.dir }, "backup failed");
        throw err;
      } finally {
        running = null;
      }
    })();
    return running;
  }

  function schedule() {
    if (stopped || interval <= 0) return;
    const last = newestRegular();
    const due = lastFailure ? lastFailure.at + Math.min(interval, RETRY_MS) : last ? Date.parse(last.takenAt) + interval : options.now();
    nextAt = due;
    timer = setTimeout(tick, Math.min(MAX_TIMER, Math.max(0, due - options.now())));
    timer.unref();
  }

  async function tick() {
    timer = null;
    if (stopped) return;
    if (nextAt !== null && options.now() >= nextAt) await run("scheduled").catch(() => undefined);
    schedule();
  }

  return {
    settings: { dir: options.dir, everyHours: options.everyHours, keep: options.keep } satisfies BackupSettings,
    /** Starts the schedule (does nothing when it is off). */
    start() {
      stopped = false;
      removePartials(options.dir);
      schedule();
    },
    /** Stops the schedule and waits for a backup in progress to finish. */
    async stop() {
      stopped = true;
      if (timer) clearTimeout(timer);
      timer = null;
      nextAt = null;
      await running?.catch(() => undefined);
    },
    /** Takes a backup now (or joins the one running). */
    run,
    status(): BackupStatus {
      const all = listBackups(options.dir);
      const last = all[0] ?? null;
      const lastRegular = all.find((b) => b.kind !== "pre-migration");
      const age = lastRegular ? options.now() - Date.parse(lastRegular.takenAt) : Infinity;
      return {
        dir: options.dir,
        everyHours: options.everyHours,
        keep: options.keep,
        running: running !== null,
        count: all.length,
        last: last && { name: last.name, kind: last.kind, takenAt: last.takenAt, totalBytes: last.totalBytes, dbBytes: last.db.bytes, uploadFiles: last.uploads.files },
        lastFailure: lastFailure && { at: new Date(lastFailure.at).toISOString(), message: lastFailure.message },
        overdue: interval > 0 && age > 2 * interval,
        nextAt: nextAt === null ? null : new Date(nextAt).toISOString(),
      };
    },
  };
}
export type BackupService = ReturnType<typeof createBackupService>;
