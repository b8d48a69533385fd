import Database from "better-sqlite3";
import { existsSync, mkdirSync, renameSync, rmSync, statfsSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import { APP_VERSION } from "../version";
import { backupName, DB_FILE, listBackups, MANIFEST_FILE, partialPath, readBackup, UPLOADS_DIR, type BackupInfo, type BackupKind, type BackupManifest } from "./backup-files";
import { bytesToCopy, copyFiles } from "./copy-files";

export type TakeBackupOptions = {
  /** The live connection; SQLite's online backup reads through it, so writes go on while it runs. */
  sqlite: Database.Database;
  uploadsDir: string;
  backupDir: string;
  kind: BackupKind;
  now?: number;
  /** Check first that the backup fits (default on); off only to test what a disk filling up mid-copy does. */
  checkRoom?: boolean;
};

const MB = 1_000_000;
/** A backup never takes the last of the disk the live data is on: the shop's own writes come first. */
export const RESERVE_BYTES = 64 * MB;

/**
 * Refuses before writing anything when the backup would not fit: the database's size plus the uploads the previous
 * backup does not already hold, with a margin, and on the data's own disk the reserve left over as well.
 */
function assertRoom(options: TakeBackupOptions, previousUploads: string | null) {
  const dbBytes = (options.sqlite.pragma("page_count", { simple: true }) as number) * (options.sqlite.pragma("page_size", { simple: true }) as number);
  const needed = Math.ceil((dbBytes + bytesToCopy(options.uploadsDir, previousUploads)) * 1.05) + MB;
  const fs = statfsSync(options.backupDir);
  const free = fs.bavail * fs.bsize;
  const dataDir = path.dirname(options.uploadsDir);
  const sameDisk = existsSync(dataDir) && statSync(dataDir).dev === statSync(options.backupDir).dev;
  const reserve = sameDisk ? RESERVE_BYTES : 0;
  if (needed + reserve > free) {
    throw new Error(
      `Not enough room for a backup in ${options.backupDir}: it needs about ${Math.ceil(needed / MB)} MB and ${Math.floor(free / MB)} MB is free` +
        (sameDisk ? ` (a backup never takes the last ${RESERVE_BYTES / MB} MB of the disk the shop's data is on)` : ""),
    );
  }
}

/** Opens a copied database read-only and runs SQLite's own check over every page; throws unless it says "ok". */
export function checkIntegrity(dbFile: string): { migrations: number } {
  const copy = new Database(dbFile, { readonly: true, fileMustExist: true });
  try {
    const check = copy.pragma("integrity_check", { simple: true });
    if (check !== "ok") throw new Error(`the copy failed SQLite's integrity check (${String(check)})`);
    const hasJournal = copy.prepare("select 1 from sqlite_master where type = 'table' and name = '__drizzle_migrations'").get();
    const migrations = hasJournal ? (copy.prepare("select count(*) as n from __drizzle_migrations").get() as { n: number }).n : 0;
    return { migrations };
  } finally {
    copy.close();
  }
}

/**
 * One backup: the database through SQLite's online backup API, checked with `PRAGMA integrity_check`, then the
 * uploads folder copied beside it. The database goes first, so every upload the copied records point at is
 * already on disk when the folder is copied. Nothing is written when it would not fit (see assertRoom). Written as a
 * `.partial` folder and renamed when complete; on any failure (a disk filling up, an unwritable folder) the partial
 * folder is removed and the error thrown.
 */
export async function takeBackup(options: TakeBackupOptions): Promise<BackupInfo> {
  const at = options.now ?? Date.now();
  const name = backupName(at, options.kind);
  mkdirSync(options.backupDir, { recursive: true });
  const previous = listBackups(options.backupDir)[0] ?? null;
  if (options.checkRoom !== false) assertRoom(options, previous?.uploadsPath ?? null);
  const work = partialPath(options.backupDir, name);
  rmSync(work, { recursive: true, force: true });
  mkdirSync(work);
  try {
    const dbFile = path.join(work, DB_FILE);
    await options.sqlite.backup(dbFile);
    const { migrations } = checkIntegrity(dbFile);
    const uploads = copyFiles(options.uploadsDir, path.join(work, UPLOADS_DIR), previous?.uploadsPath ?? null);
    const manifest: BackupManifest = {
      format: 1,
      kind: options.kind,
      takenAt: new Date(at).toISOString(),
      appVersion: APP_VERSION,
      migrations,
      db: { file: DB_FILE, bytes: statSync(dbFile).size, integrity: "ok" },
      uploads: { files: uploads.files, bytes: uploads.bytes },
    };
    writeFileSync(path.join(work, MANIFEST_FILE), JSON.stringify(manifest, null, 2) + "\n");
    const final = path.join(options.backupDir, name);
    renameSync(work, final);
    const info = readBackup(final);
    if (!info) throw new Error("the finished backup could not be read back");
    return info;
  } catch (err) {
    rmSync(work, { recursive: true, force: true });
    throw err;
  }
}
