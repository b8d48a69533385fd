import Database from "better-sqlite3";
import { copyFileSync, existsSync, mkdirSync, renameSync, rmSync, statSync } from "node:fs";
import path from "node:path";
import { DB_FILE, MANIFEST_FILE, readBackup, type BackupInfo } from "./backup-files";
import { copyFiles, filesUnder } from "./copy-files";
import { checkIntegrity } from "./take-backup";

export type ResolvedBackup = { dbPath: string; uploadsPath: string | null; info: BackupInfo | null };

/**
 * What `npm run restore -- <backup>` may name: a backup folder, the coatwright.db inside one, a backup's name in
 * BACKUP_DIR, or a lone database file from `npm run backup -- <file>` (which brings back the database only).
 */
export function resolveBackup(arg: string, backupDir: string): ResolvedBackup {
  const candidates = [path.resolve(arg), path.join(backupDir, arg)];
  for (const c of candidates) {
    if (!existsSync(c)) continue;
    const folder = statSync(c).isDirectory() ? c : path.basename(c) === DB_FILE && existsSync(path.join(path.dirname(c), MANIFEST_FILE)) ? path.dirname(c) : null;
    if (folder) {
      const info = readBackup(folder);
      if (!info) throw new Error(`${folder} is not a complete backup (no ${MANIFEST_FILE} or no database in it)`);
      return { dbPath: info.dbPath, uploadsPath: info.uploadsPath, info };
    }
    return { dbPath: c, uploadsPath: null, info: null };
  }
  throw new Error(`No backup at ${arg} (looked in the current folder and in ${backupDir})`);
}

/** In WAL mode only exclusive locking fails while another connection (a running server) has the file open. */
function assertNotInUse(dbFile: string) {
  if (!existsSync(dbFile)) return;
  const live = new Database(dbFile, { timeout: 0 });
  try {
    live.pragma("locking_mode = EXCLUSIVE");
    live.exec("BEGIN EXCLUSIVE; COMMIT;");
  } catch {
    throw new Error("The database is in use; stop the server before restoring");
  } finally {
    live.close();
  }
}

const moveIfThere = (from: string, to: string) => {
  if (!existsSync(from)) return false;
  mkdirSync(path.dirname(to), { recursive: true });
  renameSync(from, to);
  return true;
};

/**
 * Puts a backup back: the database and, for a backup folder, the uploads. Nothing is touched until the backup has
 * passed SQLite's integrity check and its uploads are all there. The data it replaces is moved aside (not deleted)
 * into DATA_DIR/replaced-<time>/, so a restore of the wrong backup can itself be undone. The server must be stopped.
 */
export function restoreBackup(backup: ResolvedBackup, target: { dbFile: string; uploadsDir: string; now?: number }) {
  try {
    checkIntegrity(backup.dbPath);
  } catch (err) {
    throw new Error(`The backup is damaged (${(err as Error).message}); nothing was restored`, { cause: err });
  }
  if (backup.uploadsPath && backup.info) {
    const found = filesUnder(backup.uploadsPath).length;
    if (found !== backup.info.uploads.files)
      throw new Error(`The backup's uploads folder holds ${found} files but ${backup.info.uploads.files} were backed up; nothing was restored`);
  }
  assertNotInUse(target.dbFile);

  // Stage the copies next to their destinations (same file system), then swap them in with renames.
  const stagedDb = `${target.dbFile}.restoring`;
  const stagedUploads = `${target.uploadsDir}.restoring`;
  rmSync(stagedDb, { force: true });
  rmSync(stagedUploads, { recursive: true, force: true });
  mkdirSync(path.dirname(target.dbFile), { recursive: true });
  copyFileSync(backup.dbPath, stagedDb);
  if (backup.uploadsPath) copyFiles(backup.uploadsPath, stagedUploads, null);

  const stamp = new Date(target.now ?? Date.now()).toISOString().replace(/[:.]/g, "-");
  const aside = path.join(path.dirname(target.dbFile), `replaced-${stamp}`);
  let movedAside = false;
  for (const suffix of ["", "-wal", "-shm"]) movedAside = moveIfThere(target.dbFile + suffix, path.join(aside, path.basename(target.dbFile) + suffix)) || movedAside;
  if (backup.uploadsPath) movedAside = moveIfThere(target.uploadsDir, path.join(aside, path.basename(target.uploadsDir))) || movedAside;
  renameSync(stagedDb, target.dbFile);
  if (backup.uploadsPath) renameSync(stagedUploads, target.uploadsDir);
  return { restoredUploads: backup.uploadsPath !== null, setAside: movedAside ? aside : null };
}
